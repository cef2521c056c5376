// Pins the default noise-floor factor into a new time-domain step, so the stored recipe alone fixes the coverage.
import { NOISE_FLOOR_FACTOR_DEFAULT, type TimeDomainStep } from '../../schema/recipe.js';

export interface PinNoiseFloorOptions {
  /** The factor k pinned when the step has none. @default NOISE_FLOOR_FACTOR_DEFAULT (3) */
  factor?: number;
}

/**
 * The step with `noiseFloorFactor` set to `factor` when the key is absent; a step that names a factor, or null (the
 * test turned off), is returned as it is. Called for new adds and matches only: stored recipes are never re-pinned,
 * so revisions written before the default keep their coverage.
 */
export function pinNoiseFloor(step: TimeDomainStep, options: PinNoiseFloorOptions = {}): TimeDomainStep {
  if (step.noiseFloorFactor !== undefined) return step;
  return { ...step, noiseFloorFactor: options.factor ?? NOISE_FLOOR_FACTOR_DEFAULT };
}

// The resolution a spectrum is compared at under a recipe: a resolution step's target is a floor.
import type { Recipe } from '../schema/recipe.js';

/** Resolutions within this fraction of the finer one count as equal (like with like is then not needed). */
export const LIKE_RESOLUTION_TOLERANCE = 0.25;

/**
 * `own` (cm⁻¹) as the recipe leaves it: a recipe with a resolution step brings a sharper spectrum to its target
 * and keeps a coarser one, so the result is max(own, target); without a step it is `own`.
 */
export function comparedResolution(own: number, recipe: Recipe): number {
  const step = recipe.resolution;
  return step === undefined || step === null ? own : Math.max(own, step.target);
}

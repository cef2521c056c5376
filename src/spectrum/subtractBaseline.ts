// Applies the recipe's baseline step: estimates the baseline by the chosen method and subtracts it.
import type { BaselineStep } from '../schema/recipe.js';
import { airplsBaseline } from './airplsBaseline.js';
import { alsBaseline } from './alsBaseline.js';
import { rubberbandBaseline } from './rubberbandBaseline.js';
import type { Spectrum } from './types.js';

export interface SubtractBaselineOptions {
  /**
   * Point spacing in cm⁻¹: when given, ALS/airPLS λ are read in wavenumber units (recipe version 2) and
   * rescaled to it; when absent, per point (version 1).
   * @default undefined
   */
  spacing?: number;
  /**
   * The file the spectrum came from, for error messages.
   * @default undefined
   */
  file?: string;
}

/** A new spectrum, absorbance minus the baseline of `step.method` (`none` returns a copy); the input is untouched. */
export function subtractBaseline(
  spectrum: Spectrum,
  step: BaselineStep,
  options: SubtractBaselineOptions = {},
): Spectrum {
  const y = spectrum.absorbance;
  const file = options.file;
  const spacing = options.spacing;
  let baseline: Float64Array | undefined;
  switch (step.method) {
    case 'none':
      break;
    case 'rubberband':
      baseline = rubberbandBaseline(spectrum, { file });
      break;
    case 'als':
      baseline = alsBaseline(spectrum, {
        lambda: step.lambda,
        p: step.p,
        iterations: step.iterations,
        spacing,
        file,
      });
      break;
    case 'airpls':
      baseline = airplsBaseline(spectrum, {
        lambda: step.lambda,
        iterations: step.iterations,
        spacing,
        file,
      });
      break;
  }
  const corrected = new Float64Array(y.length);
  for (let i = 0; i < y.length; i++) corrected[i] = y[i]! - (baseline ? baseline[i]! : 0);
  return { wavenumber: spectrum.wavenumber.slice(), absorbance: corrected };
}

// Signal-to-noise of a spectrum: its absorbance range over the noise in a band-free window.
import type { WavenumberWindow } from '../schema/recipe.js';
import { finiteRange } from './finiteRange.js';
import { noiseLevel } from './noiseLevel.js';
import type { Spectrum } from './types.js';

export interface EstimateSnrOptions {
  /**
   * Band-free window for the noise (RMS after a linear detrend; common practice for biological samples).
   * @default { min: 1900, max: 2000 }
   */
  window?: WavenumberWindow;
  /**
   * The spectrum whose range is the signal, when it differs from the one the noise is read from (e.g. the
   * baseline-corrected spectrum, so a sloping baseline does not count as signal).
   * @default the spectrum itself
   */
  signal?: Spectrum;
}

export interface SnrEstimate {
  /** RMS noise in absorbance units; NaN when the window holds too few points. */
  noise: number;
  /** max − min of the signal's finite absorbances. */
  range: number;
  /** range / noise; NaN without a noise estimate, Infinity for noise-free data. */
  snr: number;
}

/** SNR = (max − min) / noise, the noise from noiseLevel inside `window`. */
export function estimateSnr(spectrum: Spectrum, options: EstimateSnrOptions = {}): SnrEstimate {
  const noise = noiseLevel(spectrum, options.window ?? { min: 1900, max: 2000 });
  const { min, max } = finiteRange((options.signal ?? spectrum).absorbance);
  const range = max >= min ? max - min : 0;
  let snr = Number.NaN;
  if (Number.isFinite(noise)) snr = noise > 0 ? range / noise : Number.POSITIVE_INFINITY;
  return { noise, range, snr };
}

// The wavenumber span a spectrum's data actually cover, optionally inside a crop window.
import type { WavenumberWindow } from '../schema/recipe.js';
import type { Spectrum } from '../spectrum/types.js';

export interface SpectrumExtentOptions {
  /**
   * Only points inside this window count (a recipe's crop); null counts every point.
   * @default null
   */
  crop?: WavenumberWindow | null;
}

/** Lowest and highest wavenumber with a finite absorbance (inside `crop`), or null when fewer than two differ. */
export function spectrumExtent(
  spectrum: Spectrum,
  options: SpectrumExtentOptions = {},
): WavenumberWindow | null {
  const crop = options.crop ?? null;
  const lo = crop === null ? Number.NEGATIVE_INFINITY : Math.min(crop.min, crop.max);
  const hi = crop === null ? Number.POSITIVE_INFINITY : Math.max(crop.min, crop.max);
  const x = spectrum.wavenumber;
  const y = spectrum.absorbance;
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < x.length; i++) {
    const v = x[i]!;
    if (!Number.isFinite(v) || !Number.isFinite(y[i]!) || v < lo || v > hi) continue;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return max > min ? { min, max } : null;
}

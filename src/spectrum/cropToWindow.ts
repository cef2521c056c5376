// Recipe step: keeps only the points of a spectrum inside one wavenumber window.
import { BandshelfError } from '../error.js';
import type { WavenumberWindow } from '../schema/recipe.js';
import type { Spectrum } from './types.js';

export interface CropToWindowOptions {
  /**
   * The file the spectrum came from, named in any error.
   * @default undefined
   */
  file?: string;
}

/**
 * Returns a new spectrum holding the points with `min ≤ wavenumber ≤ max` (both ends kept). A `null` window
 * keeps everything (still a copy, so callers may treat the result as their own). Fewer than two points left
 * is TOO_FEW_POINTS: a crop that misses the data is a recipe that does not fit this spectrum.
 */
export function cropToWindow(
  spectrum: Spectrum,
  window: WavenumberWindow | null,
  options: CropToWindowOptions = {},
): Spectrum {
  const { wavenumber: x, absorbance: y } = spectrum;
  if (window === null) return { wavenumber: x.slice(), absorbance: y.slice() };
  // Tolerate a window given high → low, as spectroscopists often write them.
  const lo = Math.min(window.min, window.max);
  const hi = Math.max(window.min, window.max);
  const n = x.length;
  const outX = new Float64Array(n);
  const outY = new Float64Array(n);
  let m = 0;
  for (let i = 0; i < n; i++) {
    const xi = x[i]!;
    if (xi >= lo && xi <= hi) {
      outX[m] = xi;
      outY[m] = y[i]!;
      m++;
    }
  }
  if (m < 2) {
    throw new BandshelfError(
      'TOO_FEW_POINTS',
      `cropping to ${lo}–${hi} cm⁻¹ leaves ${m} point${m === 1 ? '' : 's'}; a spectrum needs at least 2`,
      { ...(options.file === undefined ? {} : { file: options.file }), field: 'crop' },
    );
  }
  return { wavenumber: outX.slice(0, m), absorbance: outY.slice(0, m) };
}

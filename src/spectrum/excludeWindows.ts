// Recipe step: drops the points of a spectrum that fall in any exclusion window (atmospheric CO₂ by default).
import { BandshelfError } from '../error.js';
import type { WavenumberWindow } from '../schema/recipe.js';
import type { Spectrum } from './types.js';

export interface ExcludeWindowsOptions {
  /**
   * The file the spectrum came from, named in any error.
   * @default undefined
   */
  file?: string;
}

/**
 * Returns a new spectrum without the points inside any window (`min ≤ wavenumber ≤ max`, both ends
 * dropped). The points are removed rather than zeroed so later steps (baseline, smoothing, resampling) see a
 * gap and never treat the excluded stretch as data. Fewer than two points left is TOO_FEW_POINTS.
 */
export function excludeWindows(
  spectrum: Spectrum,
  windows: readonly WavenumberWindow[],
  options: ExcludeWindowsOptions = {},
): Spectrum {
  const { wavenumber: x, absorbance: y } = spectrum;
  const k = windows.length;
  const lo = new Float64Array(k);
  const hi = new Float64Array(k);
  for (let w = 0; w < k; w++) {
    const win = windows[w]!;
    lo[w] = Math.min(win.min, win.max);
    hi[w] = Math.max(win.min, win.max);
  }
  const n = x.length;
  const outX = new Float64Array(n);
  const outY = new Float64Array(n);
  let m = 0;
  for (let i = 0; i < n; i++) {
    const xi = x[i]!;
    let inside = false;
    for (let w = 0; w < k; w++) {
      if (xi >= lo[w]! && xi <= hi[w]!) {
        inside = true;
        break;
      }
    }
    if (!inside) {
      outX[m] = xi;
      outY[m] = y[i]!;
      m++;
    }
  }
  if (m < 2) {
    throw new BandshelfError(
      'TOO_FEW_POINTS',
      `the exclusion windows leave ${m} point${m === 1 ? '' : 's'}; a spectrum needs at least 2`,
      { ...(options.file === undefined ? {} : { file: options.file }), field: 'exclude' },
    );
  }
  return { wavenumber: outX.slice(0, m), absorbance: outY.slice(0, m) };
}

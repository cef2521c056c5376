// First recipe step: puts a parsed spectrum in ascending wavenumber order and merges repeated points.
import { BandshelfError } from '../error.js';
import type { Spectrum } from './types.js';

export interface SortAndMergeOptions {
  /**
   * The file the spectrum came from, named in any error.
   * @default undefined
   */
  file?: string;
  /**
   * Called once, with the number of wavenumbers whose differing readings were averaged, when there are any.
   * @default undefined
   */
  onAveraged?: (count: number) => void;
}

/**
 * Returns a new spectrum with strictly ascending wavenumbers. Repeated wavenumbers are merged into one point with
 * the mean of their absorbances (identical values, as in files that repeat the last point of one data line on the
 * next, stay as they are; different readings are averaged, the usual practice; `onAveraged` hears how many). The
 * readers already average and warn with line numbers, so a file's spectrum arrives here without repeats.
 * Non-finite values give NOT_FINITE and fewer than two distinct points TOO_FEW_POINTS.
 */
export function sortAndMerge(spectrum: Spectrum, options: SortAndMergeOptions = {}): Spectrum {
  const { wavenumber: x, absorbance: y } = spectrum;
  const file = options.file;
  const n = x.length;
  if (y.length !== n) {
    throw new BandshelfError(
      'BAD_FORMAT',
      `wavenumber and absorbance differ in length (${n} and ${y.length})`,
      file === undefined ? {} : { file },
    );
  }
  for (let i = 0; i < n; i++) {
    const xi = x[i]!;
    const yi = y[i]!;
    if (!Number.isFinite(xi) || !Number.isFinite(yi)) {
      const field = Number.isFinite(xi) ? 'absorbance' : 'wavenumber';
      throw new BandshelfError(
        'NOT_FINITE',
        `point ${i + 1} has a non-finite ${field} (${field === 'wavenumber' ? xi : yi})`,
        {
          ...(file === undefined ? {} : { file }),
          field,
        },
      );
    }
  }

  let ascending = true;
  let descending = true;
  for (let i = 1; i < n; i++) {
    const d = x[i]! - x[i - 1]!;
    if (d <= 0) ascending = false;
    if (d >= 0) descending = false;
  }

  let order: Uint32Array;
  if (ascending) {
    order = Uint32Array.from({ length: n }, (_, i) => i);
  } else if (descending) {
    order = Uint32Array.from({ length: n }, (_, i) => n - 1 - i);
  } else {
    order = Uint32Array.from({ length: n }, (_, i) => i);
    // Ties broken by original index keep the sort stable, so the merge below sees duplicates in file order.
    order.sort((a, b) => x[a]! - x[b]! || a - b);
  }

  const outX = new Float64Array(n);
  const outY = new Float64Array(n);
  let m = 0;
  let averaged = 0;
  for (let k = 0; k < n; ) {
    const xi = x[order[k]!]!;
    let end = k + 1;
    let sum = y[order[k]!]!;
    let differs = false;
    while (end < n && x[order[end]!]! === xi) {
      const yr = y[order[end]!]!;
      if (yr !== y[order[k]!]!) differs = true;
      sum += yr;
      end++;
    }
    outX[m] = xi;
    outY[m] = differs ? sum / (end - k) : y[order[k]!]!;
    if (differs) averaged++;
    m++;
    k = end;
  }
  if (averaged > 0) options.onAveraged?.(averaged);
  if (m < 2) {
    throw new BandshelfError(
      'TOO_FEW_POINTS',
      `a spectrum needs at least 2 distinct points, this one has ${m}`,
      file === undefined ? {} : { file },
    );
  }
  return { wavenumber: outX.slice(0, m), absorbance: outY.slice(0, m) };
}

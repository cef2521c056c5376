// Pearson correlation of two vectors on the same grid, over the points both cover.
import { BandshelfError } from '../error.js';

export interface CorrelationOptions {
  /**
   * Fewest points both vectors must cover; with fewer the result is NaN (two points always correlate ±1).
   * @default 3
   */
  minOverlap?: number;
}

/**
 * Pearson's r over the indices where both `a` and `b` are finite, so NaN (not covered) in either is simply
 * left out and partial-coverage spectra compare on their overlap. NaN when the overlap is below
 * `minOverlap` or either vector is constant over it (r is undefined, and 0 would claim "unrelated").
 * Two passes (means, then centred sums) keep the result accurate for vectors with a large offset.
 */
export function correlation(a: Float64Array, b: Float64Array, options: CorrelationOptions = {}): number {
  const n = a.length;
  if (b.length !== n) {
    throw new BandshelfError(
      'BAD_FORMAT',
      `cannot correlate vectors of ${n} and ${b.length} values: they are not on the same grid`,
    );
  }
  const minOverlap = options.minOverlap ?? 3;
  let count = 0;
  let sa = 0;
  let sb = 0;
  for (let i = 0; i < n; i++) {
    const ai = a[i]!;
    const bi = b[i]!;
    if (!Number.isFinite(ai) || !Number.isFinite(bi)) continue;
    count++;
    sa += ai;
    sb += bi;
  }
  if (count < Math.max(2, minOverlap)) return Number.NaN;
  const ma = sa / count;
  const mb = sb / count;
  let saa = 0;
  let sbb = 0;
  let sab = 0;
  for (let i = 0; i < n; i++) {
    const ai = a[i]!;
    const bi = b[i]!;
    if (!Number.isFinite(ai) || !Number.isFinite(bi)) continue;
    const da = ai - ma;
    const db = bi - mb;
    saa += da * da;
    sbb += db * db;
    sab += da * db;
  }
  if (!(saa > 0) || !(sbb > 0)) return Number.NaN;
  // Rounding can push |r| a hair past 1 for identical vectors; clamp so callers can rely on the range.
  return Math.max(-1, Math.min(1, sab / Math.sqrt(saa * sbb)));
}

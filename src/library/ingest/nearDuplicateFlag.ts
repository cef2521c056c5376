// The one QC flag only the library can raise: a processed vector almost identical to another current entry's.
import { correlation } from '../../spectrum/correlation.js';
import type { QcFlag } from '../../spectrum/types.js';

/** Processed vectors of the current entries, kept in memory across one `add` so each file is compared once. */
export interface NearDuplicatePool {
  ids: string[];
  /** Float32 rows are views into a search-set matrix; they are widened one at a time for the comparison. */
  rows: (Float64Array | Float32Array)[];
}

export interface NearDuplicateFlagOptions {
  /** An entry is never its own near-duplicate (its older revision is about to be superseded).
   * @default undefined */
  exclude?: string;
  /** Pearson correlation above which two entries count as near-duplicates.
   * @default 0.999 */
  threshold?: number;
  /** The grid's wavenumbers (cm⁻¹), one per vector point, to name where the difference spectrum peaks.
   * @default undefined (the difference's largest band is given by its size only) */
  wavenumber?: ArrayLike<number>;
}

/**
 * The difference spectrum a − s·b (s the least-squares scale of b on a, with an offset, over the points both
 * cover) at its largest |value|: its position (index) and its size as a fraction of a's largest band (its range,
 * highest minus lowest point). A real added component (a drug in a serum film) shows as a band here even at r = 0.9997.
 */
function largestDifference(a: Float64Array, b: Float64Array): { index: number; fraction: number } | null {
  let n = 0;
  let ma = 0;
  let mb = 0;
  for (let i = 0; i < a.length; i++) {
    if (!(Number.isFinite(a[i]!) && Number.isFinite(b[i]!))) continue;
    n++;
    ma += a[i]!;
    mb += b[i]!;
  }
  if (n < 3) return null;
  ma /= n;
  mb /= n;
  let ab = 0;
  let bb = 0;
  for (let i = 0; i < a.length; i++) {
    if (!(Number.isFinite(a[i]!) && Number.isFinite(b[i]!))) continue;
    ab += (a[i]! - ma) * (b[i]! - mb);
    bb += (b[i]! - mb) ** 2;
  }
  const scale = bb > 0 ? ab / bb : 0;
  let index = -1;
  let largest = 0;
  let high = Number.NEGATIVE_INFINITY;
  let low = Number.POSITIVE_INFINITY;
  for (let i = 0; i < a.length; i++) {
    if (!(Number.isFinite(a[i]!) && Number.isFinite(b[i]!))) continue;
    const d = Math.abs(a[i]! - ma - scale * (b[i]! - mb));
    high = Math.max(high, a[i]!);
    low = Math.min(low, a[i]!);
    if (d > largest) {
      largest = d;
      index = i;
    }
  }
  const peak = high - low;
  return index < 0 || !(peak > 0) ? null : { index, fraction: largest / peak };
}

/**
 * A warning (never an error) when the processed vector correlates above `threshold` with another entry's; the
 * message names that entry, r and the largest band of the difference spectrum (where, and its size against the
 * largest band), so two spectra that differ by one real component are seen not to be duplicates.
 */
export function nearDuplicateFlag(
  processed: Float64Array,
  pool: NearDuplicatePool,
  options: NearDuplicateFlagOptions = {},
): QcFlag | null {
  const threshold = options.threshold ?? 0.999;
  let best = Number.NEGATIVE_INFINITY;
  let bestId: string | undefined;
  const scratch = new Float64Array(processed.length);
  let bestRow: Float64Array | null = null;
  for (let i = 0; i < pool.ids.length; i++) {
    const id = pool.ids[i]!;
    if (id === options.exclude) continue;
    const row = pool.rows[i]!;
    let other: Float64Array;
    if (row instanceof Float64Array) other = row;
    else {
      scratch.set(row);
      other = scratch;
    }
    const r = correlation(processed, other);
    if (Number.isFinite(r) && r > best) {
      best = r;
      bestId = id;
      bestRow = other === scratch ? scratch.slice() : other;
    }
  }
  if (bestId === undefined || bestRow === null || !(best > threshold)) return null;
  const difference = largestDifference(processed, bestRow);
  const x = difference === null ? undefined : options.wavenumber?.[difference.index];
  const where =
    difference === null
      ? ''
      : `; the difference spectrum's largest band is ${(100 * difference.fraction).toPrecision(2)} % of the largest band` +
        (x === undefined ? '' : `, at ${x.toFixed(0)} cm⁻¹`) +
        ' (a real extra component shows here; compare the two before treating them as duplicates)';
  return {
    code: 'near-duplicate',
    level: 'warning',
    message: `processed spectrum correlates ${best.toFixed(5)} with entry '${bestId}'${where}`,
    value: best,
  };
}

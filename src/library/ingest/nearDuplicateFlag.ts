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
}

export function nearDuplicateFlag(
  processed: Float64Array,
  pool: NearDuplicatePool,
  options: NearDuplicateFlagOptions = {},
): QcFlag | null {
  const threshold = options.threshold ?? 0.999;
  let best = Number.NEGATIVE_INFINITY;
  let bestId: string | undefined;
  const scratch = new Float64Array(processed.length);
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
    }
  }
  if (bestId === undefined || !(best > threshold)) return null;
  return {
    code: 'near-duplicate',
    level: 'warning',
    message: `processed spectrum correlates ${best.toFixed(5)} with entry '${bestId}'`,
    value: best,
  };
}

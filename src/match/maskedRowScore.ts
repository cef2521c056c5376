// Exact correlation of one reference row with a query over the points both cover inside a mask (double precision).

export interface MaskedRowScoreOptions {
  /**
   * `centred` gives Pearson's r, `unit` the cosine of the uncentred vectors.
   * @default 'centred'
   */
  centring?: 'centred' | 'unit';
  /**
   * Grid step, cm⁻¹, for the overlap.
   * @default 1
   */
  step?: number;
  /**
   * Where the row starts inside `row` (a whole matrix may be passed).
   * @default 0
   */
  rowOffset?: number;
}

export interface MaskedRowScore {
  /** r or cosine; NaN when fewer than 3 points are shared or either vector is flat over them. */
  score: number;
  /** Shared points. */
  points: number;
  /** Wavenumber range of the shared points, cm⁻¹ (see coveredSpan). */
  overlap: number;
}

/**
 * The slow, exact path for rows that cover only part of the query's mask (and the reference the fast kernels are
 * tested against). Two passes, means then centred sums, keep it accurate for vectors with a large offset.
 * `row` and `query` are read from `rowOffset` and 0 for `mask.length` values.
 */
export function maskedRowScore(
  row: ArrayLike<number>,
  query: ArrayLike<number>,
  mask: Uint8Array,
  options: MaskedRowScoreOptions = {},
): MaskedRowScore {
  const centred = (options.centring ?? 'centred') === 'centred';
  const step = options.step ?? 1;
  const offset = options.rowOffset ?? 0;
  const n = mask.length;
  let points = 0;
  let pairs = 0;
  let previous = false;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    const x = row[offset + i]!;
    const y = query[i]!;
    const shared = mask[i] !== 0 && Number.isFinite(x) && Number.isFinite(y);
    if (shared) {
      points++;
      sx += x;
      sy += y;
      if (previous) pairs++;
    }
    previous = shared;
  }
  const overlap = pairs * step;
  if (points < 3) return { score: Number.NaN, points, overlap };
  const mx = centred ? sx / points : 0;
  const my = centred ? sy / points : 0;
  let sxx = 0;
  let syy = 0;
  let sxy = 0;
  let px = 0;
  let py = 0;
  for (let i = 0; i < n; i++) {
    if (mask[i] === 0) continue;
    const x = row[offset + i]!;
    const y = query[i]!;
    if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
    const dx = x - mx;
    const dy = y - my;
    sxx += dx * dx;
    syy += dy * dy;
    sxy += dx * dy;
    px += x * x;
    py += y * y;
  }
  // Flat relative to its power: a constant vector leaves only rounding after centring.
  if (!(sxx > 1e-20 * px) || !(syy > 1e-20 * py)) return { score: Number.NaN, points, overlap };
  const score = Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy)));
  return { score, points, overlap };
}

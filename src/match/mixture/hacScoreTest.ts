// One-sided test that a further column's least-squares weight is 0, with a standard error robust to correlated and
// unequal residuals (Newey & West's heteroskedasticity-and-autocorrelation-consistent estimator, Bartlett kernel).
import jStatModule from 'jstat';

const { jStat } = jStatModule;

export interface HacScoreTestInput {
  /**
   * The further column made orthogonal to the baseline and to every column already in the fit (its part that they
   * cannot mimic), over the fit points in spectral order.
   */
  direction: ArrayLike<number>;
  /** The query over the same points (baseline already projected out, or not: `direction` is orthogonal to it). */
  query: ArrayLike<number>;
  /** The residual of the fit that includes the further column, over the same points. */
  residual: ArrayLike<number>;
}

export interface HacScoreTestOptions {
  /**
   * Bartlett bandwidth L in points: residual products up to L points apart enter with weight 1 − h/(L + 1). 0 gives
   * White's estimator (unequal variances, no correlation).
   * @default 0
   */
  bandwidth?: number;
}

export interface HacScoreTest {
  /** Least-squares weight of the column given the others: ⟨d, b⟩ / ⟨d, d⟩. */
  estimate: number;
  /** Its HAC standard error. */
  standardError: number;
  /** estimate / standardError. */
  z: number;
  /** P(Z ≥ z) under the null hypothesis of weight 0 (one-sided: weights are non-negative), normal reference. */
  pValue: number;
}

/**
 * β̂ = ⟨d, b⟩/⟨d, d⟩ and Var(β̂) = Ŝ/⟨d, d⟩², Ŝ = Σ_{|h|≤L} (1 − |h|/(L+1)) Σ_t d_t e_t d_{t+h} e_{t+h} with e the
 * residual (Newey & West, Econometrica 55:703, 1987). The normal reference holds for many points and short-range
 * correlation; the Bartlett weights keep Ŝ ≥ 0.
 */
export function hacScoreTest(input: HacScoreTestInput, options: HacScoreTestOptions = {}): HacScoreTest {
  const { direction: d, query: b, residual: e } = input;
  const n = d.length;
  const bandwidth = Math.max(0, Math.floor(options.bandwidth ?? 0));
  let dd = 0;
  let db = 0;
  const score = new Float64Array(n);
  for (let t = 0; t < n; t++) {
    dd += d[t]! * d[t]!;
    db += d[t]! * b[t]!;
    score[t] = d[t]! * e[t]!;
  }
  if (!(dd > 0)) return { estimate: 0, standardError: Number.POSITIVE_INFINITY, z: 0, pValue: 1 };
  let s = 0;
  for (let t = 0; t < n; t++) s += score[t]! * score[t]!;
  for (let h = 1; h <= bandwidth && h < n; h++) {
    let g = 0;
    for (let t = h; t < n; t++) g += score[t]! * score[t - h]!;
    s += 2 * (1 - h / (bandwidth + 1)) * g;
  }
  const estimate = db / dd;
  const standardError = Math.sqrt(Math.max(s, 0)) / dd;
  if (!(standardError > 0)) {
    return { estimate, standardError, z: Number.POSITIVE_INFINITY, pValue: estimate > 0 ? 0 : 1 };
  }
  const z = estimate / standardError;
  return { estimate, standardError, z, pValue: jStat.normal.cdf(-z, 0, 1) };
}

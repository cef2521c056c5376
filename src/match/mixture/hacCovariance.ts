// Newey–West (HAC) covariance matrix of several least-squares weights, each estimated along its own direction.

export interface HacCovarianceInput {
  /**
   * Per weight, the column's part that the rest of the model cannot mimic (Frisch–Waugh–Lovell: its weight is
   * ⟨d, b⟩/⟨d, d⟩), over the fit points in spectral order.
   */
  directions: readonly ArrayLike<number>[];
  /** The final fit's residual over the same points. */
  residual: ArrayLike<number>;
}

export interface HacCovarianceOptions {
  /**
   * Bartlett bandwidth L in points: products up to L points apart enter with weight 1 − h/(L + 1); 0 gives White's
   * estimator.
   * @default 0
   */
  bandwidth?: number;
}

/**
 * Cov(β̂ⱼ, β̂ₖ) = Ŝⱼₖ / (⟨dⱼ, dⱼ⟩⟨dₖ, dₖ⟩), Ŝⱼₖ = Σ_{|h|≤L} (1 − |h|/(L+1)) Σ_t sⱼ(t) sₖ(t+h), sⱼ = dⱼ·e
 * (Newey & West, Econometrica 55:703, 1987); the diagonal is hacScoreTest's squared standard error. Returned row-major,
 * k × k; a direction of zero norm gives an infinite variance and zero covariances.
 */
export function hacCovariance(input: HacCovarianceInput, options: HacCovarianceOptions = {}): Float64Array {
  const { directions, residual: e } = input;
  const k = directions.length;
  const n = e.length;
  const bandwidth = Math.max(0, Math.floor(options.bandwidth ?? 0));
  const scores = directions.map((d) => Float64Array.from({ length: n }, (_, t) => d[t]! * e[t]!));
  const norms = directions.map((d) => {
    let s = 0;
    for (let t = 0; t < n; t++) s += d[t]! * d[t]!;
    return s;
  });
  const out = new Float64Array(k * k);
  for (let j = 0; j < k; j++) {
    for (let l = j; l < k; l++) {
      const a = scores[j]!;
      const b = scores[l]!;
      let s = 0;
      for (let t = 0; t < n; t++) s += a[t]! * b[t]!;
      for (let h = 1; h <= bandwidth && h < n; h++) {
        let g = 0;
        for (let t = h; t < n; t++) g += a[t]! * b[t - h]! + a[t - h]! * b[t]!;
        s += (1 - h / (bandwidth + 1)) * g;
      }
      const scale = norms[j]! * norms[l]!;
      const v = scale > 0 ? s / scale : j === l ? Number.POSITIVE_INFINITY : 0;
      out[j * k + l] = v;
      out[l * k + j] = v;
    }
  }
  return out;
}

// Noise of a fit residual from its own point-to-point differences, with the lag-1 correlation smoothing leaves.

/** Robust noise figures of one residual. */
export interface ResidualNoise {
  /** Standard deviation of the noise per point (robust, in the residual's units). */
  sigma: number;
  /** Lag-1 autocorrelation of the noise (AR(1) model), clamped to [0, 0.98]. */
  lag1: number;
  /** Variance inflation of a sum over the points under that correlation: (1 + ρ) / (1 − ρ). */
  inflation: number;
  /** Points the noise was measured on. */
  points: number;
}

export interface ResidualNoiseOptions {
  /**
   * Largest lag-1 correlation accepted; beyond it the effective number of points would fall below a few per cent of
   * the grid and every test would lose its power to rounding of the estimate.
   * @default 0.98
   */
  maxLag1?: number;
}

/**
 * The residual's first differences d remove its slow part (baseline misfit, broad bands). Under an AR(1) noise with
 * lag-1 correlation ρ, Var(d) = 2σ²(1 − ρ) and corr(dₜ, dₜ₊₁) = −(1 − ρ)/2, so ρ = 1 + 2·corr₁(d) and
 * σ = MAD(d) / (0.6745 √(2(1 − ρ))), 0.6745 being the normal quartile (MAD of a Gaussian = 0.6745 σ, common practice).
 * Non-finite points (outside the fit) are skipped; differences are taken only between neighbouring finite points.
 */
export function residualNoise(
  residual: ArrayLike<number>,
  options: ResidualNoiseOptions = {},
): ResidualNoise {
  const maxLag1 = options.maxLag1 ?? 0.98;
  const d: number[] = [];
  let points = 0;
  for (let i = 0; i < residual.length; i++) {
    if (Number.isFinite(residual[i]!)) points++;
    if (i > 0 && Number.isFinite(residual[i]!) && Number.isFinite(residual[i - 1]!)) {
      d.push(residual[i]! - residual[i - 1]!);
    }
  }
  if (d.length < 3) return { sigma: 0, lag1: 0, inflation: 1, points };
  const mean = d.reduce((s, x) => s + x, 0) / d.length;
  let c0 = 0;
  let c1 = 0;
  for (let t = 0; t < d.length; t++) {
    c0 += (d[t]! - mean) ** 2;
    if (t > 0) c1 += (d[t]! - mean) * (d[t - 1]! - mean);
  }
  const corr = c0 > 0 ? c1 / c0 : -0.5;
  const lag1 = Math.min(maxLag1, Math.max(0, 1 + 2 * corr));
  const abs = d.map((x) => Math.abs(x - mean)).sort((a, b) => a - b);
  const mid = abs.length >> 1;
  const mad = abs.length % 2 === 1 ? abs[mid]! : (abs[mid - 1]! + abs[mid]!) / 2;
  const sigma = mad / (0.6745 * Math.sqrt(2 * (1 - lag1)));
  return { sigma, lag1, inflation: (1 + lag1) / (1 - lag1), points };
}

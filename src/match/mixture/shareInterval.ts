// 95 % interval of each mixture component's share of the fitted signal, by first-order propagation of the weights' covariance.
import jStatModule from 'jstat';

const { jStat } = jStatModule;

export interface ShareIntervalInput {
  /** The components' weights. */
  weights: ArrayLike<number>;
  /** Each component's Σ|vector| over the fit points (its signal per unit weight). */
  areas: ArrayLike<number>;
  /** Covariance matrix of the weights, row-major, k × k. */
  covariance: ArrayLike<number>;
}

export interface ShareIntervalOptions {
  /** Two-sided coverage of the interval. @default 0.95 */
  level?: number;
}

export interface ShareInterval {
  share: number;
  standardError: number;
  /** [low, high], clipped to [0, 1]. */
  interval: [number, number];
}

/**
 * sⱼ = aⱼwⱼ / S with S = Σ aₖwₖ; ∂sⱼ/∂wₖ = aⱼ(δⱼₖS − wⱼaₖ)/S², Var(sⱼ) ≈ gᵀΣg (the delta method, first order: it
 * holds while each standard error is small beside S/aₖ); the interval is sⱼ ± z₍₁₊level₎/₂ × its error (normal
 * reference). A single component's share is 1 exactly, with error 0.
 */
export function shareInterval(
  input: ShareIntervalInput,
  options: ShareIntervalOptions = {},
): ShareInterval[] {
  const level = options.level ?? 0.95;
  const z = jStat.normal.inv((1 + level) / 2, 0, 1);
  const { weights: w, areas: a, covariance } = input;
  const k = w.length;
  let total = 0;
  for (let j = 0; j < k; j++) total += a[j]! * w[j]!;
  return Array.from({ length: k }, (_, j) => {
    if (!(total > 0)) return { share: 0, standardError: Number.POSITIVE_INFINITY, interval: [0, 1] };
    const share = (a[j]! * w[j]!) / total;
    const g = Array.from(
      { length: k },
      (_, l) => (a[j]! * ((l === j ? total : 0) - w[j]! * a[l]!)) / total ** 2,
    );
    let variance = 0;
    for (let l = 0; l < k; l++) {
      for (let m = 0; m < k; m++) {
        if (g[l] === 0 || g[m] === 0) continue;
        variance += g[l]! * covariance[l * k + m]! * g[m]!;
      }
    }
    const standardError = Math.sqrt(Math.max(0, variance));
    if (!Number.isFinite(standardError)) return { share, standardError, interval: [0, 1] };
    return {
      share,
      standardError,
      interval: [Math.max(0, share - z * standardError), Math.min(1, share + z * standardError)],
    };
  });
}

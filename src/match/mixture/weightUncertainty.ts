// Standard errors and 95 % intervals of mixture weights from the covariance of the final least-squares fit.
import jStatModule from 'jstat';
import { invertSymmetric } from './invertSymmetric.js';

const { jStat } = jStatModule;

export interface WeightUncertaintyInput {
  /** Row-major p×p Gram matrix AᵀA of the components' baseline-projected columns. */
  gram: ArrayLike<number>;
  weights: ArrayLike<number>;
  /** Residual sum of squares of the final fit. */
  rss: number;
  points: number;
  /** All fitted parameters: components plus baseline terms. */
  parameters: number;
}

export interface WeightUncertaintyOptions {
  /** Variance inflation (1 + ρ)/(1 − ρ) of correlated residuals (see residualNoise). @default 1 */
  inflation?: number;
  /** Two-sided confidence level of the interval. @default 0.95 */
  level?: number;
}

export interface WeightUncertainty {
  standardError: number;
  /** [low, high], low clipped at 0 (weights are non-negative). */
  interval: [number, number];
  /** The unclipped lower end is above 0. */
  significant: boolean;
  /** 1/√((AᵀA)⁻¹ⱼⱼ): the response norm per unit weight only this component can give. */
  sensitivity: number;
}

/**
 * Cov(w) = s²·inflation·(AᵀA)⁻¹ with s² = RSS/(n − p) (the baseline projected out beforehand gives the component
 * block of the full inverse, Frisch–Waugh–Lovell); interval w ± t(1 − α/2; n/inflation − p)·SE. Collinear
 * components (singular AᵀA) get infinite errors and are not significant.
 */
export function weightUncertainty(
  input: WeightUncertaintyInput,
  options: WeightUncertaintyOptions = {},
): WeightUncertainty[] {
  const inflation = options.inflation ?? 1;
  const level = options.level ?? 0.95;
  const p = input.weights.length;
  if (p === 0) return [];
  const inverse = invertSymmetric(input.gram, p);
  const dof = input.points / inflation - input.parameters;
  const s2 = input.points > input.parameters ? input.rss / (input.points - input.parameters) : Number.NaN;
  const t = dof > 0 ? jStat.studentt.inv(1 - (1 - level) / 2, dof) : Number.POSITIVE_INFINITY;
  return Array.from({ length: p }, (_, j) => {
    const w = input.weights[j]!;
    const diag = inverse === null ? Number.POSITIVE_INFINITY : inverse[j * p + j]!;
    const standardError =
      Number.isFinite(s2) && diag > 0 ? Math.sqrt(s2 * inflation * diag) : Number.POSITIVE_INFINITY;
    const half = t * standardError;
    const low = w - half;
    return {
      standardError,
      interval: [Math.max(0, low), w + half] as [number, number],
      significant: Number.isFinite(low) && low > 0,
      sensitivity: diag > 0 && Number.isFinite(diag) ? 1 / Math.sqrt(diag) : 0,
    };
  });
}

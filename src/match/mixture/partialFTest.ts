// Nested-model partial F-test: does adding columns to a least-squares fit lower the residual more than noise would?
import jStatModule from 'jstat';

const { jStat } = jStatModule;

export interface PartialFTestInput {
  /** Residual sum of squares of the smaller model. */
  rssReduced: number;
  /** Residual sum of squares of the larger model (the smaller plus `added` columns). */
  rssFull: number;
  /** Fit points. */
  points: number;
  /** Fitted parameters of the larger model (components and baseline terms). */
  parametersFull: number;
}

export interface PartialFTestOptions {
  /** Columns the larger model adds. @default 1 */
  added?: number;
  /**
   * Variance inflation (1 + ρ)/(1 − ρ) of correlated residuals; the points count as points / inflation independent
   * ones and the statistic is divided by it.
   * @default 1
   */
  inflation?: number;
}

export interface PartialFTestResult {
  f: number;
  dof1: number;
  dof2: number;
  /** P(F ≥ f) under the null hypothesis that the added columns have zero weight. */
  pValue: number;
}

/**
 * F = ((RSS₀ − RSS₁)/q) / (RSS₁/(n − p₁)), referred to F(q, n_eff − p₁) with n_eff = n / inflation (F divided by the
 * inflation too). Assumes Gaussian residuals with equal variance, independent after the AR(1) correction.
 */
export function partialFTest(
  input: PartialFTestInput,
  options: PartialFTestOptions = {},
): PartialFTestResult {
  const q = options.added ?? 1;
  const inflation = options.inflation ?? 1;
  const { rssReduced, rssFull, points, parametersFull } = input;
  const dof2 = points / inflation - parametersFull;
  const drop = Math.max(0, rssReduced - rssFull);
  if (!(dof2 > 0)) return { f: Number.NaN, dof1: q, dof2, pValue: 1 };
  if (!(rssFull > 0)) return { f: Number.POSITIVE_INFINITY, dof1: q, dof2, pValue: drop > 0 ? 0 : 1 };
  const f = drop / q / (rssFull / (points - parametersFull)) / inflation;
  return { f, dof1: q, dof2, pValue: Math.max(0, 1 - jStat.centralF.cdf(f, q, dof2)) };
}

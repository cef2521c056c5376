// Welch's unequal-variance t-test of two independent samples: t, Welch–Satterthwaite degrees of freedom, two-sided p.
import jStatModule from 'jstat';
import { BandshelfError } from '../../error.js';

const { jStat } = jStatModule;

export interface WelchTTestResult {
  /** (mean A − mean B) / √(s²A/nA + s²B/nB). */
  t: number;
  /** Welch–Satterthwaite degrees of freedom. */
  df: number;
  /** Two-sided p-value from Student's t distribution with `df` degrees of freedom. */
  p: number;
  /** Mean A − mean B. */
  difference: number;
  /** Standard error of the difference. */
  standardError: number;
}

function meanAndVariance(values: ArrayLike<number>): { n: number; mean: number; variance: number } {
  const n = values.length;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += values[i]!;
  const mean = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (values[i]! - mean) ** 2;
  return { n, mean, variance: ss / (n - 1) };
}

/**
 * Welch's t-test (Welch, Biometrika 34:28, 1947). Assumes independent observations, each group normally distributed;
 * the variances may differ. Each group needs at least two values. A zero standard error (both groups constant) gives
 * t = ±∞ and p = 0 when the means differ, t = 0 and p = 1 when they are equal.
 */
export function welchTTest(a: ArrayLike<number>, b: ArrayLike<number>): WelchTTestResult {
  if (a.length < 2 || b.length < 2) {
    throw new BandshelfError('BAD_OPTION', 'a t-test needs at least two values in each group');
  }
  const A = meanAndVariance(a);
  const B = meanAndVariance(b);
  const va = A.variance / A.n;
  const vb = B.variance / B.n;
  const standardError = Math.sqrt(va + vb);
  const difference = A.mean - B.mean;
  if (standardError === 0) {
    const t = difference === 0 ? 0 : difference > 0 ? Number.POSITIVE_INFINITY : Number.NEGATIVE_INFINITY;
    return { t, df: A.n + B.n - 2, p: difference === 0 ? 1 : 0, difference, standardError };
  }
  const t = difference / standardError;
  const df = (va + vb) ** 2 / (va ** 2 / (A.n - 1) + vb ** 2 / (B.n - 1));
  const p = Math.min(1, 2 * (1 - jStat.studentt.cdf(Math.abs(t), df)));
  return { t, df, p, difference, standardError };
}

// Hedges' g: the standardised mean difference with the small-sample bias correction.

/**
 * g = J · (mean A − mean B) / s_pooled, with s_pooled² = ((nA−1)s²A + (nB−1)s²B) / (nA+nB−2) and the approximate
 * correction J = 1 − 3 / (4(nA+nB) − 9) (Hedges, J. Educ. Stat. 6:107, 1981). NaN when the pooled SD is 0.
 */
export function hedgesG(a: ArrayLike<number>, b: ArrayLike<number>): number {
  const stats = (v: ArrayLike<number>) => {
    let s = 0;
    for (let i = 0; i < v.length; i++) s += v[i]!;
    const mean = s / v.length;
    let ss = 0;
    for (let i = 0; i < v.length; i++) ss += (v[i]! - mean) ** 2;
    return { n: v.length, mean, ss };
  };
  const A = stats(a);
  const B = stats(b);
  const pooled = Math.sqrt((A.ss + B.ss) / (A.n + B.n - 2));
  if (!(pooled > 0)) return Number.NaN;
  const correction = 1 - 3 / (4 * (A.n + B.n) - 9);
  return (correction * (A.mean - B.mean)) / pooled;
}

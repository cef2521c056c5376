// The empirical p-value of a score against a null sample of best wrong hits.

export interface EmpiricalPValueOptions {
  /**
   * Whether larger scores are better (correlations); false for distances.
   * @default true
   */
  higherIsBetter?: boolean;
}

/**
 * p = (1 + #{null scores at least as good as `score`}) / (1 + n): the add-one estimate, never 0, so a null of n
 * scores cannot claim a p below 1/(n + 1). `nullScores` must be ascending. Null for an empty null.
 */
export function empiricalPValue(
  input: { score: number; nullScores: ArrayLike<number> },
  options: EmpiricalPValueOptions = {},
): number | null {
  const { score, nullScores } = input;
  const n = nullScores.length;
  if (n === 0 || !Number.isFinite(score)) return null;
  const higher = options.higherIsBetter ?? true;
  // First index whose value is ≥ score (ascending order).
  let lo = 0;
  let hi = n;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (higher ? nullScores[mid]! < score : nullScores[mid]! <= score) lo = mid + 1;
    else hi = mid;
  }
  const atLeastAsGood = higher ? n - lo : lo;
  return (1 + atLeastAsGood) / (1 + n);
}

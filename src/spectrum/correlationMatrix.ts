// Pearson correlation of every pair of grid vectors, each over the points both cover.
import { type CorrelationOptions, correlation } from './correlation.js';

export type CorrelationMatrixOptions = CorrelationOptions;

/** Symmetric, 1 on the diagonal (NaN for a vector constant or uncovered); NaN where a pair shares too few points. */
export function correlationMatrix(
  vectors: readonly Float64Array[],
  options: CorrelationMatrixOptions = {},
): number[][] {
  const n = vectors.length;
  const m: number[][] = Array.from({ length: n }, () => new Array<number>(n).fill(Number.NaN));
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      const r = correlation(vectors[i]!, vectors[j]!, options);
      m[i]![j] = r;
      m[j]![i] = r;
    }
  }
  return m;
}

// Euclidean distance between the unit-normalised query and each unit-normalised row, over the points both cover.
import { cosineScores } from './cosineScores.js';

export interface EuclideanScoresOptions {
  /**
   * Score only over the points set here (one byte per column); by default all columns.
   * @default undefined
   */
  mask?: Uint8Array;
}

/** For unit vectors ‖a − b‖² = 2 − 2 cos(a, b), so the distance follows from the cosine: 0 same shape, ≤ 2. */
export function euclideanScores(
  matrix: Float32Array,
  rows: number,
  cols: number,
  query: ArrayLike<number>,
  options: EuclideanScoresOptions = {},
): Float64Array {
  const cosine = cosineScores(matrix, rows, cols, query, options);
  const out = new Float64Array(rows);
  for (let r = 0; r < rows; r++) {
    const c = cosine[r]!;
    out[r] = Number.isNaN(c) ? Number.NaN : Math.sqrt(Math.max(0, 2 - 2 * c));
  }
  return out;
}

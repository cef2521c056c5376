// Cosine similarity of one query against every row of a plain row-major matrix, each over the points both cover.
import { BandshelfError } from '../error.js';
import { maskedRowScore } from './maskedRowScore.js';

export interface CosineScoresOptions {
  /**
   * Score only over the points set here (one byte per column); by default all columns.
   * @default undefined
   */
  mask?: Uint8Array;
}

/** Direct double-precision path, as `pearsonScores` but on uncentred vectors. NaN: under 3 shared points or zero. */
export function cosineScores(
  matrix: Float32Array,
  rows: number,
  cols: number,
  query: ArrayLike<number>,
  options: CosineScoresOptions = {},
): Float64Array {
  if (
    matrix.length < rows * cols ||
    query.length !== cols ||
    (options.mask && options.mask.length !== cols)
  ) {
    throw new BandshelfError('BAD_FORMAT', `expected ${rows} × ${cols} values and a query of ${cols}`, {
      field: 'query',
    });
  }
  const mask = options.mask ?? new Uint8Array(cols).fill(1);
  const out = new Float64Array(rows);
  for (let r = 0; r < rows; r++) {
    out[r] = maskedRowScore(matrix, query, mask, { centring: 'unit', rowOffset: r * cols }).score;
  }
  return out;
}

// Pearson's r of one query against every row of a plain row-major matrix, each over the points both cover.
import { BandshelfError } from '../error.js';
import { maskedRowScore } from './maskedRowScore.js';

export interface PearsonScoresOptions {
  /**
   * Score only over the points set here (one byte per column), e.g. a scoring range; by default all columns.
   * @default undefined
   */
  mask?: Uint8Array;
}

/**
 * The exact, direct path (double precision, no preparation, no cache): right for a few thousand rows, e.g. the
 * in-browser matcher, and the reference the search matrix is tested against. NaN marks a row that shares fewer
 * than 3 points with the query or is flat over them.
 */
export function pearsonScores(
  matrix: Float32Array,
  rows: number,
  cols: number,
  query: ArrayLike<number>,
  options: PearsonScoresOptions = {},
): Float64Array {
  const mask = options.mask;
  if (matrix.length < rows * cols || query.length !== cols || (mask && mask.length !== cols)) {
    throw new BandshelfError('BAD_FORMAT', `expected ${rows} × ${cols} values and a query of ${cols}`, {
      field: 'query',
    });
  }
  const all = mask ?? new Uint8Array(cols).fill(1);
  const out = new Float64Array(rows);
  for (let r = 0; r < rows; r++) {
    out[r] = maskedRowScore(matrix, query, all, { centring: 'centred', rowOffset: r * cols }).score;
  }
  return out;
}

// Non-negative least squares for a plain matrix and right-hand side (Lawson & Hanson 1974, active-set method).
import { BandshelfError } from '../error.js';
import { nnlsNormal } from './nnlsNormal.js';

export interface NnlsOptions {
  /**
   * Gradient threshold for a variable to enter the active (passive) set; absolute, in units of Aᵀb.
   * @default 1e-10 × the largest |Aᵀb|
   */
  tolerance?: number;
  /**
   * Outer iterations before returning the best point found.
   * @default 3n + 30
   */
  maxIterations?: number;
}

export interface NnlsResult {
  /** The non-negative solution, one value per column of A. */
  x: Float64Array;
  /** ‖Ax − b‖₂ at the solution. */
  residualNorm: number;
  iterations: number;
  converged: boolean;
}

/** Columns of A as one column-major array (length rows × n) or as one array per column. */
export type NnlsMatrix = Float64Array | readonly ArrayLike<number>[];

function columnsOf(a: NnlsMatrix, rows: number): ArrayLike<number>[] {
  if (a instanceof Float64Array) {
    if (rows === 0 || a.length % rows !== 0) {
      throw new BandshelfError(
        'BAD_OPTION',
        `a column-major matrix of ${a.length} values does not split into columns of ${rows} rows`,
        { field: 'A' },
      );
    }
    const n = a.length / rows;
    return Array.from({ length: n }, (_, j) => a.subarray(j * rows, (j + 1) * rows));
  }
  for (const [j, column] of a.entries()) {
    if (column.length !== rows) {
      throw new BandshelfError('BAD_OPTION', `column ${j + 1} has ${column.length} rows; b has ${rows}`, {
        field: 'A',
      });
    }
  }
  return [...a];
}

/**
 * Minimises ‖Ax − b‖₂ subject to x ≥ 0. The problem is reduced to AᵀA and Aᵀb and solved by `nnlsNormal`, the
 * residual norm is then computed from A and b directly (not from the normal equations) so it is accurate.
 */
export function nnls(a: NnlsMatrix, b: ArrayLike<number>, options: NnlsOptions = {}): NnlsResult {
  const rows = b.length;
  if (rows === 0) throw new BandshelfError('BAD_OPTION', 'b is empty', { field: 'b' });
  for (let i = 0; i < rows; i++) {
    if (!Number.isFinite(b[i]!))
      throw new BandshelfError('BAD_OPTION', `b[${i}] is not finite`, { field: 'b' });
  }
  const columns = columnsOf(a, rows);
  const n = columns.length;
  for (const [j, column] of columns.entries()) {
    for (let i = 0; i < rows; i++) {
      if (!Number.isFinite(column[i]!)) {
        throw new BandshelfError('BAD_OPTION', `A[${i}][${j}] is not finite`, { field: 'A' });
      }
    }
  }
  const gram = new Float64Array(n * n);
  const atb = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    const cj = columns[j]!;
    let sb = 0;
    for (let i = 0; i < rows; i++) sb += cj[i]! * b[i]!;
    atb[j] = sb;
    for (let k = 0; k <= j; k++) {
      const ck = columns[k]!;
      let s = 0;
      for (let i = 0; i < rows; i++) s += cj[i]! * ck[i]!;
      gram[j * n + k] = s;
      gram[k * n + j] = s;
    }
  }
  const solved = nnlsNormal({ gram, atb }, options);
  let rss = 0;
  for (let i = 0; i < rows; i++) {
    let r = -b[i]!;
    for (let j = 0; j < n; j++) r += columns[j]![i]! * solved.x[j]!;
    rss += r * r;
  }
  return {
    x: solved.x,
    residualNorm: Math.sqrt(rss),
    iterations: solved.iterations,
    converged: solved.converged,
  };
}

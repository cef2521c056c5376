// Small dense least squares by Householder QR, for fits of a few model terms (EMSC) over many points.

/** A column-major `rows × cols` design matrix and the observations. */
export interface LeastSquaresProblem {
  /** Column j occupies [j·rows, (j+1)·rows). */
  matrix: Float64Array;
  rows: number;
  cols: number;
  b: Float64Array;
}

export interface SolveLeastSquaresOptions {
  /**
   * A column whose remaining norm after orthogonalisation falls below this fraction of its own norm is taken
   * as linearly dependent on the others.
   * @default 1e-10
   */
  rankTolerance?: number;
}

/**
 * The coefficients minimising ‖A c − b‖₂, or undefined when A is rank deficient. Householder QR rather than
 * the normal equations, whose squared condition number loses digits with polynomial terms. Inputs are not
 * modified.
 */
export function solveLeastSquares(
  problem: LeastSquaresProblem,
  options: SolveLeastSquaresOptions = {},
): Float64Array | undefined {
  const { rows: m, cols: k } = problem;
  const tolerance = options.rankTolerance ?? 1e-10;
  if (m < k || problem.matrix.length !== m * k || problem.b.length !== m) return undefined;
  const a = problem.matrix.slice();
  const b = problem.b.slice();
  const r = new Float64Array(k * k);
  for (let j = 0; j < k; j++) {
    const col = j * m;
    let original = 0;
    for (let i = 0; i < m; i++) original += problem.matrix[col + i]! ** 2;
    let norm = 0;
    for (let i = j; i < m; i++) norm += a[col + i]! ** 2;
    norm = Math.sqrt(norm);
    if (!(norm > tolerance * Math.sqrt(original)) || original === 0) return undefined;
    const alpha = a[col + j]! > 0 ? -norm : norm;
    // v = x − alpha e₁, stored in place of the column below the diagonal.
    a[col + j]! -= alpha;
    let vv = 0;
    for (let i = j; i < m; i++) vv += a[col + i]! ** 2;
    const reflect = (target: Float64Array, offset: number) => {
      let dot = 0;
      for (let i = j; i < m; i++) dot += a[col + i]! * target[offset + i]!;
      const f = (2 * dot) / vv;
      for (let i = j; i < m; i++) target[offset + i]! -= f * a[col + i]!;
    };
    for (let c = j + 1; c < k; c++) reflect(a, c * m);
    reflect(b, 0);
    r[j * k + j] = alpha;
    for (let c = j + 1; c < k; c++) r[j * k + c] = a[c * m + j]!;
  }
  const x = new Float64Array(k);
  for (let j = k - 1; j >= 0; j--) {
    let s = b[j]!;
    for (let c = j + 1; c < k; c++) s -= r[j * k + c]! * x[c]!;
    x[j] = s / r[j * k + j]!;
  }
  return x;
}

// Inverse of a small symmetric positive-definite matrix (Cholesky), for the covariance of the mixture weights.

/** Row-major p×p inverse, or null when the matrix is not numerically positive definite (collinear components). */
export function invertSymmetric(matrix: ArrayLike<number>, p: number): Float64Array | null {
  const l = new Float64Array(p * p);
  for (let i = 0; i < p; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = matrix[i * p + j]!;
      for (let k = 0; k < j; k++) sum -= l[i * p + k]! * l[j * p + k]!;
      if (i === j) {
        // Relative pivot test: a pivot lost to rounding means the columns are collinear.
        if (!(sum > 1e-12 * Math.abs(matrix[i * p + i]!))) return null;
        l[i * p + i] = Math.sqrt(sum);
      } else l[i * p + j] = sum / l[j * p + j]!;
    }
  }
  // Solve L·Lᵀ·X = I column by column.
  const inverse = new Float64Array(p * p);
  const y = new Float64Array(p);
  for (let c = 0; c < p; c++) {
    for (let i = 0; i < p; i++) {
      let sum = i === c ? 1 : 0;
      for (let k = 0; k < i; k++) sum -= l[i * p + k]! * y[k]!;
      y[i] = sum / l[i * p + i]!;
    }
    for (let i = p - 1; i >= 0; i--) {
      let sum = y[i]!;
      for (let k = i + 1; k < p; k++) sum -= l[k * p + i]! * inverse[k * p + c]!;
      inverse[i * p + c] = sum / l[i * p + i]!;
    }
  }
  return inverse;
}

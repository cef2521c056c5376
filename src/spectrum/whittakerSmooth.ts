// The weighted Whittaker smoother, solved as a banded system in O(n): the core of the ALS and airPLS fits.
import { BandshelfError } from '../error.js';

/** The values to smooth and the weight of each (≥ 0; enough must be positive to fix the solution). */
export interface WhittakerInput {
  y: Float64Array;
  weights: Float64Array;
}

export interface WhittakerSmoothOptions {
  /**
   * Smoothness penalty λ on the squared differences, in index units (as published: not scaled by point
   * spacing).
   * @default 1e5
   */
  lambda?: number;
  /**
   * Order of the differences penalised: 1 (first differences, tridiagonal) or 2 (second differences,
   * pentadiagonal).
   * @default 2
   */
  differences?: 1 | 2;
}

/**
 * Solves (W + λ DᵀD) z = W y with a banded LDLᵀ factorisation on typed arrays (no dense matrix): the matrix
 * is symmetric positive definite whenever λ > 0 and enough points carry weight.
 */
export function whittakerSmooth(input: WhittakerInput, options: WhittakerSmoothOptions = {}): Float64Array {
  const { y, weights: w } = input;
  const n = y.length;
  const lambda = options.lambda ?? 1e5;
  const order = options.differences ?? 2;
  if (w.length !== n) {
    throw new BandshelfError('BAD_OPTION', `weights have ${w.length} values for ${n} points`, {
      field: 'weights',
    });
  }
  if (!(lambda > 0) || !Number.isFinite(lambda)) {
    throw new BandshelfError('BAD_RECIPE', `lambda must be a positive number (got ${lambda})`, {
      field: 'lambda',
    });
  }
  // Bands of A = W + λ DᵀD: a on the diagonal, b on the first and c on the second off-diagonal.
  const a = new Float64Array(n);
  const b = new Float64Array(n);
  const c = new Float64Array(n);
  if (order === 2) {
    // Each row of D is [1, −2, 1]; summing its outer products builds DᵀD exactly, short spectra included.
    for (let r = 0; r + 2 < n; r++) {
      a[r]! += lambda;
      a[r + 1]! += 4 * lambda;
      a[r + 2]! += lambda;
      b[r]! -= 2 * lambda;
      b[r + 1]! -= 2 * lambda;
      c[r]! += lambda;
    }
  } else {
    for (let r = 0; r + 1 < n; r++) {
      a[r]! += lambda;
      a[r + 1]! += lambda;
      b[r]! -= lambda;
    }
  }
  const rhs = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const wi = w[i]!;
    if (!(wi >= 0) || !Number.isFinite(wi)) {
      throw new BandshelfError('BAD_OPTION', `weight ${i} is ${wi}; weights must be finite and ≥ 0`, {
        field: 'weights',
      });
    }
    a[i]! += wi;
    rhs[i] = wi * y[i]!;
  }
  // LDLᵀ: L unit lower triangular with sub-diagonals l1, l2; D = d.
  const d = new Float64Array(n);
  const l1 = new Float64Array(n);
  const l2 = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let di = a[i]!;
    if (i >= 1) di -= l1[i - 1]! * l1[i - 1]! * d[i - 1]!;
    if (i >= 2) di -= l2[i - 2]! * l2[i - 2]! * d[i - 2]!;
    if (!(di > 0)) {
      throw new BandshelfError(
        'BAD_RECIPE',
        'the baseline system is singular: too few points carry weight for the smoother',
        { field: 'baseline' },
      );
    }
    d[i] = di;
    let bi = b[i]!;
    if (i >= 1) bi -= l2[i - 1]! * l1[i - 1]! * d[i - 1]!;
    l1[i] = bi / di;
    l2[i] = c[i]! / di;
  }
  // Forward substitution L u = rhs, then D, then back substitution Lᵀ z = v.
  const z = rhs;
  for (let i = 1; i < n; i++) {
    z[i]! -= l1[i - 1]! * z[i - 1]!;
    if (i >= 2) z[i]! -= l2[i - 2]! * z[i - 2]!;
  }
  for (let i = 0; i < n; i++) z[i]! /= d[i]!;
  for (let i = n - 2; i >= 0; i--) {
    z[i]! -= l1[i]! * z[i + 1]!;
    if (i + 2 < n) z[i]! -= l2[i]! * z[i + 2]!;
  }
  return z;
}

// Savitzky–Golay convolution weights for any odd window, polynomial order and derivative, from Gram polynomials.
import { BandshelfError } from '../error.js';

export interface SavitzkyGolayCoefficientsOptions {
  /**
   * Where in the window the fitted polynomial is evaluated, as an offset from the centre point in samples
   * (−half … +half). The centre (0) gives the classic symmetric filter; the ends give the weights used to
   * treat the first and last points of a signal by fitting its end windows.
   * @default 0
   */
  at?: number;
}

/**
 * The weights c[0 … window−1] applied to y(j−m) … y(j+m) (m = (window−1)/2) that give the least-squares
 * polynomial of `order` through the window, or its `derivative`-th derivative, at offset `at`. Derivative
 * weights are for unit spacing; divide by Δxᵈ for a real axis.
 *
 * Built from Gram (discrete orthogonal) polynomials after Gorry, Anal. Chem. 62:570 (1990), which avoids the
 * ill-conditioned normal equations of a Vandermonde fit and works for any window, order and evaluation point.
 */
export function savitzkyGolayCoefficients(
  window: number,
  order: number,
  derivative = 0,
  options: SavitzkyGolayCoefficientsOptions = {},
): Float64Array {
  if (!Number.isInteger(window) || window < 1 || window % 2 !== 1) {
    throw new BandshelfError(
      'BAD_RECIPE',
      `the Savitzky–Golay window must be an odd whole number, not ${window}`,
      {
        field: 'smooth.window',
      },
    );
  }
  if (!Number.isInteger(order) || order < 0 || order >= window) {
    throw new BandshelfError(
      'BAD_RECIPE',
      `the Savitzky–Golay order must be a whole number from 0 to window − 1 (${window - 1}), not ${order}`,
      { field: 'smooth.order' },
    );
  }
  if (!Number.isInteger(derivative) || derivative < 0 || derivative > order) {
    throw new BandshelfError(
      'BAD_RECIPE',
      `the derivative must be a whole number from 0 to the order (${order}), not ${derivative}`,
      { field: 'smooth.derivative' },
    );
  }
  const m = (window - 1) / 2;
  const at = options.at ?? 0;
  if (!Number.isFinite(at) || Math.abs(at) > m) {
    throw new BandshelfError(
      'BAD_RECIPE',
      `the evaluation point must lie inside the window (±${m}), not ${at}`,
      {
        field: 'smooth.at',
      },
    );
  }

  // Gram polynomial values at the evaluation point, for every order up to `order` and derivative up to `derivative`.
  const atValues = gramTable(at, m, order, derivative);
  // Per-order factor (2k+1)·(2m)^(k) / (2m+k+1)^(k+1) with falling factorials, the squared norm's inverse.
  const factor = new Float64Array(order + 1);
  for (let k = 0; k <= order; k++) {
    let f = 2 * k + 1;
    for (let j = 0; j < k; j++) f *= 2 * m - j;
    for (let j = 0; j <= k; j++) f /= 2 * m + k + 1 - j;
    factor[k] = f;
  }
  const weights = new Float64Array(window);
  for (let i = -m; i <= m; i++) {
    const pointValues = gramTable(i, m, order, 0);
    let w = 0;
    for (let k = 0; k <= order; k++) {
      w += factor[k]! * pointValues[k]! * atValues[derivative * (order + 1) + k]!;
    }
    weights[i + m] = w;
  }
  return weights;
}

/**
 * P_k^s(t) for k = 0 … order and s = 0 … maxDerivative, stored as table[s·(order+1) + k]; Gorry's recurrence
 * P_k^s(t) = a_k·(t·P_{k−1}^s + s·P_{k−1}^{s−1}) − b_k·P_{k−2}^s with P_0^0 = 1.
 */
function gramTable(t: number, m: number, order: number, maxDerivative: number): Float64Array {
  const width = order + 1;
  const table = new Float64Array(width * (maxDerivative + 1));
  for (let s = 0; s <= maxDerivative; s++) {
    for (let k = 0; k <= order; k++) {
      let value: number;
      if (k === 0) {
        value = s === 0 ? 1 : 0;
      } else {
        const denominator = k * (2 * m - k + 1);
        const a = (2 * (2 * k - 1)) / denominator;
        const b = ((k - 1) * (2 * m + k)) / denominator;
        const prev = table[s * width + k - 1]!;
        const prevLowerDerivative = s > 0 ? table[(s - 1) * width + k - 1]! : 0;
        const prevPrev = k >= 2 ? table[s * width + k - 2]! : 0;
        value = a * (t * prev + s * prevLowerDerivative) - b * prevPrev;
      }
      table[s * width + k] = value;
    }
  }
  return table;
}

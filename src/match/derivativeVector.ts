// The Savitzky–Golay first derivative of a processed vector, for the derivative metric.
import { savitzkyGolay } from '../spectrum/savitzkyGolay.js';

export interface DerivativeVectorOptions {
  /**
   * Savitzky–Golay window, points (odd).
   * @default 9
   */
  window?: number;
  /**
   * Order of the local polynomial.
   * @default 2
   */
  order?: number;
  /**
   * Grid step, cm⁻¹ (scales the derivative; correlations do not depend on it).
   * @default 1
   */
  step?: number;
}

/**
 * Each covered stretch is differentiated on its own (NaN stays not covered). The half-window at each end of a
 * stretch is then set to NaN as well: there the filter extrapolates a fit, so a reference that covers the point
 * from both sides would differ from a query that ends there, and the two would not compare like with like.
 */
export function derivativeVector(
  processed: ArrayLike<number>,
  options: DerivativeVectorOptions = {},
): Float64Array {
  const window = options.window ?? 9;
  const order = options.order ?? 2;
  const input = Float64Array.from(processed);
  const out = savitzkyGolay(input, { window, order, derivative: 1, delta: options.step ?? 1 });
  const half = (window - 1) / 2;
  const n = out.length;
  let start = 0;
  while (start < n) {
    if (!Number.isFinite(input[start]!)) {
      start++;
      continue;
    }
    let end = start;
    while (end + 1 < n && Number.isFinite(input[end + 1]!)) end++;
    for (let e = 0; e < half; e++) {
      if (start + e <= end) out[start + e] = Number.NaN;
      if (end - e >= start) out[end - e] = Number.NaN;
    }
    start = end + 1;
  }
  return out;
}

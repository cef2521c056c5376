// Converts percent transmittance (0–100) to decadic absorbance, A = 2 − log10(%T), refusing %T ≤ 0.
import { BandshelfError } from '../../error.js';

export interface AbsorbanceFromPercentTransmittanceOptions {
  /** File named in the error when a transmittance is not positive. @default undefined */
  file?: string;
  /** Line number of each element (same length as the input), so an error can point at the line. @default undefined */
  lines?: ArrayLike<number>;
  /**
   * Absorbance ceiling: a transmittance at or below 10^−ceiling (zero and negative noise included) is clipped
   * to it instead of refused, as a saturated band's noise demands. @default undefined (refuse T ≤ 0)
   */
  ceiling?: number;
}

/**
 * A = −log10(%T / 100). Elementwise on a Float64Array, returning a new array. %T ≤ 0 or not finite →
 * BandshelfError BAD_TRANSMITTANCE (never −Infinity / Infinity).
 */
export function absorbanceFromPercentTransmittance(
  percent: number,
  options?: AbsorbanceFromPercentTransmittanceOptions,
): number;
export function absorbanceFromPercentTransmittance(
  percent: Float64Array,
  options?: AbsorbanceFromPercentTransmittanceOptions,
): Float64Array;
export function absorbanceFromPercentTransmittance(
  percent: number | Float64Array,
  options: AbsorbanceFromPercentTransmittanceOptions = {},
): number | Float64Array {
  if (typeof percent === 'number') {
    if (options.ceiling !== undefined && percent <= 100 * 10 ** -options.ceiling) return options.ceiling;
    if (!(percent > 0) || !Number.isFinite(percent)) throw badPercent(percent, 0, options);
    return 2 - Math.log10(percent);
  }
  const out = new Float64Array(percent.length);
  const floor = options.ceiling === undefined ? Number.NEGATIVE_INFINITY : 100 * 10 ** -options.ceiling;
  for (let i = 0; i < percent.length; i++) {
    const p = percent[i]!;
    if (p <= floor) {
      out[i] = options.ceiling!;
      continue;
    }
    if (!(p > 0) || !Number.isFinite(p)) throw badPercent(p, i, options);
    // 2 − log10(%T) rather than −log10(%T/100): one rounding fewer, and exact for %T = 1, 10, 100.
    out[i] = 2 - Math.log10(p);
  }
  return out;
}

function badPercent(
  value: number,
  index: number,
  options: AbsorbanceFromPercentTransmittanceOptions,
): BandshelfError {
  return new BandshelfError(
    'BAD_TRANSMITTANCE',
    `transmittance ${value} % is not > 0, so its absorbance would be infinite`,
    { file: options.file, line: options.lines?.[index], field: 'y' },
  );
}

// Converts transmittance (0–1) to decadic absorbance, A = −log10(T), refusing T ≤ 0 instead of returning Infinity.
import { BandshelfError } from '../../error.js';

export interface AbsorbanceFromTransmittanceOptions {
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
 * A = −log10(T) for T in (0, 1] (values above 1 are allowed and give negative absorbance, as noisy baselines
 * do). Elementwise on a Float64Array, returning a new array. T ≤ 0 or not finite → BandshelfError
 * BAD_TRANSMITTANCE: the absorbance would be infinite, and a library must never hold an infinite value.
 */
export function absorbanceFromTransmittance(
  transmittance: number,
  options?: AbsorbanceFromTransmittanceOptions,
): number;
export function absorbanceFromTransmittance(
  transmittance: Float64Array,
  options?: AbsorbanceFromTransmittanceOptions,
): Float64Array;
export function absorbanceFromTransmittance(
  transmittance: number | Float64Array,
  options: AbsorbanceFromTransmittanceOptions = {},
): number | Float64Array {
  if (typeof transmittance === 'number') {
    if (options.ceiling !== undefined && transmittance <= 10 ** -options.ceiling) return options.ceiling;
    if (!(transmittance > 0) || !Number.isFinite(transmittance))
      throw badTransmittance(transmittance, 0, options);
    return -Math.log10(transmittance);
  }
  const out = new Float64Array(transmittance.length);
  const floor = options.ceiling === undefined ? Number.NEGATIVE_INFINITY : 10 ** -options.ceiling;
  for (let i = 0; i < transmittance.length; i++) {
    const t = transmittance[i]!;
    if (t <= floor) {
      out[i] = options.ceiling!;
      continue;
    }
    if (!(t > 0) || !Number.isFinite(t)) throw badTransmittance(t, i, options);
    out[i] = -Math.log10(t);
  }
  return out;
}

function badTransmittance(
  value: number,
  index: number,
  options: AbsorbanceFromTransmittanceOptions,
): BandshelfError {
  return new BandshelfError(
    'BAD_TRANSMITTANCE',
    `transmittance ${value} is not > 0, so its absorbance would be infinite`,
    { file: options.file, line: options.lines?.[index], field: 'y' },
  );
}

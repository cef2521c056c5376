// Converts a file's abscissa and ordinate from their stated units to cm⁻¹ and decadic absorbance.

import { BandshelfError } from '../error.js';
import { ABSORBANCE_CEILING } from '../spectrum/types.js';
import { absorbanceFromPercentTransmittance } from '../spectrum/units/absorbanceFromPercentTransmittance.js';
import { absorbanceFromTransmittance } from '../spectrum/units/absorbanceFromTransmittance.js';
import { wavenumberFromMicrometres } from '../spectrum/units/wavenumberFromMicrometres.js';
import { wavenumberFromNanometres } from '../spectrum/units/wavenumberFromNanometres.js';
import type { XUnit, YUnit } from './types.js';

export interface ToWavenumberAbsorbanceOptions {
  /** Unit of `x`. @default 'cm-1' */
  xUnit?: XUnit;
  /** Unit of `y`. @default 'absorbance' */
  yUnit?: YUnit;
  /** File named in errors. @default undefined */
  file?: string;
  /** 1-based source line of each point, for errors. @default undefined */
  lines?: ArrayLike<number>;
  /** Absorbance ceiling: transmittance at or below 10^−ceiling (zero, negative noise) is clipped to it. @default 4 */
  absorbanceCeiling?: number;
}

/**
 * Returns new arrays (inputs untouched); NaN/Infinity → NOT_FINITE, T ≤ 10^−ceiling → the ceiling (saturated),
 * λ ≤ 0 → NOT_FINITE and a negative wavenumber → NOT_A_SPECTRUM (such an x is some other quantity), each
 * with its line. Zero is let through: the standard's own examples number their points from X = 0, and the
 * library's QC refuses a spectrum that covers none of its grid.
 */
export function toWavenumberAbsorbance(
  points: { x: Float64Array; y: Float64Array },
  options: ToWavenumberAbsorbanceOptions = {},
): { x: Float64Array; y: Float64Array } {
  const {
    xUnit = 'cm-1',
    yUnit = 'absorbance',
    file,
    lines,
    absorbanceCeiling = ABSORBANCE_CEILING,
  } = options;
  const where = { file, lines };
  const clip = { file, lines, ceiling: absorbanceCeiling };
  // Report NaN/Infinity as such before a unit conversion could word it as a bad wavelength or transmittance.
  const n = Math.min(points.x.length, points.y.length);
  for (let i = 0; i < n; i++) {
    const bad = !Number.isFinite(points.x[i]!) ? 'x' : !Number.isFinite(points.y[i]!) ? 'y' : undefined;
    if (bad !== undefined) {
      const value = bad === 'x' ? points.x[i] : points.y[i];
      throw new BandshelfError('NOT_FINITE', `${bad} = ${value} is not a finite number`, {
        file,
        line: lines?.[i],
        field: bad,
      });
    }
  }
  const x =
    xUnit === 'um'
      ? wavenumberFromMicrometres(points.x, where)
      : xUnit === 'nm'
        ? wavenumberFromNanometres(points.x, where)
        : xUnit === 'thz'
          ? positiveWavenumbers(points.x, file, lines).map((f) => f * CM_PER_THZ)
          : positiveWavenumbers(points.x, file, lines);
  const y =
    yUnit === 'transmittance'
      ? absorbanceFromTransmittance(points.y, clip)
      : yUnit === 'percent-transmittance'
        ? absorbanceFromPercentTransmittance(points.y, clip)
        : points.y.slice();
  return { x, y };
}

/** ν̃ = f / c: 1 THz is 10¹² s⁻¹ / 29 979 245 800 cm s⁻¹ (c exact, SI definition) = 33.356 409 52 cm⁻¹. */
const CM_PER_THZ = 1e12 / 29_979_245_800;

/** A copy of x in cm⁻¹; an infrared spectrum has no negative wavenumber. */
function positiveWavenumbers(x: Float64Array, file?: string, lines?: ArrayLike<number>): Float64Array {
  for (let i = 0; i < x.length; i++) {
    if (x[i]! < 0) {
      throw new BandshelfError(
        'NOT_A_SPECTRUM',
        `x = ${x[i]} cm⁻¹ is not a wavenumber (a wavenumber cannot be negative; give the x unit if x is something else)`,
        { file, line: lines?.[i], field: 'x' },
      );
    }
  }
  return x.slice();
}

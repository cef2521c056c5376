// Converts wavelength in nanometres to wavenumber in cm⁻¹ (ν̃ = 10⁷ / λ), for one value or a whole axis.
import { BandshelfError } from '../../error.js';

export interface WavenumberFromNanometresOptions {
  /** File named in the error when a wavelength is not positive. @default undefined */
  file?: string;
  /** Line number of each element (same length as the input), so an error can point at the line. @default undefined */
  lines?: ArrayLike<number>;
}

/**
 * ν̃ (cm⁻¹) = 10⁷ / λ (nm). Works elementwise on a Float64Array and returns a new array (the input is not
 * touched). A wavelength ≤ 0 or not finite has no wavenumber: BandshelfError NOT_FINITE rather than ±Infinity.
 */
export function wavenumberFromNanometres(
  nanometres: number,
  options?: WavenumberFromNanometresOptions,
): number;
export function wavenumberFromNanometres(
  nanometres: Float64Array,
  options?: WavenumberFromNanometresOptions,
): Float64Array;
export function wavenumberFromNanometres(
  nanometres: number | Float64Array,
  options: WavenumberFromNanometresOptions = {},
): number | Float64Array {
  if (typeof nanometres === 'number') {
    if (!(nanometres > 0) || !Number.isFinite(nanometres)) throw badWavelength(nanometres, 0, options);
    return 1e7 / nanometres;
  }
  const out = new Float64Array(nanometres.length);
  for (let i = 0; i < nanometres.length; i++) {
    const um = nanometres[i]!;
    if (!(um > 0) || !Number.isFinite(um)) throw badWavelength(um, i, options);
    out[i] = 1e7 / um;
  }
  return out;
}

function badWavelength(
  value: number,
  index: number,
  options: WavenumberFromNanometresOptions,
): BandshelfError {
  const line = options.lines?.[index];
  return new BandshelfError(
    'NOT_FINITE',
    `wavelength ${value} nm has no finite positive wavenumber (a wavelength must be > 0)`,
    { file: options.file, line, field: 'x' },
  );
}

// Converts wavelength in micrometres to wavenumber in cm⁻¹ (ν̃ = 10⁴ / λ), for one value or a whole axis.
import { BandshelfError } from '../../error.js';

export interface WavenumberFromMicrometresOptions {
  /** File named in the error when a wavelength is not positive. @default undefined */
  file?: string;
  /** Line number of each element (same length as the input), so an error can point at the line. @default undefined */
  lines?: ArrayLike<number>;
}

/**
 * ν̃ (cm⁻¹) = 10⁴ / λ (µm). Works elementwise on a Float64Array and returns a new array (the input is not
 * touched). A wavelength ≤ 0 or not finite has no wavenumber: BandshelfError NOT_FINITE rather than ±Infinity.
 */
export function wavenumberFromMicrometres(
  micrometres: number,
  options?: WavenumberFromMicrometresOptions,
): number;
export function wavenumberFromMicrometres(
  micrometres: Float64Array,
  options?: WavenumberFromMicrometresOptions,
): Float64Array;
export function wavenumberFromMicrometres(
  micrometres: number | Float64Array,
  options: WavenumberFromMicrometresOptions = {},
): number | Float64Array {
  if (typeof micrometres === 'number') {
    if (!(micrometres > 0) || !Number.isFinite(micrometres)) throw badWavelength(micrometres, 0, options);
    return 1e4 / micrometres;
  }
  const out = new Float64Array(micrometres.length);
  for (let i = 0; i < micrometres.length; i++) {
    const um = micrometres[i]!;
    if (!(um > 0) || !Number.isFinite(um)) throw badWavelength(um, i, options);
    out[i] = 1e4 / um;
  }
  return out;
}

function badWavelength(
  value: number,
  index: number,
  options: WavenumberFromMicrometresOptions,
): BandshelfError {
  const line = options.lines?.[index];
  return new BandshelfError(
    'NOT_FINITE',
    `wavelength ${value} µm has no finite positive wavenumber (a wavelength must be > 0)`,
    { file: options.file, line, field: 'x' },
  );
}

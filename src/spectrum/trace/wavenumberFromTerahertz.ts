// Converts optical frequency to wavenumber, ν̃ = f / c, for spectra that come out of a Fourier transform in THz.

/** Speed of light in vacuum, cm/s (exact by the SI definition of the metre). */
const C_CM_PER_S = 29_979_245_800;
/** cm⁻¹ per THz: 10¹² / c = 33.356 (common practice). */
const PER_THZ = 1e12 / C_CM_PER_S;

/**
 * Wavenumber in cm⁻¹ of a frequency in THz; elementwise into a new array for a Float64Array. A pure unit
 * conversion like the ones in `spectrum/units/`, so it takes no options.
 */
export function wavenumberFromTerahertz(frequency: number): number;
export function wavenumberFromTerahertz(frequency: Float64Array): Float64Array;
export function wavenumberFromTerahertz(frequency: number | Float64Array): number | Float64Array {
  if (typeof frequency === 'number') return frequency * PER_THZ;
  const out = new Float64Array(frequency.length);
  for (let i = 0; i < frequency.length; i++) out[i] = frequency[i]! * PER_THZ;
  return out;
}

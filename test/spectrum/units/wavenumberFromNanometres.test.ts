// Nanometres to wavenumber, checked on values of common practice.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../../src/error.js';
import { wavenumberFromMicrometres } from '../../../src/spectrum/units/wavenumberFromMicrometres.js';
import { wavenumberFromNanometres } from '../../../src/spectrum/units/wavenumberFromNanometres.js';

describe('wavenumberFromNanometres', () => {
  it('gives 1000 cm⁻¹ for 10 000 nm and 4000 cm⁻¹ for 2500 nm', () => {
    // common practice: ν̃ (cm⁻¹) = 10⁷ / λ (nm).
    expect(wavenumberFromNanometres(10000)).toBe(1000);
    expect(wavenumberFromNanometres(2500)).toBe(4000);
  });

  it('agrees with the micrometre conversion at λ(nm) = 1000 λ(µm)', () => {
    const um = Float64Array.from([2.7, 3.3, 6.1, 9.4, 16.2]);
    const nm = um.map((v) => v * 1000);
    const a = wavenumberFromMicrometres(um);
    const b = wavenumberFromNanometres(nm);
    for (let i = 0; i < um.length; i++) expect(b[i]).toBeCloseTo(a[i]!, 9);
  });

  it('refuses NaN and zero', () => {
    expect(() => wavenumberFromNanometres(Number.NaN)).toThrow(BandshelfError);
    expect(() => wavenumberFromNanometres(Float64Array.from([0]))).toThrow(/wavelength 0 nm/);
  });
});

// Micrometres to wavenumber, checked on values of common practice.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../../src/error.js';
import { wavenumberFromMicrometres } from '../../../src/spectrum/units/wavenumberFromMicrometres.js';

describe('wavenumberFromMicrometres', () => {
  it('gives 1000 cm⁻¹ for 10 µm and 4000 cm⁻¹ for 2.5 µm', () => {
    // common practice: ν̃ (cm⁻¹) = 10⁴ / λ (µm); 10 µm = 1000 cm⁻¹, 2.5 µm = 4000 cm⁻¹.
    expect(wavenumberFromMicrometres(10)).toBe(1000);
    expect(wavenumberFromMicrometres(2.5)).toBe(4000);
  });

  it('converts a whole axis elementwise and leaves the input alone', () => {
    const um = Float64Array.from([2.5, 5, 10, 25]);
    const out = wavenumberFromMicrometres(um);
    expect(Array.from(out)).toEqual([4000, 2000, 1000, 400]);
    expect(Array.from(um)).toEqual([2.5, 5, 10, 25]);
    expect(out).toBeInstanceOf(Float64Array);
  });

  it('refuses a wavelength of zero or below, naming file and line, instead of returning Infinity', () => {
    expect(() => wavenumberFromMicrometres(0)).toThrow(BandshelfError);
    try {
      wavenumberFromMicrometres(Float64Array.from([5, -1]), { file: 'a.csv', lines: [3, 4] });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(BandshelfError);
      expect((e as BandshelfError).code).toBe('NOT_FINITE');
      expect((e as BandshelfError).file).toBe('a.csv');
      expect((e as BandshelfError).line).toBe(4);
    }
  });
});

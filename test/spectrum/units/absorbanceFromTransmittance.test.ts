// Transmittance to absorbance, checked on values of common practice.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../../src/error.js';
import { absorbanceFromTransmittance } from '../../../src/spectrum/units/absorbanceFromTransmittance.js';

describe('absorbanceFromTransmittance', () => {
  it('reads a 10,000-fold attenuation as 4 absorbance units', () => {
    // common practice: A = −log10 T; attenuation by 10⁴ in power is 4 AU (OD).
    expect(absorbanceFromTransmittance(1e-4)).toBeCloseTo(4, 12);
    expect(absorbanceFromTransmittance(0.1)).toBeCloseTo(1, 12);
    expect(absorbanceFromTransmittance(1)).toBe(-0);
  });

  it('works elementwise, lets T > 1 give negative absorbance, and does not mutate its input', () => {
    const t = Float64Array.from([1, 0.5, 0.01, 1.1]);
    const a = absorbanceFromTransmittance(t);
    expect(a[0]).toBeCloseTo(0, 15);
    // log10(2) = 0.30103 (common practice).
    expect(a[1]).toBeCloseTo(0.30103, 5);
    expect(a[2]).toBeCloseTo(2, 12);
    expect(a[3]!).toBeLessThan(0);
    expect(Array.from(t)).toEqual([1, 0.5, 0.01, 1.1]);
  });

  it('refuses T ≤ 0 with BAD_TRANSMITTANCE and the line, never returning Infinity', () => {
    for (const bad of [0, -0.2, Number.NaN]) {
      expect(() => absorbanceFromTransmittance(bad)).toThrow(BandshelfError);
    }
    try {
      absorbanceFromTransmittance(Float64Array.from([0.5, 0, 0.3]), { file: 't.csv', lines: [10, 11, 12] });
      expect.unreachable();
    } catch (e) {
      const err = e as BandshelfError;
      expect(err.code).toBe('BAD_TRANSMITTANCE');
      expect(err.line).toBe(11);
      expect(err.oneLine()).toBe(
        't.csv:11: y: transmittance 0 is not > 0, so its absorbance would be infinite [BAD_TRANSMITTANCE]',
      );
    }
  });
});

// Percent transmittance to absorbance, checked on values of common practice.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../../src/error.js';
import { absorbanceFromPercentTransmittance } from '../../../src/spectrum/units/absorbanceFromPercentTransmittance.js';
import { absorbanceFromTransmittance } from '../../../src/spectrum/units/absorbanceFromTransmittance.js';

describe('absorbanceFromPercentTransmittance', () => {
  it('gives A = 2 for 1 %T, 0 for 100 %T and 4 for 0.01 %T', () => {
    // common practice: A = 2 − log10(%T).
    expect(absorbanceFromPercentTransmittance(1)).toBe(2);
    expect(absorbanceFromPercentTransmittance(100)).toBe(0);
    expect(absorbanceFromPercentTransmittance(0.01)).toBeCloseTo(4, 12);
  });

  it('matches the fractional conversion of %T / 100 elementwise', () => {
    const pct = Float64Array.from([95, 50, 12.5, 3, 0.7]);
    const a = absorbanceFromPercentTransmittance(pct);
    const b = absorbanceFromTransmittance(pct.map((p) => p / 100));
    for (let i = 0; i < pct.length; i++) expect(a[i]).toBeCloseTo(b[i]!, 12);
  });

  it('refuses %T ≤ 0', () => {
    expect(() => absorbanceFromPercentTransmittance(0)).toThrow(BandshelfError);
    expect(() => absorbanceFromPercentTransmittance(Float64Array.from([50, -3]))).toThrow(/-3 %/);
  });
});

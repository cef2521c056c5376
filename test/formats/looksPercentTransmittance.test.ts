// The %T hint for values without a stated unit.
import { describe, expect, it } from 'vitest';
import { looksPercentTransmittance } from '../../src/formats/looksPercentTransmittance.js';

describe('looksPercentTransmittance', () => {
  // Common practice: %T runs 0–100; absorbance rarely exceeds ~3 and a fraction never exceeds 1.
  it('says yes for values inside 0–100 reaching above 3', () => {
    expect(looksPercentTransmittance([12.5, 87.1, 99.9])).toBe(true);
  });
  it('says no for absorbance-sized or fraction-sized values and for values beyond 100.5', () => {
    expect(looksPercentTransmittance([0.02, 1.4, 2.9])).toBe(false);
    expect(looksPercentTransmittance([0.1, 0.95])).toBe(false);
    expect(looksPercentTransmittance([10, 101.9])).toBe(false);
    expect(looksPercentTransmittance([-0.5, 80])).toBe(false);
  });
  it('skips non-finite values', () => {
    expect(looksPercentTransmittance([Number.NaN, 40, 90])).toBe(true);
  });
});

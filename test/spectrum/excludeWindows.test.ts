// Tests of dropping the points inside exclusion windows.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { excludeWindows } from '../../src/spectrum/excludeWindows.js';

const spectrum = (x: number[], y: number[]) => ({
  wavenumber: Float64Array.from(x),
  absorbance: Float64Array.from(y),
});

describe('excludeWindows', () => {
  it('drops the atmospheric CO₂ stretch 2280–2400 cm⁻¹ (common practice), ends included', () => {
    const s = spectrum([2200, 2280, 2300, 2349, 2400, 2450], [1, 2, 3, 9, 4, 5]);
    const out = excludeWindows(s, [{ min: 2280, max: 2400 }]);
    expect(Array.from(out.wavenumber)).toEqual([2200, 2450]);
    expect(Array.from(out.absorbance)).toEqual([1, 5]);
  });

  it('drops several windows and leaves the input untouched', () => {
    const s = spectrum([1000, 1100, 1200, 1300, 1400, 1500], [1, 2, 3, 4, 5, 6]);
    const out = excludeWindows(s, [
      { min: 1050, max: 1150 },
      { min: 1350, max: 1450 },
    ]);
    expect(Array.from(out.wavenumber)).toEqual([1000, 1200, 1300, 1500]);
    expect(Array.from(s.wavenumber)).toEqual([1000, 1100, 1200, 1300, 1400, 1500]);
  });

  it('with no windows returns an equal copy', () => {
    const s = spectrum([1000, 1100], [1, 2]);
    const out = excludeWindows(s, []);
    expect(Array.from(out.absorbance)).toEqual([1, 2]);
    expect(out.absorbance).not.toBe(s.absorbance);
  });

  it('refuses windows that leave fewer than two points', () => {
    const s = spectrum([2300, 2350, 2450], [1, 2, 3]);
    expect(() => excludeWindows(s, [{ min: 2280, max: 2400 }])).toThrow(BandshelfError);
  });
});

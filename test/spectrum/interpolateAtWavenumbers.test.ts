// Tests of linear interpolation at given wavenumbers, NaN outside coverage and across wide gaps.
import { describe, expect, it } from 'vitest';
import { interpolateAtWavenumbers } from '../../src/spectrum/interpolateAtWavenumbers.js';

const s = {
  wavenumber: Float64Array.from([1000, 1002, 1004, 1040, 1042]),
  absorbance: Float64Array.from([0, 1, 3, 5, 4]),
};

describe('interpolateAtWavenumbers', () => {
  it('interpolates linearly between neighbours and is exact on source points', () => {
    const out = interpolateAtWavenumbers(s, Float64Array.from([1000, 1001, 1003.5, 1004, 1041.5, 1042]));
    expect(Array.from(out)).toEqual([0, 0.5, 2.5, 3, 4.25, 4]);
  });

  it('gives NaN outside the coverage and inside gaps wider than maxGap', () => {
    const out = interpolateAtWavenumbers(s, Float64Array.from([999, 1020, 1043]), { maxGap: 16 });
    expect(Array.from(out)).toEqual([Number.NaN, Number.NaN, Number.NaN]);
    // Without a limit the 36 cm⁻¹ gap is bridged: 3 + (5 − 3)·16/36.
    expect(interpolateAtWavenumbers(s, Float64Array.from([1020]))[0]).toBeCloseTo(3 + 32 / 36, 12);
  });

  it('reads an empty spectrum as not covered', () => {
    const empty = { wavenumber: new Float64Array(0), absorbance: new Float64Array(0) };
    expect(Number.isNaN(interpolateAtWavenumbers(empty, Float64Array.from([1]))[0]!)).toBe(true);
  });
});

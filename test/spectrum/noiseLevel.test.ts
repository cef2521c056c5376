// Tests of the noise estimate: RMS after a linear detrend inside a band-free window.
import { linearRegression, rootMeanSquare } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { noiseLevel } from '../../src/spectrum/noiseLevel.js';
import { mulberry32 } from '../mulberry32.js';

describe('noiseLevel', () => {
  it('returns the amplitude of a +e −e −e +e pattern on a sloped line in the default window', () => {
    // The pattern is orthogonal to both a constant and a line over each block of four, so the detrend
    // removes exactly the line and leaves residuals of magnitude e: RMS = e.
    const e = 0.0025;
    const x: number[] = [];
    const y: number[] = [];
    for (let k = 0; k < 40; k++) {
      const xi = 1900 + 2.5 * k;
      x.push(xi);
      y.push(0.5 + 1e-3 * (xi - 1900) + e * [1, -1, -1, 1][k % 4]!);
    }
    // A strong band outside the window must not count.
    x.unshift(1650);
    y.unshift(1.2);
    expect(noiseLevel({ wavenumber: Float64Array.from(x), absorbance: Float64Array.from(y) })).toBeCloseTo(
      e,
      12,
    );
  });

  it('equals a general-purpose library: simple-statistics linearRegression residuals and rootMeanSquare', () => {
    const rand = mulberry32(99);
    const x = Array.from({ length: 60 }, (_, i) => 2100 + 2 * i);
    const y = x.map((v) => 0.02 - 3e-5 * v + 0.004 * (rand() - 0.5));
    const fit = linearRegression(x.map((v, i) => [v, y[i]!]));
    const residuals = x.map((v, i) => y[i]! - (fit.m * v + fit.b));
    const expected = rootMeanSquare(residuals);
    const actual = noiseLevel(
      { wavenumber: Float64Array.from(x), absorbance: Float64Array.from(y) },
      { min: 2100, max: 2300 },
    );
    expect(actual).toBeCloseTo(expected, 10);
  });

  it('skips NaN and gives NaN when the spectrum does not reach the window', () => {
    const wavenumber = Float64Array.from([1000, 1100, 1200, 1300, 1400, 1500]);
    const absorbance = Float64Array.from([1, 2, 3, 4, 5, 6]);
    expect(noiseLevel({ wavenumber, absorbance })).toBeNaN();
    const withGap = Float64Array.from([1, Number.NaN, 3, 4, 5, 6]);
    // A straight line apart from the NaN point: zero noise over 1000–1500.
    expect(noiseLevel({ wavenumber, absorbance: withGap }, { min: 1000, max: 1500 })).toBeCloseTo(0, 12);
    expect(
      noiseLevel({ wavenumber, absorbance: withGap }, { min: 1000, max: 1500 }, { minPoints: 6 }),
    ).toBeNaN();
  });
});

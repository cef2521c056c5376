// Tests of the rubberband (lower convex hull) baseline by hand and under synthetic bands.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { rubberbandBaseline } from '../../src/spectrum/rubberbandBaseline.js';

const spectrum = (x: number[], y: number[]) => ({
  wavenumber: Float64Array.from(x),
  absorbance: Float64Array.from(y),
});

function gaussianBands(x: number, bands: [number, number, number][]): number {
  let s = 0;
  for (const [centre, fwhm, height] of bands)
    s += height * Math.exp(-4 * Math.LN2 * ((x - centre) / fwhm) ** 2);
  return s;
}

describe('rubberbandBaseline', () => {
  it('is the lower convex hull on a hand-checkable case', () => {
    // Points (0,1) (1,0) (2,2) (3,0.5) (4,1): the lower hull runs (0,1)–(1,0)–(3,0.5)–(4,1), so x = 2 lies on
    // the chord from (1,0) to (3,0.5): 0.25.
    const b = rubberbandBaseline(spectrum([0, 1, 2, 3, 4], [1, 0, 2, 0.5, 1]));
    expect(Array.from(b)).toEqual([1, 0, 0.25, 0.5, 1]);
  });

  it('drops collinear points and handles two points', () => {
    expect(Array.from(rubberbandBaseline(spectrum([0, 1, 2, 3], [0, 1, 2, 3])))).toEqual([0, 1, 2, 3]);
    expect(Array.from(rubberbandBaseline(spectrum([10, 12], [5, 1])))).toEqual([5, 1]);
  });

  it('removes a linear baseline under Gaussian bands to within 1e-9', () => {
    const x: number[] = [];
    const y: number[] = [];
    const base: number[] = [];
    for (let v = 1000; v <= 1800; v += 1) {
      x.push(v);
      base.push(0.4 - 0.0003 * (v - 1000));
      y.push(
        base.at(-1)! +
          gaussianBands(v, [
            [1652, 30, 1],
            [1545, 35, 0.6],
            [1240, 40, 0.3],
          ]),
      );
    }
    const b = rubberbandBaseline(spectrum(x, y));
    // Tolerance 1e-9: the band tails at the spectrum's ends are below 1e-40; what is left is rounding.
    for (let i = 0; i < x.length; i++) expect(Math.abs(b[i]! - base[i]!)).toBeLessThan(1e-9);
  });

  it('follows a convex quadratic baseline to within the chord sag under the bands', () => {
    const x: number[] = [];
    const y: number[] = [];
    const base: number[] = [];
    const c = 2e-7;
    for (let v = 1000; v <= 1800; v += 1) {
      x.push(v);
      base.push(0.1 + c * (v - 1400) ** 2);
      y.push(
        base.at(-1)! +
          gaussianBands(v, [
            [1652, 30, 1],
            [1240, 40, 0.3],
          ]),
      );
    }
    const b = rubberbandBaseline(spectrum(x, y));
    // Under a band the hull bridges a span L of the parabola; its chord sags at most c·(L/2)². The bands here
    // are bridged over well under 200 cm⁻¹, so the error stays below c·100² = 0.002 (0.2 % of the main band).
    let worst = 0;
    for (let i = 0; i < x.length; i++) {
      expect(b[i]!).toBeLessThanOrEqual(y[i]! + 1e-12);
      worst = Math.max(worst, Math.abs(b[i]! - base[i]!));
    }
    expect(worst).toBeLessThan(c * 100 ** 2);
    expect(worst).toBeGreaterThan(0);
  });

  it('never rises above the spectrum and passes through both ends', () => {
    let seed = 3;
    const rnd = () => {
      seed = (seed * 16807) % 2147483647;
      return seed / 2147483647;
    };
    const x = Array.from({ length: 300 }, (_, i) => 600 + i * 3.3);
    const y = x.map(() => rnd() * 2 - 0.5);
    const b = rubberbandBaseline(spectrum(x, y));
    for (let i = 0; i < x.length; i++) expect(b[i]!).toBeLessThanOrEqual(y[i]! + 1e-12);
    expect(b[0]).toBe(y[0]);
    expect(b[x.length - 1]).toBe(y.at(-1));
  });

  it('refuses too few points, non-ascending wavenumbers and non-finite values', () => {
    const code = (run: () => unknown) => {
      try {
        run();
      } catch (e) {
        return e instanceof BandshelfError ? e.code : 'other';
      }
      return 'none';
    };
    expect(code(() => rubberbandBaseline(spectrum([1], [1])))).toBe('TOO_FEW_POINTS');
    expect(code(() => rubberbandBaseline(spectrum([2, 1], [1, 1])))).toBe('NOT_MONOTONIC');
    expect(code(() => rubberbandBaseline(spectrum([1, 2, 3], [1, Number.NaN, 1])))).toBe('NOT_FINITE');
    expect(code(() => rubberbandBaseline(spectrum([1, 2, 3], [1, 1])))).toBe('BAD_FORMAT');
  });
});

// Tests of shoulder finding from the negative second derivative.
import { describe, expect, it } from 'vitest';
import { findPeaks } from '../../src/spectrum/findPeaks.js';
import { findShoulders } from '../../src/spectrum/findShoulders.js';

function mulberry32(seed: number): () => number {
  let a = seed;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
const normal = (rand: () => number) => () =>
  Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
/** A Gaussian band by its centre, FWHM and height. */
const gaussian = (x: number, centre: number, fwhm: number, height: number) =>
  height * Math.exp(-4 * Math.LN2 * ((x - centre) / fwhm) ** 2);

function build(n: number, first: number, step: number, f: (x: number) => number, noise = 0, seed = 1) {
  const gauss = normal(mulberry32(seed));
  const wavenumber = Float64Array.from({ length: n }, (_, i) => first + i * step);
  const absorbance = wavenumber.map((x) => f(x) + noise * gauss());
  return { wavenumber, absorbance };
}

describe('findShoulders', () => {
  it('finds a band on a slope steep enough to leave no maximum, and estimates its width and amplitude', () => {
    // Gaussian FWHM 12, height 0.2 (σ = 5.1, steepest slope 0.2·e^−½/σ ≈ 0.024) on a 0.03 per cm⁻¹ slope.
    const s = build(201, 1400.3, 1, (x) => 0.03 * (x - 1400) + gaussian(x, 1500, 12, 0.2));
    expect(findPeaks(s)).toEqual([]);
    const shoulders = findShoulders(s);
    expect(shoulders.length).toBe(1);
    const [sh] = shoulders;
    expect(Math.abs(sh!.position - 1500)).toBeLessThan(0.1);
    expect(sh!.height).toBeCloseTo(0.03 * 100 + 0.2, 2);
    // Estimates (Gaussian shape assumed); the 9-point smoothing of the derivative widens them a few per cent.
    expect(Math.abs(sh!.fwhm - 12) / 12).toBeLessThan(0.1);
    expect(Math.abs(sh!.prominence - 0.2) / 0.2).toBeLessThan(0.1);
  });

  it('finds the shoulder of an overlapped amide-I-like pair next to its peak, with noise', () => {
    // Main band 1655 (FWHM 24, height 1) and a weaker one at 1634 (FWHM 16, height 0.35) that makes no maximum.
    for (const seed of [1, 2, 3]) {
      const s = build(
        201,
        1450,
        2,
        (x) => gaussian(x, 1655, 24, 1) + gaussian(x, 1634, 16, 0.35) + gaussian(x, 1545, 24, 0.6),
        0.001,
        seed,
      );
      const peaks = findPeaks(s);
      expect(peaks.map((p) => Math.round(p.position))).toEqual([1545, 1655]);
      const shoulders = findShoulders(s, { peaks, window: 7 });
      expect(shoulders.length).toBe(1);
      // The stronger neighbour's curvature pulls the derivative minimum ~1 cm⁻¹ towards it.
      expect(Math.abs(shoulders[0]!.position - 1634)).toBeLessThan(1.5);
    }
  });

  it('reports no shoulder for an isolated band or for noise alone', () => {
    const single = build(1701, 600, 2, (x) => gaussian(x, 1650, 30, 1), 0.003, 9);
    expect(findShoulders(single)).toEqual([]);
    const flat = build(500, 1000, 2, () => 0.1, 0.003, 4);
    expect(findShoulders(flat, { minProminence: 0.05 })).toEqual([]);
  });
});

// Tests of shoulder finding from the negative second derivative.
import { describe, expect, it } from 'vitest';
import { findPeaks } from '../../src/spectrum/findPeaks.js';
import { findShoulders } from '../../src/spectrum/findShoulders.js';
import { gridAxis } from '../../src/spectrum/gridAxis.js';
import { resampleToGrid } from '../../src/spectrum/resampleToGrid.js';
import { mulberry32 } from '../mulberry32.js';

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

describe('findShoulders in broad noisy bands', () => {
  // A dried-film-like envelope (synthetic): the broad N–H/O–H band near 3300 cm⁻¹ and an amide I band, on the
  // 2 cm⁻¹ library grid, with seeded white noise of 0.3 % of the broad band's height.
  const envelope = (x: number) => gaussian(x, 3300, 150, 0.3) + gaussian(x, 1652, 30, 1);

  it('finds no run of shoulders inside the broad band, whatever the noise draw', () => {
    for (const seed of [1, 2, 3, 4, 5, 6]) {
      const s = build(1701, 600, 2, envelope, 0.001, seed);
      const shoulders = findShoulders(s, { peaks: findPeaks(s) });
      expect(
        shoulders.map((p) => Math.round(p.position)),
        `seed ${seed}`,
      ).toEqual([]);
    }
  });

  it('reads the noise from the derivative, so a grid interpolated from coarser points is no easier to fool', () => {
    // Sampled every 4 cm⁻¹ and linearly interpolated onto the 2 cm⁻¹ grid: every other second difference is 0,
    // so a noise estimate from second differences of the data reads near zero here.
    for (const seed of [1, 2, 3]) {
      const coarse = build(851, 600, 4, envelope, 0.001, seed);
      const grid = { start: 4000, stop: 600, step: 2 };
      const absorbance = resampleToGrid(coarse, grid, { maxGap: 16 });
      const s = { wavenumber: gridAxis(grid), absorbance };
      const shoulders = findShoulders(s, { peaks: findPeaks(s) });
      expect(
        shoulders.map((p) => Math.round(p.position)),
        `seed ${seed}`,
      ).toEqual([]);
    }
  });

  it('still finds a real shoulder next to a peak among the noise, and keeps shoulders apart', () => {
    // A lactate-like COO⁻ band at 1417 (FWHM 18) on the flank of a stronger 1400 band, plus the envelope.
    const f = (x: number) => envelope(x) + gaussian(x, 1400, 30, 0.3) + gaussian(x, 1417, 18, 0.12);
    for (const seed of [1, 2, 3]) {
      const s = build(1701, 600, 2, f, 0.0005, seed);
      const peaks = findPeaks(s);
      const shoulders = findShoulders(s, { peaks });
      expect(shoulders.length, `seed ${seed}`).toBe(1);
      // The stronger neighbour's curvature pulls the minimum a little towards it.
      expect(Math.abs(shoulders[0]!.position - 1417), `seed ${seed}`).toBeLessThan(3);
      // Default minimum separation from the peaks: half the 9-point window × 2 cm⁻¹ = 8 cm⁻¹.
      for (const p of peaks) expect(Math.abs(shoulders[0]!.position - p.position)).toBeGreaterThanOrEqual(8);
    }
  });

  it('keeps only the deepest of minima closer than minSeparation, and drops those shallower than minDepth', () => {
    // Two narrow bands 6 cm⁻¹ apart on the flank of a strong one (noise-free, 1 cm⁻¹ spacing, 5-point window).
    const f = (x: number) =>
      gaussian(x, 1500, 40, 1) + gaussian(x, 1531, 6, 0.04) + gaussian(x, 1537, 6, 0.05);
    const s = build(401, 1300, 1, f);
    const peaks = findPeaks(s);
    expect(peaks.map((p) => Math.round(p.position))).toEqual([1500]);
    const options = { peaks, window: 5, minProminence: 0 };
    expect(findShoulders(s, { ...options, minSeparation: 4 }).map((p) => Math.round(p.position))).toEqual([
      1531, 1537,
    ]);
    // 10 cm⁻¹ apart at least: the deeper trough (the stronger band, further from the big band's curvature) stays.
    expect(findShoulders(s, { ...options, minSeparation: 10 }).map((p) => Math.round(p.position))).toEqual([
      1537,
    ]);
    // With noise, a depth requirement far above it leaves nothing.
    const noisy = build(401, 1300, 1, f, 0.0005, 2);
    expect(findShoulders(noisy, { ...options, peaks: findPeaks(noisy), minDepth: 1000 })).toEqual([]);
  });
});

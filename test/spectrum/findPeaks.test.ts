// Tests of band finding: the pharmacopoeia's polystyrene check positions, and small cases checked by hand.
import { describe, expect, it } from 'vitest';
import { findPeaks } from '../../src/spectrum/findPeaks.js';
import { mulberry32 } from '../mulberry32.js';

/** mulberry32: a tiny seeded generator so the noise is the same on every run. */
/** Box–Muller: standard normal deviates from uniform ones. */
function normal(rand: () => number): () => number {
  return () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
}

// European Pharmacopoeia 2.2.24 polystyrene wavenumber-check positions (cm⁻¹). The relative heights are
// invented for this synthetic spectrum.
const polystyrene: [position: number, height: number][] = [
  [3060.0, 0.6],
  [2849.5, 0.5],
  [1942.9, 0.15],
  [1601.2, 0.7],
  [1583.0, 0.3],
  [1154.5, 0.35],
  [1028.3, 0.8],
];
const FWHM = 6;

/** 1 cm⁻¹ sampling offset by 0.37 cm⁻¹ so no band centre falls on a point; noise σ = 0.001 (SNR 150–800). */
function polystyreneSpectrum(shape: 'gaussian' | 'lorentzian', seed: number) {
  const gauss = normal(mulberry32(seed));
  const n = 2301;
  const wavenumber = new Float64Array(n);
  const absorbance = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = 900.37 + i;
    let y = 0;
    for (const [c, h] of polystyrene) {
      const u = (2 * (x - c)) / FWHM;
      y += shape === 'gaussian' ? h * Math.exp(-Math.LN2 * u * u) : h / (1 + u * u);
    }
    wavenumber[i] = x;
    absorbance[i] = y + 0.001 * gauss();
  }
  return { wavenumber, absorbance };
}

describe('findPeaks on the pharmacopoeia polystyrene positions', () => {
  for (const shape of ['gaussian', 'lorentzian'] as const) {
    for (const seed of [1, 2, 3]) {
      it(`recovers every ${shape} band within 0.3 cm⁻¹ and its FWHM within 5 % (seed ${seed})`, () => {
        const peaks = findPeaks(polystyreneSpectrum(shape, seed));
        // The default threshold (1 % of the range or 10 noise σ) keeps the seven bands and no noise maxima.
        expect(peaks.length).toBe(polystyrene.length);
        for (const [position, height] of polystyrene) {
          const found = peaks.find((p) => Math.abs(p.position - position) < 3);
          expect(found, `band at ${position}`).toBeDefined();
          // European Pharmacopoeia 2.2.24 positions; 0.3 cm⁻¹ is this project's target (tighter than the ±1 cm⁻¹ check).
          expect(Math.abs(found!.position - position)).toBeLessThan(0.3);
          expect(Math.abs(found!.height - height)).toBeLessThan(0.05 * height + 0.01);
          if (shape === 'lorentzian' && position === 1583.0) {
            // The stronger 1601.2 band's Lorentzian wing holds the valley between them ~0.2 up, so half the
            // *prominence* sits higher on the 1583 band than half its height: narrower by definition.
            expect(found!.fwhm).toBeLessThan(FWHM);
            expect(found!.fwhm).toBeGreaterThan(0.6 * FWHM);
          } else {
            expect(Math.abs(found!.fwhm - FWHM) / FWHM).toBeLessThan(0.05);
          }
        }
      });
    }
  }
});

describe('findPeaks by hand', () => {
  // Maxima with equal neighbours, so the parabola vertex sits on the point and heights are the samples.
  const x = Float64Array.from([0, 1, 2, 3, 4, 5, 6, 7, 8]);
  const y = Float64Array.from([1, 3, 1, 2, 4, 2, 0, 6, 0]);

  it('computes topographic prominence and the width at half prominence', () => {
    const peaks = findPeaks({ wavenumber: x, absorbance: y }, { minProminence: 0 });
    expect(peaks.map((p) => p.position)).toEqual([1, 4, 7]);
    expect(peaks.map((p) => p.height)).toEqual([3, 4, 6]);
    // Peak 1: lowest points before a higher one are 1 (left) and 1 (right): 3 − 1 = 2.
    // Peak 4: left reaches the edge with minimum 1, right stops at 6 with minimum 0: base max(1, 0) = 1, 4 − 1 = 3.
    // Peak 7: the highest, bases 0 and 0: 6.
    expect(peaks.map((p) => p.prominence)).toEqual([2, 3, 6]);
    // Peak 4: level 2.5 crosses at 3.25 and 4.75 (linear between neighbours): 1.5. Peak 7: level 3 at 6.5 and 7.5.
    expect(peaks.map((p) => p.fwhm)).toEqual([1, 1.5, 1]);
  });

  it('applies minProminence and maxPeaks (most prominent kept, still ordered by position)', () => {
    expect(
      findPeaks({ wavenumber: x, absorbance: y }, { minProminence: 2.5 }).map((p) => p.position),
    ).toEqual([4, 7]);
    expect(
      findPeaks({ wavenumber: x, absorbance: y }, { minProminence: 0, maxPeaks: 2 }).map((p) => p.position),
    ).toEqual([4, 7]);
  });

  it('finds the vertex of a parabola sampled at uneven spacing exactly', () => {
    // y = 5 − (x − 2.3)²: the three points around the maximum lie on it, so the vertex is exact.
    const xs = Float64Array.from([1, 2, 2.5, 4]);
    const ys = xs.map((v) => 5 - (v - 2.3) ** 2);
    const [peak] = findPeaks({ wavenumber: xs, absorbance: ys }, { minProminence: 0 });
    expect(peak!.position).toBeCloseTo(2.3, 12);
    expect(peak!.height).toBeCloseTo(5, 12);
  });

  it('places a flat top at its middle', () => {
    const xs = Float64Array.from([10, 12, 14, 16, 18, 20, 22]);
    const ys = Float64Array.from([0, 1, 3, 3, 3, 1, 0]);
    const [peak] = findPeaks({ wavenumber: xs, absorbance: ys }, { minProminence: 0 });
    expect(peak!.position).toBe(16);
    expect(peak!.height).toBe(3);
    expect(peak!.prominence).toBe(3);
    // Level 1.5 crosses at 12.5 and 19.5.
    expect(peak!.fwhm).toBeCloseTo(7, 12);
  });

  it('treats NaN (not covered) as an end of the data', () => {
    const xs = Float64Array.from([0, 1, 2, 3, 4, 5]);
    const ys = Float64Array.from([0, 1, Number.NaN, 0, 2, 0]);
    const peaks = findPeaks({ wavenumber: xs, absorbance: ys }, { minProminence: 0 });
    // Index 1 has no finite right neighbour, so it is not a maximum; index 4's walk left stops at the NaN.
    expect(peaks.map((p) => [p.position, p.prominence])).toEqual([[4, 2]]);
  });

  it('finds nothing in a flat or monotonic spectrum', () => {
    const xs = Float64Array.from([0, 1, 2, 3]);
    expect(findPeaks({ wavenumber: xs, absorbance: Float64Array.from([1, 1, 1, 1]) })).toEqual([]);
    expect(findPeaks({ wavenumber: xs, absorbance: Float64Array.from([1, 2, 3, 4]) })).toEqual([]);
  });
});

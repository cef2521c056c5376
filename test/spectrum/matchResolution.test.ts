// Resolution matching by Gaussian convolution: band widths after convolution against their analytic values.
import { describe, expect, it } from 'vitest';
import { matchResolution } from '../../src/spectrum/matchResolution.js';

/** An invented band sampled evenly at spacing h over [lo, hi]. */
function sampled(shape: (x: number) => number, lo: number, hi: number, h: number) {
  const n = Math.round((hi - lo) / h) + 1;
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    x[i] = lo + i * h;
    y[i] = shape(x[i]!);
  }
  return { wavenumber: x, absorbance: y };
}

/** Full width at half maximum, with the half-height crossings found by linear interpolation. */
function fwhm(s: { wavenumber: Float64Array; absorbance: Float64Array }): number {
  const { wavenumber: x, absorbance: y } = s;
  let top = 0;
  for (let i = 1; i < y.length; i++) if (y[i]! > y[top]!) top = i;
  const half = y[top]! / 2;
  let l = top;
  while (l > 0 && y[l]! > half) l--;
  let r = top;
  while (r < y.length - 1 && y[r]! > half) r++;
  const left = x[l]! + ((half - y[l]!) / (y[l + 1]! - y[l]!)) * (x[l + 1]! - x[l]!);
  const right = x[r - 1]! + ((y[r - 1]! - half) / (y[r - 1]! - y[r]!)) * (x[r]! - x[r - 1]!);
  return right - left;
}

function trapezoid(s: { wavenumber: Float64Array; absorbance: Float64Array }): number {
  let area = 0;
  for (let i = 1; i < s.wavenumber.length; i++) {
    area += ((s.absorbance[i]! + s.absorbance[i - 1]!) / 2) * (s.wavenumber[i]! - s.wavenumber[i - 1]!);
  }
  return area;
}

const gaussian = (centre: number, width: number) => (x: number) =>
  Math.exp(-4 * Math.LN2 * ((x - centre) / width) ** 2);
const lorentzian = (centre: number, width: number) => (x: number) =>
  1 / (1 + ((2 * (x - centre)) / width) ** 2);

describe('matchResolution', () => {
  it('widens a Gaussian band to √(w² + target² − own²): Gaussian widths add in quadrature (common practice)', () => {
    const band = sampled(gaussian(1500, 6), 1400, 1600, 0.25);
    const out = matchResolution(band, { own: 2, target: 8 });
    // 6² + 8² − 2² = 96.
    expect(fwhm(out)).toBeCloseTo(Math.sqrt(96), 2);
  });

  it('turns a Lorentzian into a Voigt of the width Olivero & Longbothum (JQSRT 17:233, 1977) give', () => {
    // f_V ≈ 0.5346 f_L + √(0.2166 f_L² + f_G²), accurate to 0.02 % (Olivero & Longbothum 1977).
    const fL = 10;
    const band = sampled(lorentzian(2000, fL), 1000, 3000, 0.2);
    for (const [own, target] of [
      [0, 4],
      [2, 6],
      [4, 16],
    ] as const) {
      const fG = Math.sqrt(target * target - own * own);
      const expected = 0.5346 * fL + Math.sqrt(0.2166 * fL * fL + fG * fG);
      const measured = fwhm(matchResolution(band, { own, target }));
      // 0.02 % for the approximation plus up to 0.06 % from drawing the band's top as line segments 0.2 cm⁻¹ long.
      expect(Math.abs(measured - expected) / expected).toBeLessThan(1e-3);
    }
  });

  it('keeps the band area on evenly spaced data, at spacings finer and coarser than the kernel (common practice)', () => {
    for (const h of [0.5, 1, 1.93, 4]) {
      const band = sampled(gaussian(1500, 12), 1300, 1700, h);
      const out = matchResolution(band, { own: 1, target: 6 });
      expect(Math.abs(trapezoid(out) - trapezoid(band)) / trapezoid(band)).toBeLessThan(1e-6);
    }
  });

  it('leaves a spectrum at or coarser than the target unchanged, as a copy', () => {
    const band = sampled(gaussian(1500, 6), 1400, 1600, 1);
    const out = matchResolution(band, { own: 8, target: 4 });
    expect(Array.from(out.absorbance)).toEqual(Array.from(band.absorbance));
    expect(out.absorbance).not.toBe(band.absorbance);
  });

  it('does not draw across a gap wider than maxGap, nor pull the ends towards zero', () => {
    // Two flat stretches, level 1 and 3, with a 50 cm⁻¹ hole between them (invented): the convolution of a
    // constant is the constant when the kernel is renormalised over the data it covers; only the Gaussian's far tail
    // (below 10⁻⁸ of its area at 50 cm⁻¹ = 5.9 σ) reaches real data beyond the hole.
    const left = sampled(() => 1, 1000, 1100, 1);
    const right = sampled(() => 3, 1150, 1250, 1);
    const s = {
      wavenumber: Float64Array.from([...left.wavenumber, ...right.wavenumber]),
      absorbance: Float64Array.from([...left.absorbance, ...right.absorbance]),
    };
    const copy = Float64Array.from(s.absorbance);
    const out = matchResolution(s, { own: 0, target: 20, maxGap: 16 });
    for (let i = 0; i < out.absorbance.length; i++) {
      expect(out.absorbance[i]).toBeCloseTo(s.wavenumber[i]! <= 1100 ? 1 : 3, 7);
    }
    expect(Array.from(s.absorbance)).toEqual(Array.from(copy));
  });
});

// Tests of the SNR estimate: noise as the RMS after a linear detrend in a band-free window.
import { linearRegression, rootMeanSquare } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { estimateSnr } from '../../src/spectrum/estimateSnr.js';
import { mulberry32 } from '../mulberry32.js';

function film(noise: number, seed: number) {
  const rnd = mulberry32(seed);
  const gauss = () => Math.sqrt(-2 * Math.log(1 - rnd())) * Math.cos(2 * Math.PI * rnd());
  const wavenumber = Float64Array.from({ length: 3401 }, (_, i) => 600 + i);
  const absorbance = wavenumber.map(
    (x) => 0.05 + 2e-5 * x + 0.8 * Math.exp(-4 * Math.LN2 * ((x - 1652) / 30) ** 2) + noise * gauss(),
  );
  return { wavenumber, absorbance };
}

describe('estimateSnr', () => {
  it('reads the noise as the RMS after a straight-line fit in 1900–2000 cm⁻¹', () => {
    const s = film(1e-3, 8);
    const { noise, range, snr } = estimateSnr(s);
    // Outside check: the same detrend and RMS by a general-purpose statistics library.
    const pairs: [number, number][] = [];
    s.wavenumber.forEach((x, i) => {
      if (x >= 1900 && x <= 2000) pairs.push([x - 1950, s.absorbance[i]!]);
    });
    const line = linearRegression(pairs);
    const residuals = pairs.map(([x, y]) => y - (line.m * x + line.b));
    expect(noise).toBeCloseTo(rootMeanSquare(residuals), 12);
    // And the seeded noise's own σ, to within the sampling error of 101 points (≈ 7 %).
    expect(Math.abs(noise - 1e-3) / 1e-3).toBeLessThan(0.2);
    expect(snr).toBeCloseTo(range / noise, 12);
  });

  it('takes the signal range from another spectrum when given', () => {
    const s = film(1e-3, 9);
    const flat = { wavenumber: s.wavenumber, absorbance: s.absorbance.map((_v, i) => (i === 0 ? 0 : 0.5)) };
    const out = estimateSnr(s, { signal: flat });
    expect(out.range).toBe(0.5);
    expect(out.snr).toBeCloseTo(0.5 / out.noise, 12);
  });

  it('has no estimate when the window is not covered, and infinite SNR without noise', () => {
    const tunable = {
      wavenumber: Float64Array.from([1000, 1001, 1002]),
      absorbance: Float64Array.from([0, 1, 0]),
    };
    expect(Number.isNaN(estimateSnr(tunable).snr)).toBe(true);
    // Noise-free on a slope: only rounding is left after the detrend.
    expect(estimateSnr(film(0, 1)).snr).toBeGreaterThan(1e12);
    const constant = {
      wavenumber: Float64Array.from([1900, 1950, 2000]),
      absorbance: Float64Array.from([1, 1, 1]),
    };
    expect(estimateSnr(constant, { window: { min: 1800, max: 2100 } }).noise).toBeNaN();
    const flat = {
      wavenumber: Float64Array.from({ length: 11 }, (_, i) => 1900 + 10 * i),
      absorbance: Float64Array.from({ length: 11 }, (_, i) => (i === 0 ? 0.75 : 0.25)),
    };
    expect(estimateSnr(flat, { window: { min: 1905, max: 2000 } }).snr).toBe(Number.POSITIVE_INFINITY);
    expect(estimateSnr(film(1e-3, 2), { window: { min: 3000, max: 3200 } }).noise).toBeGreaterThan(0);
  });
});

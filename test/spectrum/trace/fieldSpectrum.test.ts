// The trace FFT against closed forms: a direct DFT, the Gaussian time–bandwidth product, and the THz → cm⁻¹ factor.
import { describe, expect, it } from 'vitest';
import { fieldSpectrum } from '../../../src/spectrum/trace/fieldSpectrum.js';
import type { Trace } from '../../../src/spectrum/trace/types.js';
import { wavenumberFromTerahertz } from '../../../src/spectrum/trace/wavenumberFromTerahertz.js';
import { zeroFill } from '../../../src/spectrum/trace/zeroFill.js';
import { uniformTrace } from './uniformTrace.js';

/** Full width at half maximum of a sampled peak, with the half-maximum crossings found by linear interpolation. */
function fwhm(x: Float64Array, y: Float64Array): number {
  let peak = 0;
  for (let i = 1; i < y.length; i++) if (y[i]! > y[peak]!) peak = i;
  const half = y[peak]! / 2;
  let left = peak;
  while (left > 0 && y[left]! > half) left--;
  let right = peak;
  while (right < y.length - 1 && y[right]! > half) right++;
  const cross = (a: number, b: number) => x[a]! + ((half - y[a]!) / (y[b]! - y[a]!)) * (x[b]! - x[a]!);
  return cross(right - 1, right) - cross(left, left + 1);
}

describe('fieldSpectrum', () => {
  it('equals a direct DFT of a small hand-checkable trace (scaled by the step)', () => {
    // x = [1, 2, 0, −1] sampled every 2 fs: X_k = Σ xₙ e^(−2πikn/4) by hand is X₀ = 2, X₁ = 1 − 3i, X₂ = 0.
    const trace: Trace = { time: Float64Array.from([0, 2, 4, 6]), field: Float64Array.from([1, 2, 0, -1]) };
    const s = fieldSpectrum(trace);
    expect(Array.from(s.frequency)).toEqual([0, 125, 250]); // 1 / (4 × 2 fs) = 125 THz per bin
    expect(s.real[0]).toBeCloseTo(2 * 2, 12);
    expect(s.imag[0]).toBeCloseTo(0, 12);
    expect(s.real[1]).toBeCloseTo(1 * 2, 12);
    expect(s.imag[1]).toBeCloseTo(-3 * 2, 12);
    expect(s.real[2]).toBeCloseTo(0, 12);
    expect(s.power[1]).toBeCloseTo(40, 10);
  });

  it('agrees with a direct DFT on a seeded random trace of 256 samples', () => {
    let state = 12345;
    const rand = () => {
      state = (1103515245 * state + 12345) % 2147483648;
      return state / 2147483648 - 0.5;
    };
    const n = 256;
    const trace = uniformTrace(n, 1.5, 10, () => rand());
    const s = fieldSpectrum(trace);
    for (const k of [0, 1, 17, 64, 127, 128]) {
      let re = 0;
      let im = 0;
      for (let j = 0; j < n; j++) {
        re += trace.field[j]! * Math.cos((2 * Math.PI * k * j) / n);
        im -= trace.field[j]! * Math.sin((2 * Math.PI * k * j) / n);
      }
      expect(s.real[k]).toBeCloseTo(re * 1.5, 9);
      expect(s.imag[k]).toBeCloseTo(im * 1.5, 9);
    }
  });

  it('zero-fills a length that is not a power of two and can drop the zero-frequency bin', () => {
    const trace = uniformTrace(100, 1, 0, (t) => Math.cos(t / 5));
    const s = fieldSpectrum(trace, { dropZero: true });
    expect(s.frequency.length).toBe(64); // padded to 128, bins 1 … 64
    expect(s.frequency[0]).toBeCloseTo(1000 / 128, 12);
  });

  it('gives a Gaussian pulse a Gaussian spectrum whose FWHM × duration FWHM is 0.441', () => {
    // Time–bandwidth product of a transform-limited Gaussian pulse, FWHM of |E(t)|² × FWHM of |E(f)|² = 2 ln 2 / π
    // = 0.4413 (common practice; any optics text).
    const tau = 15; // fs, FWHM of the intensity envelope
    const carrier = 60; // THz
    const pulse = uniformTrace(
      4096,
      1,
      -2048,
      (t) => Math.exp((-2 * Math.LN2 * t * t) / (tau * tau)) * Math.cos(2 * Math.PI * carrier * 1e-3 * t),
    );
    const envelope = new Float64Array(pulse.time.length);
    for (let i = 0; i < envelope.length; i++)
      envelope[i] = Math.exp((-4 * Math.LN2 * pulse.time[i]! ** 2) / (tau * tau));
    const measuredTau = fwhm(pulse.time, envelope);
    const s = fieldSpectrum(zeroFill(pulse, { factor: 4 }));
    const bandwidth = fwhm(s.frequency, s.power) * 1e-3; // THz → fs⁻¹
    expect(Math.abs(measuredTau / tau - 1)).toBeLessThan(0.002);
    const product = measuredTau * bandwidth;
    expect(Math.abs(product / 0.4413 - 1)).toBeLessThan(0.01);
    // The power peaks at the carrier.
    let peak = 0;
    for (let k = 1; k < s.power.length; k++) if (s.power[k]! > s.power[peak]!) peak = k;
    expect(Math.abs(s.frequency[peak]! - carrier)).toBeLessThanOrEqual(s.frequency[1]!);
  });
});

describe('wavenumberFromTerahertz', () => {
  it('converts 1 THz to 33.356 cm⁻¹ and 30 THz to about 1000.7 cm⁻¹', () => {
    // 1 THz = 33.356 cm⁻¹ (common practice), ν̃ = f / c with c = 299 792 458 m/s (SI definition).
    expect(wavenumberFromTerahertz(1)).toBeCloseTo(33.356, 3);
    expect(wavenumberFromTerahertz(29.9792458)).toBeCloseTo(1000, 9);
    const many = wavenumberFromTerahertz(Float64Array.from([0, 1, 120]));
    expect(many[2]).toBeCloseTo(4002.8, 1);
    expect(many[0]).toBe(0);
  });
});

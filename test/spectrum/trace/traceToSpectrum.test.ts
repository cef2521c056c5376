// Sample and reference traces to absorbance, checked against closed forms: a free-induction decay's Lorentzian,
// attenuation in absorbance units, the white-noise floor of a Fourier transform, and a Gaussian's coverage edges.
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../src/demo/seededRandom.js';
import { BandshelfError } from '../../../src/error.js';
import { traceToSpectrum } from '../../../src/spectrum/trace/traceToSpectrum.js';
import type { Trace } from '../../../src/spectrum/trace/types.js';
import { uniformTrace } from './uniformTrace.js';

/** cm⁻¹ per THz, 10¹² / c with c = 299 792 458 m/s (SI definition). */
const PER_THZ = 1e12 / 29_979_245_800;

/** A transform-limited Gaussian pulse: intensity FWHM `tau` fs, carrier `carrier` THz, peak at `t0` fs. */
function gaussianPulse(t0: number, tau: number, carrier: number, amplitude = 1) {
  return (t: number) =>
    amplitude *
    Math.exp((-2 * Math.LN2 * (t - t0) ** 2) / (tau * tau)) *
    Math.cos(2 * Math.PI * carrier * 1e-3 * (t - t0));
}

function scaled(trace: Trace, factor: number): Trace {
  return { time: trace.time, field: trace.field.map((v) => v * factor) };
}

describe('traceToSpectrum: absorbance from attenuation', () => {
  const reference = uniformTrace(2048, 1, 0, gaussianPulse(600, 12, 55));

  it('reads a sample attenuated 10,000-fold in power (100-fold in field) as 4 absorbance units', () => {
    // A = −log10(P_s / P_r): a 10⁴ attenuation of power is 4 absorbance units (common practice).
    const result = traceToSpectrum(scaled(reference, 0.01), reference, { apodisation: 'hann' });
    expect(result.spectrum.absorbance.length).toBeGreaterThan(100);
    for (const a of result.spectrum.absorbance) expect(a).toBeCloseTo(4, 9);
  });

  it('reads a 10⁶ attenuation of the field as a 10¹² attenuation of power, 12 absorbance units', () => {
    // Power goes as the field squared: 10¹² in power is 10⁶ in field amplitude (common practice).
    const result = traceToSpectrum(scaled(reference, 1e-6), reference, { apodisation: 'none' });
    for (const a of result.spectrum.absorbance) expect(a).toBeCloseTo(12, 8);
  });

  it('returns ascending wavenumbers around the carrier and a spacing of 1 / (N Δt) converted to cm⁻¹', () => {
    const result = traceToSpectrum(reference, reference, { zeroFill: 2 });
    const w = result.spectrum.wavenumber;
    for (let i = 1; i < w.length; i++) expect(w[i]!).toBeGreaterThan(w[i - 1]!);
    // 2048 samples × zero-fill 2 at 1 fs: bins of 1000 / 4096 THz.
    expect(result.spacing).toBeCloseTo((1000 / 4096) * PER_THZ, 9);
    expect(result.coverage.min).toBeLessThan(55 * PER_THZ);
    expect(result.coverage.max).toBeGreaterThan(55 * PER_THZ);
    expect(result.timingSpreadAs).toBeNull();
    expect(result.timingJitterAs).toBeNull();
  });

  it('records the record length’s resolution 1/(c·T) and warns when it is coarser than two grid steps', () => {
    // Standard Fourier pair (common practice): a record of length T resolves 1/T in frequency, 1/(c·T) in
    // wavenumber; zero-filling does not change it. 2048 samples at 1 fs span T = 2047 fs: 1/(c·T) = 16.29 cm⁻¹.
    const expected = 1 / (29_979_245_800 * 2047e-15);
    const coarse = traceToSpectrum(reference, reference, { zeroFill: 4 }, { gridStep: 2 });
    expect(coarse.recordResolution).toBeCloseTo(expected, 9);
    expect(coarse.spacing).toBeLessThan(coarse.recordResolution / 4);
    expect(coarse.warnings.some((w) => w.message.includes('1/(c·T) is 16.3 cm⁻¹'))).toBe(true);
    const fine = traceToSpectrum(reference, reference, { zeroFill: 4 }, { gridStep: 10 });
    expect(fine.warnings.some((w) => w.message.includes('1/(c·T)'))).toBe(false);
    // A gate narrows the record: 400–1400 fs is T = 1000 fs, 1/(c·T) = 33.36 cm⁻¹.
    const gated = traceToSpectrum(reference, reference, { gate: { start: 400, end: 1400, edge: 20 } });
    expect(gated.recordResolution).toBeCloseTo(1 / (29_979_245_800 * 1000e-15), 9);
  });
});

describe('traceToSpectrum: a free-induction decay gives a Lorentzian band', () => {
  it('puts the band at the resonance (±0.5 cm⁻¹) with FWHM = 1 / (π c T₂)', () => {
    // Standard Fourier pair: a response cos(2π f₀ t)·e^(−t/T₂) for t ≥ 0 transforms to a Lorentzian of FWHM 1/(π T₂)
    // in frequency, i.e. 1/(π c T₂) in wavenumber. The sample field is the reference pulse minus the pulse convolved
    // with that response (the molecule's re-emitted field), built here directly in the time domain.
    const step = 1; // fs
    const n = 16384;
    const t0 = 500;
    const nu0 = 1650; // cm⁻¹
    const f0 = nu0 / PER_THZ; // THz
    const t2 = 1000; // fs
    const expectedFwhm = 1 / (Math.PI * 29_979_245_800 * t2 * 1e-15); // 10.617 cm⁻¹
    const pulse = gaussianPulse(t0, 12, 50);
    const reference = uniformTrace(n, step, 0, pulse);
    // Peak of the response's real part a·T₂/2 = 0.005, small so that A ≈ (2/ln 10)·Re R stays linear.
    const a = 0.01 / t2;
    const sampleField = reference.field.slice();
    const support: number[] = [];
    for (let m = 0; m < n; m++) if (Math.abs(reference.field[m]!) > 1e-12) support.push(m);
    for (let i = 0; i < n; i++) {
      let sum = 0;
      for (const m of support) {
        if (m > i) break;
        const tau = (i - m) * step;
        // The response's value at τ = 0 counts half (the trapezoid rule's end point for a step at t = 0).
        const r = a * Math.cos(2 * Math.PI * f0 * 1e-3 * tau) * Math.exp(-tau / t2) * (tau === 0 ? 0.5 : 1);
        sum += reference.field[m]! * r;
      }
      sampleField[i] = sampleField[i]! - sum * step;
    }
    const result = traceToSpectrum({ time: reference.time, field: sampleField }, reference, {
      apodisation: 'none',
      zeroFill: 4,
    });
    const { wavenumber: w, absorbance: y } = result.spectrum;
    let peak = 0;
    for (let i = 0; i < w.length; i++) if (w[i]! > 1500 && w[i]! < 1800 && y[i]! > y[peak]!) peak = i;
    // Vertex of the parabola through the three top points.
    const ym = y[peak - 1]!;
    const y0 = y[peak]!;
    const yp = y[peak + 1]!;
    const h = w[peak + 1]! - w[peak]!;
    const position = w[peak]! + (0.5 * (ym - yp) * h) / (ym - 2 * y0 + yp);
    expect(Math.abs(position - nu0)).toBeLessThan(0.5);
    // Half-maximum crossings above the far-wing level (the broad pulse-limited background is flat here).
    const half = y0 / 2;
    let left = peak;
    while (y[left]! > half) left--;
    let right = peak;
    while (y[right]! > half) right++;
    const cross = (i: number, j: number) => w[i]! + ((half - y[i]!) / (y[j]! - y[i]!)) * (w[j]! - w[i]!);
    const width = cross(right - 1, right) - cross(left, left + 1);
    expect(Math.abs(width / expectedFwhm - 1)).toBeLessThan(0.02);
    // Peak height: A ≈ (2 / ln 10)·a·T₂/2 for a weak band.
    expect(y0).toBeCloseTo((2 / Math.LN10) * 0.005, 4);
  });
});

describe('traceToSpectrum: coverage and dynamic range', () => {
  it('stops the coverage where the reference power falls below the threshold', () => {
    // |E(f)|² of a Gaussian pulse falls to a fraction q of its peak at |f − f_c| = √(ln 2 · ln(1/q)) / (π τ)
    // (the Gaussian transform pair, common practice).
    const tau = 30;
    const carrier = 55;
    const reference = uniformTrace(2048, 1, 0, gaussianPulse(600, tau, carrier));
    for (const q of [1e-4, 1e-2]) {
      const result = traceToSpectrum(reference, reference, { apodisation: 'none', powerThreshold: q });
      const half = (Math.sqrt(Math.LN2 * Math.log(1 / q)) / (Math.PI * tau)) * 1000; // THz
      expect(Math.abs(result.coverage.min - (carrier - half) * PER_THZ)).toBeLessThanOrEqual(result.spacing);
      expect(Math.abs(result.coverage.max - (carrier + half) * PER_THZ)).toBeLessThanOrEqual(result.spacing);
      // Nothing is invented between: the covered bins are contiguous at the bin spacing.
      const w = result.spectrum.wavenumber;
      expect(w.length).toBe(Math.round((w[w.length - 1]! - w[0]!) / result.spacing) + 1);
    }
  });

  it('reports the reference dynamic range against the white-noise floor Δt²·σ²·N', () => {
    // White noise of variance σ² per sample puts Δt²σ²N into every bin of |Δt·DFT|² (Parseval); the pulse peak is
    // |E(f_c)| = A·s·√(2π)/2 for A·exp(−t²/2s²)·cos(2πf_c t) (Gaussian transform pair; common practice).
    const tau = 12;
    const n = 4096;
    const sigma = 1e-3;
    const s = tau / Math.sqrt(4 * Math.LN2);
    const expected = Math.log10(((s * Math.sqrt(2 * Math.PI)) / 2) ** 2 / (sigma * sigma * n));
    const normal = seededRandom(7).normal;
    const clean = gaussianPulse(2000, tau, 60);
    const reference = uniformTrace(n, 1, 0, (t) => clean(t) + sigma * normal());
    const sample = scaled(reference, 0.5);
    const prePulse = traceToSpectrum(sample, reference, { apodisation: 'none' });
    expect(prePulse.noiseFrom).toBe('pre-pulse');
    expect(Math.abs(prePulse.dynamicRangeOrders - expected)).toBeLessThan(0.05);
    const highFrequency = traceToSpectrum(
      sample,
      reference,
      { apodisation: 'none' },
      { noiseFrom: 'high-frequency' },
    );
    expect(highFrequency.noiseFrom).toBe('high-frequency');
    expect(Math.abs(highFrequency.dynamicRangeOrders - expected)).toBeLessThan(0.1);
    // A Hann window ½(1 + cos πx) centred on the pulse (x = (t − 2000 fs) / 2095 fs, reaching the far end of the
    // record) keeps the peak and lowers the floor to Δt²σ²Σw².
    let sumW2 = 0;
    for (let i = 0; i < n; i++) sumW2 += (0.5 * (1 + Math.cos((Math.PI * (i - 2000)) / 2095))) ** 2;
    const expectedHann = Math.log10(((s * Math.sqrt(2 * Math.PI)) / 2) ** 2 / (sigma * sigma * sumW2));
    const hann = traceToSpectrum(sample, reference, { apodisation: 'hann' });
    expect(Math.abs(hann.dynamicRangeOrders - expectedHann)).toBeLessThan(0.05);
  });
});

describe('traceToSpectrum: coverage above the noise floor', () => {
  it('keeps only bins where both amplitudes exceed k × the noise floor, at the analytic edge of a Gaussian pulse', () => {
    // |E(f)| = A·s·√(2π)/2 · exp(−2π²s²(f − f_c)²) for a Gaussian pulse (transform pair), white noise of variance σ²
    // gives the floor Δt²σ²N per bin (Parseval; common practice). The sample is half the field, so its power
    // P(f)/4 reaches k²·floor at |f − f_c| = √(ln(P_peak / (4 k² floor)) / (4π²s²)).
    const tau = 30;
    const n = 4096;
    const sigma = 1e-3;
    const carrier = 60;
    const k = 3;
    const s = tau / Math.sqrt(4 * Math.LN2);
    const peak = ((s * Math.sqrt(2 * Math.PI)) / 2) ** 2;
    const floor = sigma * sigma * n;
    const edge = (factor: number) =>
      Math.sqrt(Math.log(peak / (4 * factor * factor * floor)) / (4 * Math.PI ** 2 * s * s)) * 1000 * PER_THZ;
    const half = edge(k);
    // Where the clean sample amplitude has fallen to the floor itself: beyond it a bin is noise, and noise alone
    // passes k² = 9 × its mean power with probability e⁻⁹ ≈ 10⁻⁴ (exponential power; common practice). Between
    // the two edges signal plus noise may pass.
    const noiseOnly = edge(1);
    const noiseR = seededRandom(21).normal;
    const noiseS = seededRandom(22).normal;
    const clean = gaussianPulse(2000, tau, carrier);
    const reference = uniformTrace(n, 1, 0, (t) => clean(t) + sigma * noiseR());
    const sample = uniformTrace(n, 1, 0, (t) => 0.5 * clean(t) + sigma * noiseS());
    const step = { apodisation: 'none' as const, powerThreshold: 1e-12 };
    const masked = traceToSpectrum(sample, reference, { ...step, noiseFloorFactor: k });
    const centre = carrier * PER_THZ;
    const outside = (w: Float64Array, limit: number) =>
      Array.from(w).filter((v) => Math.abs(v - centre) > limit).length;
    expect(outside(masked.spectrum.wavenumber, noiseOnly)).toBe(0);
    // The band inside is kept: every bin where the clean sample stands 5 × above the floor, and none past the noise.
    const strong = edge(5);
    const w = Array.from(masked.spectrum.wavenumber);
    const within = w.filter((v) => Math.abs(v - centre) <= strong);
    for (let i = 1; i < within.length; i++) {
      expect(within[i]! - within[i - 1]!).toBeCloseTo(masked.spacing, 6);
    }
    expect(masked.coverage.max).toBeGreaterThan(centre + strong);
    expect(masked.coverage.min).toBeLessThan(centre - strong);
    expect(half).toBeGreaterThan(strong);
    expect(masked.warnings.some((w) => /noise floor/.test(w.message))).toBe(true);
    // Without the factor (recipes written before it) the noise-only bins stay in.
    const unmasked = traceToSpectrum(sample, reference, step);
    expect(outside(unmasked.spectrum.wavenumber, noiseOnly)).toBeGreaterThan(100);
  });
});

describe('traceToSpectrum: repeated traces', () => {
  it('aligns and averages repeated scans and reports their timing spread', () => {
    const normal = seededRandom(11).normal;
    const jitter = [0, 0.4, -0.3, 0.7];
    const scan = (delay: number) => {
      const pulse = gaussianPulse(800 + delay, 12, 55);
      return uniformTrace(2048, 1, 0, (t) => pulse(t) + 1e-3 * normal());
    };
    const references = jitter.map((d) => scan(d));
    const samples = jitter.map((d) => scaled(scan(d + 5), 0.1));
    const result = traceToSpectrum(samples, references, { apodisation: 'hann' });
    // The jitter removed is the sample standard deviation of the scan delays, pooled over the two sets.
    const mean = jitter.reduce((a, b) => a + b, 0) / jitter.length;
    const sd = Math.sqrt(jitter.reduce((a, b) => a + (b - mean) ** 2, 0) / (jitter.length - 1)) * 1000;
    expect(result.timingJitterAs).not.toBeNull();
    expect(Math.abs(result.timingJitterAs! / sd - 1)).toBeLessThan(0.02);
    expect(result.timingSpreadAs).not.toBeNull();
    expect(result.timingSpreadAs!).toBeGreaterThan(0);
    expect(result.timingSpreadAs!).toBeLessThan(20);
    // Averaged and aligned, the 10-fold field attenuation still reads as 2 absorbance units near the carrier.
    const { wavenumber, absorbance } = result.spectrum;
    for (let i = 0; i < wavenumber.length; i++) {
      if (Math.abs(wavenumber[i]! - 55 * PER_THZ) < 300) expect(absorbance[i]).toBeCloseTo(2, 1);
    }
  });
});

describe('traceToSpectrum: bad input', () => {
  const reference = uniformTrace(256, 1, 0, gaussianPulse(100, 12, 55));

  it('refuses traces sampled at different steps', () => {
    const coarse = uniformTrace(256, 2, 0, gaussianPulse(100, 12, 55));
    expect(() => traceToSpectrum(coarse, reference, {}, { files: ['s.csv', 'r.csv'] })).toThrow(
      BandshelfError,
    );
    try {
      traceToSpectrum(reference, coarse, {}, { files: ['s.csv', 'r.csv'] });
    } catch (error) {
      expect((error as BandshelfError).code).toBe('BAD_FORMAT');
      expect((error as BandshelfError).file).toBe('r.csv');
    }
  });

  it('refuses an invalid step and a gate that misses the trace with BAD_RECIPE', () => {
    const code = (f: () => unknown) => {
      try {
        f();
      } catch (error) {
        return (error as BandshelfError).code;
      }
      return 'no error';
    };
    expect(code(() => traceToSpectrum(reference, reference, { powerThreshold: 2 }))).toBe('BAD_RECIPE');
    expect(
      code(() => traceToSpectrum(reference, reference, { gate: { start: 5000, end: 6000, edge: 0 } })),
    ).toBe('BAD_RECIPE');
    expect(code(() => traceToSpectrum([], reference))).toBe('TOO_FEW_POINTS');
    const flat = uniformTrace(256, 1, 0, () => 1);
    expect(code(() => traceToSpectrum(reference, flat))).toBe('NOT_A_SPECTRUM');
  });

  it('applies a gate given in ps like one given in fs', () => {
    const fs = traceToSpectrum(reference, reference, { gate: { start: 20, end: 200, edge: 10 } });
    const ps = traceToSpectrum(reference, reference, {
      timeUnit: 'ps',
      gate: { start: 0.02, end: 0.2, edge: 0.01 },
    });
    expect(Array.from(ps.spectrum.wavenumber)).toEqual(Array.from(fs.spectrum.wavenumber));
  });
});

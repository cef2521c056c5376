// Pulse alignment by cross-correlation: a known sub-sample shift is recovered, and the reported spreads match the truth.
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../src/demo/seededRandom.js';
import { alignTraces } from '../../../src/spectrum/trace/alignTraces.js';
import { averageTraces } from '../../../src/spectrum/trace/averageTraces.js';
import { pulseDelay } from '../../../src/spectrum/trace/pulseDelay.js';
import { shiftTrace } from '../../../src/spectrum/trace/shiftTrace.js';
import type { Trace } from '../../../src/spectrum/trace/types.js';
import { uniformTrace } from './uniformTrace.js';

/** A few-cycle mid-infrared pulse: Gaussian envelope (intensity FWHM 14 fs) on a 50 THz (1668 cm⁻¹) carrier. */
function pulse(t0: number) {
  return (t: number) =>
    Math.exp((-2 * Math.LN2 * (t - t0) ** 2) / 196) * Math.cos(2 * Math.PI * 0.05 * (t - t0) + 0.4);
}
/** Its time derivative, written out by hand. */
function pulseSlope(t0: number) {
  return (t: number) => {
    const u = t - t0;
    const env = Math.exp((-2 * Math.LN2 * u * u) / 196);
    const phase = 2 * Math.PI * 0.05 * u + 0.4;
    return env * ((-4 * Math.LN2 * u) / 196) * Math.cos(phase) - env * 2 * Math.PI * 0.05 * Math.sin(phase);
  };
}

function sd(values: number[]): number {
  const mean = values.reduce((a, b) => a + b, 0) / values.length;
  return Math.sqrt(values.reduce((a, b) => a + (b - mean) ** 2, 0) / (values.length - 1));
}

describe('alignTraces', () => {
  it('recovers a 37 as shift on a 1 fs grid to within 5 as', () => {
    const first = uniformTrace(1024, 1, 0, pulse(300));
    const later = uniformTrace(1024, 1, 0, pulse(300.037));
    const result = alignTraces([first, later]);
    expect(result.delays[0]).toBe(0);
    expect(Math.abs(result.delays[1]! - 0.037)).toBeLessThan(0.005);
    // The shifted-back trace lies on the first one.
    let worst = 0;
    for (let i = 100; i < 900; i++)
      worst = Math.max(worst, Math.abs(result.traces[1]!.field[i]! - first.field[i]!));
    expect(worst).toBeLessThan(1e-3);
    expect(result.timingJitterAs).toBeCloseTo(Math.SQRT1_2 * 37, 0);
  });

  it('recovers the same shift with noise, and a whole-sample shift the other way', () => {
    const normal = seededRandom(3).normal;
    const noisy = (t0: number) => uniformTrace(1024, 1, 0, (t) => pulse(t0)(t) + 1e-3 * normal());
    const result = alignTraces([noisy(300), noisy(300.037), noisy(297.5)]);
    expect(Math.abs(result.delays[1]! - 0.037)).toBeLessThan(0.005);
    expect(Math.abs(result.delays[2]! + 2.5)).toBeLessThan(0.005);
  });

  it('reports null spreads for a single trace', () => {
    const result = alignTraces([uniformTrace(256, 1, 0, pulse(100))]);
    expect(result.timingJitterAs).toBeNull();
    expect(result.timingSpreadAs).toBeNull();
    expect(result.traces).toHaveLength(1);
  });

  it('reports a residual spread that matches the least-squares delay error σ / √ΣE′² and the true misalignment', () => {
    // Delay estimation in white noise: var(d̂) = σ² / Σₙ E′(tₙ)² (the least-squares / Cramér–Rao bound for a known
    // pulse shape; common practice in time-delay estimation). Each aligned trace keeps its own error minus the first
    // one's, so the spread of the aligned traces' true timing is that σ_d.
    const sigma = 0.02;
    const normal = seededRandom(29).normal;
    const trueDelays: number[] = [];
    const traces: Trace[] = [];
    for (let i = 0; i < 16; i++) {
      const d = 0.8 * normal();
      trueDelays.push(d);
      traces.push(uniformTrace(1024, 1, 0, (t) => pulse(300 + d)(t) + sigma * normal()));
    }
    let slope2 = 0;
    const slope = pulseSlope(300);
    for (let i = 0; i < 1024; i++) slope2 += slope(i) ** 2;
    const predictedAs = (sigma / Math.sqrt(slope2)) * 1000;

    const result = alignTraces(traces);
    // Noise from the aligned traces' scatter recovers σ.
    expect(Math.abs(result.fieldNoise! / sigma - 1)).toBeLessThan(0.05);
    expect(Math.abs(result.timingSpreadAs! / predictedAs - 1)).toBeLessThan(0.1);
    // The jitter is the spread of the true delays, each measured to within about σ_d.
    expect(Math.abs(result.timingJitterAs! - sd(trueDelays) * 1000)).toBeLessThan(predictedAs);
    // Truth: measured − true delay (relative to the first) is the misalignment left in each aligned trace.
    const errors = trueDelays.map((d, i) => (result.delays[i]! - (d - trueDelays[0]!)) * 1000);
    const trueSpread = sd(errors);
    expect(trueSpread / result.timingSpreadAs!).toBeGreaterThan(0.6);
    expect(trueSpread / result.timingSpreadAs!).toBeLessThan(1.6);
  });
});

describe('pulseDelay and shiftTrace', () => {
  it('shiftTrace delays a band-limited pulse exactly and pulseDelay reads the delay back', () => {
    const base = uniformTrace(512, 2, 0, pulse(300));
    const shifted = shiftTrace(base, { delay: 1.3 });
    const exact = uniformTrace(512, 2, 0, pulse(301.3));
    let worst = 0;
    for (let i = 0; i < 512; i++) worst = Math.max(worst, Math.abs(shifted.field[i]! - exact.field[i]!));
    expect(worst).toBeLessThan(1e-6);
    // 2 fs sampling of a 20 fs carrier: the plain three-point parabola errs here; the refinement does not.
    expect(Math.abs(pulseDelay(exact, base) - 1.3)).toBeLessThan(1e-4);
    expect(Math.abs(pulseDelay(exact, base, { iterations: 0 }) - 1.3)).toBeGreaterThan(1e-3);
  });

  it('does not change the input traces', () => {
    const base = uniformTrace(256, 1, 0, pulse(100));
    const copy = base.field.slice();
    shiftTrace(base, { delay: 0.4 });
    alignTraces([base, base]);
    averageTraces([base, base]);
    expect(Array.from(base.field)).toEqual(Array.from(copy));
  });

  it('averageTraces refuses traces on different delay axes', () => {
    const a = uniformTrace(256, 1, 0, pulse(100));
    const b = uniformTrace(256, 1, 10, pulse(100));
    expect(() => averageTraces([a, b])).toThrow(/share one delay axis/);
    expect(() => alignTraces([a, uniformTrace(200, 1, 0, pulse(100))])).toThrow(/same number of samples/);
    const mean = averageTraces([a, { time: a.time, field: a.field.map((v) => v + 2) }]);
    expect(mean.field[0]).toBeCloseTo(a.field[0]! + 1, 12);
  });
});

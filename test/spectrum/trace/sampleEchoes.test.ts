// Pulse replicas in the sample that the reference lacks: found by a matched filter, a molecular response is not.
import { describe, expect, it } from 'vitest';
import { sampleEchoes } from '../../../src/spectrum/trace/sampleEchoes.js';
import { traceToSpectrum } from '../../../src/spectrum/trace/traceToSpectrum.js';
import { uniformTrace } from './uniformTrace.js';

/** A transform-limited Gaussian pulse: intensity FWHM `tau` fs, carrier `carrier` THz, peak at `t0` fs. */
function pulse(t0: number, tau: number, carrier: number, amplitude = 1) {
  return (t: number) =>
    amplitude *
    Math.exp((-2 * Math.LN2 * (t - t0) ** 2) / (tau * tau)) *
    Math.cos(2 * Math.PI * carrier * 1e-3 * (t - t0));
}

const reference = uniformTrace(4096, 1, 0, pulse(600, 12, 55));

describe('sampleEchoes', () => {
  it('finds a 10 % replica 1500 fs after the main pulse that only the sample has', () => {
    // A reflection between the faces of a sample cell repeats the pulse, delayed by the round trip (common practice).
    const main = pulse(600, 12, 55, 0.5);
    const echo = pulse(2100, 12, 55, 0.05);
    const sample = uniformTrace(4096, 1, 0, (t) => main(t) + echo(t));
    const found = sampleEchoes(sample, reference);
    expect(found).toHaveLength(1);
    expect(found[0]!.delay).toBeCloseTo(1500, 0);
    expect(found[0]!.sample).toBeCloseTo(0.1, 2);
    expect(found[0]!.reference).toBeLessThan(0.01);
    // traceToSpectrum says so; with a gate that ends before the echo, nothing is said.
    const loud = traceToSpectrum(sample, reference);
    expect(loud.warnings.some((w) => /replica of the pulse 1500 fs after/.test(w.message))).toBe(true);
    const gated = traceToSpectrum(sample, reference, { gate: { start: 0, end: 1800, edge: 50 } });
    expect(gated.warnings.some((w) => /replica/.test(w.message))).toBe(false);
  });

  it('says nothing when the reference has the same echo, or the sample only a molecular response', () => {
    const withEcho = (amplitude: number) => {
      const main = pulse(600, 12, 55, amplitude);
      const echo = pulse(2100, 12, 55, amplitude / 10);
      return uniformTrace(4096, 1, 0, (t) => main(t) + echo(t));
    };
    expect(sampleEchoes(withEcho(0.5), withEcho(1))).toEqual([]);
    // A free-induction decay cos(2π f₀ t)·e^(−t/T₂) after the pulse (f₀ 50 THz, T₂ 1 ps): a narrow band, no replica.
    const main = pulse(600, 12, 55, 0.5);
    const decay = (t: number) =>
      t < 600 ? 0 : 0.05 * Math.exp(-(t - 600) / 1000) * Math.sin(2 * Math.PI * 0.05 * (t - 600));
    expect(
      sampleEchoes(
        uniformTrace(4096, 1, 0, (t) => main(t) + decay(t)),
        reference,
      ),
    ).toEqual([]);
  });
});

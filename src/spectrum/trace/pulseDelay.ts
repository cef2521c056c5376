// Measures how much later the main pulse of one trace arrives than that of another, to a small fraction of a sample.
import { BandshelfError } from '../../error.js';
import { pulseWindow } from './pulseWindow.js';
import { shiftTrace } from './shiftTrace.js';
import type { Trace } from './types.js';

export interface PulseDelayOptions {
  /**
   * Half-width (fs) of the window around the reference's main pulse over which the cross-correlation is summed
   * (see pulseWindow for the default).
   * @default undefined
   */
  halfWindow?: number;
  /**
   * Largest delay (fs) searched either way.
   * @default 200
   */
  maxDelay?: number;
  /**
   * Refinement rounds: after each estimate the trace is shifted back by it and the residual re-measured, which
   * removes the bias of the three-point parabola on an oscillating correlation peak.
   * @default 4
   */
  iterations?: number;
}

/** Cross-correlation Σ r[n]·s[n + lag] over n in [lo, hi], samples outside `s` counted as 0. */
function correlate(r: Float64Array, s: Float64Array, lo: number, hi: number, lag: number): number {
  let sum = 0;
  const from = Math.max(lo, -lag);
  const to = Math.min(hi, s.length - 1 - lag);
  for (let i = from; i <= to; i++) sum += r[i]! * s[i + lag]!;
  return sum;
}

/**
 * Returns the delay in fs of `trace` relative to `reference` (positive: the trace's pulse comes later), from the peak
 * of their cross-correlation around the reference's main pulse, located to a sub-sample fraction by a parabola
 * through the three largest correlation samples and refined by shifting. Both traces must share one delay axis
 * (same start, step and length); anything else is BAD_FORMAT.
 */
export function pulseDelay(trace: Trace, reference: Trace, options: PulseDelayOptions = {}): number {
  const maxDelay = options.maxDelay ?? 200;
  const iterations = options.iterations ?? 4;
  const r = reference.field;
  const n = r.length;
  if (trace.field.length !== n || n < 3) {
    throw new BandshelfError(
      'BAD_FORMAT',
      `traces to align must have the same number of samples (${trace.field.length} and ${n})`,
    );
  }
  const step = (reference.time[n - 1]! - reference.time[0]!) / (n - 1);
  if (
    Math.abs(trace.time[0]! - reference.time[0]!) > 0.01 * step ||
    Math.abs(trace.time[n - 1]! - reference.time[n - 1]!) > 0.01 * step
  ) {
    throw new BandshelfError('BAD_FORMAT', 'traces to align must share one delay axis (same start and step)');
  }
  const { lo, hi } = pulseWindow(
    reference,
    options.halfWindow === undefined ? {} : { halfWindow: options.halfWindow },
  );
  const maxLag = Math.max(1, Math.min(Math.round(maxDelay / step), n - 2));

  let total = 0;
  let current = trace;
  for (let round = 0; round <= iterations; round++) {
    const s = current.field;
    // Only the first round searches all lags; later rounds look at the residual, within a couple of samples.
    const span = round === 0 ? maxLag : 2;
    let bestLag = 0;
    let best = Number.NEGATIVE_INFINITY;
    for (let lag = -span; lag <= span; lag++) {
      const c = correlate(r, s, lo, hi, lag);
      if (c > best) {
        best = c;
        bestLag = lag;
      }
    }
    const cm = correlate(r, s, lo, hi, bestLag - 1);
    const cp = correlate(r, s, lo, hi, bestLag + 1);
    const curvature = cm - 2 * best + cp;
    const fraction = curvature < 0 ? (0.5 * (cm - cp)) / curvature : 0;
    const estimate = (bestLag + Math.max(-0.5, Math.min(0.5, fraction))) * step;
    total += estimate;
    if (Math.abs(estimate) < 1e-6 * step || round === iterations) break;
    current = shiftTrace(trace, { delay: -total });
  }
  return total;
}

// Aligns repeated traces on their main pulse, so timing jitter and drift between scans do not smear the average.
import { BandshelfError } from '../../error.js';
import { averageTraces } from './averageTraces.js';
import { type PulseDelayOptions, pulseDelay } from './pulseDelay.js';
import { pulseWindow } from './pulseWindow.js';
import { shiftTrace } from './shiftTrace.js';
import type { Trace } from './types.js';

export interface AlignTracesOptions {
  /**
   * Cross-correlation window half-width, fs (see pulseWindow for the default).
   * @default undefined
   */
  halfWindow?: number;
  /**
   * Largest delay searched either way, fs.
   * @default pulseDelay's (200)
   */
  maxDelay?: number;
}

export interface AlignTracesResult {
  /** The traces shifted onto the first one's timing, all on the first one's delay axis. */
  traces: Trace[];
  /** Delay of each input trace relative to the first, fs (the first is 0; positive: its pulse came later). */
  delays: Float64Array;
  /** Sample standard deviation of `delays`, attoseconds: the jitter and drift that was removed. Null for one trace. */
  timingJitterAs: number | null;
  /**
   * Residual timing spread after alignment, attoseconds: the standard deviation of the aligned traces' remaining
   * timing errors, σ_noise / √Σ E′(tₙ)² over the correlation window (the least-squares delay error of a pulse E in
   * white noise), with σ_noise measured from the scatter of the aligned traces about their mean. Null for one trace.
   */
  timingSpreadAs: number | null;
  /** RMS field noise of one trace, from the scatter of the aligned traces about their mean. Null for one trace. */
  fieldNoise: number | null;
}

function sampleStandardDeviation(values: Float64Array): number {
  let mean = 0;
  for (const v of values) mean += v;
  mean /= values.length;
  let ss = 0;
  for (const v of values) ss += (v - mean) ** 2;
  return Math.sqrt(ss / (values.length - 1));
}

/**
 * Measures each trace's delay against the first by cross-correlation of the main pulse (sub-sample, see pulseDelay),
 * shifts it back by a Fourier phase ramp, and reports the delays, their spread, and the timing spread left after
 * alignment.
 *
 * Why the residual is estimated rather than re-measured: re-running the same estimator on the aligned traces returns
 * ≈ 0 by construction, whatever the real misalignment, so it would report nothing. Each delay estimate errs by the
 * trace's noise projected on the pulse slope, σ / √ΣE′²; that is what is left after alignment, and both factors are
 * measured from the data (noise from the aligned traces' scatter, slope from their mean). All traces must share one
 * delay axis (BAD_FORMAT otherwise); an empty list is TOO_FEW_POINTS.
 */
export function alignTraces(traces: readonly Trace[], options: AlignTracesOptions = {}): AlignTracesResult {
  const first = traces[0];
  if (first === undefined) throw new BandshelfError('TOO_FEW_POINTS', 'there are no traces to align');
  const delayOptions: PulseDelayOptions = {};
  if (options.maxDelay !== undefined) delayOptions.maxDelay = options.maxDelay;
  if (options.halfWindow !== undefined) delayOptions.halfWindow = options.halfWindow;
  const m = traces.length;
  const delays = new Float64Array(m);
  const aligned: Trace[] = [{ time: first.time.slice(), field: first.field.slice() }];
  for (let i = 1; i < m; i++) {
    const trace = traces[i]!;
    const delay = pulseDelay(trace, first, delayOptions);
    delays[i] = delay;
    aligned.push({ time: first.time.slice(), field: shiftTrace(trace, { delay: -delay }).field });
  }
  if (m === 1)
    return { traces: aligned, delays, timingJitterAs: null, timingSpreadAs: null, fieldNoise: null };

  const mean = averageTraces(aligned);
  const n = mean.field.length;
  let scatter = 0;
  for (const trace of aligned) {
    for (let i = 0; i < n; i++) scatter += (trace.field[i]! - mean.field[i]!) ** 2;
  }
  // Deviations from a mean of m traces have variance σ²(m − 1)/m each.
  const noise = Math.sqrt(scatter / (n * (m - 1)));

  // The slope of the band-limited mean pulse by a central difference of two exact sub-sample shifts.
  const step = (mean.time[n - 1]! - mean.time[0]!) / (n - 1);
  const h = 0.01 * step;
  const ahead = shiftTrace(mean, { delay: -h }).field;
  const behind = shiftTrace(mean, { delay: h }).field;
  const { lo, hi } = pulseWindow(
    mean,
    options.halfWindow === undefined ? {} : { halfWindow: options.halfWindow },
  );
  let slope2 = 0;
  for (let i = lo; i <= hi; i++) slope2 += ((ahead[i]! - behind[i]!) / (2 * h)) ** 2;
  const spread = slope2 > 0 ? (noise / Math.sqrt(slope2)) * 1000 : 0;
  return {
    traces: aligned,
    delays,
    timingJitterAs: sampleStandardDeviation(delays) * 1000,
    timingSpreadAs: spread,
    fieldNoise: noise,
  };
}

// How many orders of magnitude a reference's spectral power spans above its noise floor.
import { BandshelfError } from '../../error.js';
import { mainPulseIndex } from './mainPulseIndex.js';
import type { FieldSpectrum, Trace } from './types.js';

export type NoiseSource = 'pre-pulse' | 'high-frequency';

export interface SpectralDynamicRangeOptions {
  /**
   * The trace (offset removed, before gating and apodisation) whose pre-pulse part gives the noise; needed for
   * 'pre-pulse' and used by 'auto'.
   * @default undefined
   */
  trace?: Trace;
  /**
   * The per-sample weights (gate × apodisation) that were applied to `trace` before the transform, so white noise of
   * variance σ² gives the floor Δt²·σ²·Σw² in every bin; all ones when absent.
   * @default undefined
   */
  weights?: Float64Array;
  /**
   * 'pre-pulse': RMS of the samples before the main pulse; 'high-frequency': the power of the top 10 % of bins;
   * 'auto': pre-pulse when at least `minPrePulse` samples precede the pulse, else high-frequency.
   * @default 'auto'
   */
  noiseFrom?: 'auto' | NoiseSource;
  /**
   * The fewest pre-pulse samples 'auto' accepts.
   * @default 32
   */
  minPrePulse?: number;
}

export interface SpectralDynamicRange {
  /** log10(peak power / noise floor), capped at MAX_ORDERS for a trace without measurable noise. */
  orders: number;
  peakPower: number;
  noiseFloor: number;
  noiseFrom: NoiseSource;
}

/** A noiseless (synthetic) trace still gets a finite figure: 16 orders is past any instrument. */
const MAX_ORDERS = 16;

/**
 * The end (exclusive) of the pre-pulse part: everything before the pulse's leading edge (the first sample at 5 % of
 * the peak field) minus a margin as long as that edge's rise, so the pulse's own wings are not counted as noise.
 */
function prePulseEnd(trace: Trace): number {
  const field = trace.field;
  const peak = mainPulseIndex(trace);
  if (peak < 0) return 0;
  const limit = 0.05 * Math.abs(field[peak]!);
  let edge = peak;
  for (let i = 0; i < peak; i++) {
    if (Math.abs(field[i]!) >= limit) {
      edge = i;
      break;
    }
  }
  return Math.max(0, edge - (peak - edge));
}

/** Residual variance of a straight-line fit to field[0 … end), so a slow drift is not counted as noise. */
function detrendedVariance(trace: Trace, end: number): number {
  const { time, field } = trace;
  let st = 0;
  let sy = 0;
  for (let i = 0; i < end; i++) {
    st += time[i]!;
    sy += field[i]!;
  }
  const mt = st / end;
  const my = sy / end;
  let stt = 0;
  let sty = 0;
  for (let i = 0; i < end; i++) {
    const dt = time[i]! - mt;
    stt += dt * dt;
    sty += dt * (field[i]! - my);
  }
  const slope = stt > 0 ? sty / stt : 0;
  let ss = 0;
  for (let i = 0; i < end; i++) ss += (field[i]! - my - slope * (time[i]! - mt)) ** 2;
  return ss / Math.max(1, end - 2);
}

/**
 * The reference's spectral dynamic range: its peak power (zero-frequency bin excluded) over the noise floor, in orders
 * of magnitude. Pre-pulse: σ² from the detrended samples before the pulse, floor Δt²σ²Σw². High-frequency: the
 * median power of the top 10 % of bins below Nyquist divided by ln 2 (the median of an exponentially distributed
 * noise power is ln 2 × its mean); a pulse whose spectrum still reaches Nyquist makes this floor too high, so the
 * figure errs low.
 */
export function spectralDynamicRange(
  spectrum: FieldSpectrum,
  options: SpectralDynamicRangeOptions = {},
): SpectralDynamicRange {
  const requested = options.noiseFrom ?? 'auto';
  const minPrePulse = options.minPrePulse ?? 32;
  const { power, frequency } = spectrum;
  const bins = power.length;
  let peakPower = 0;
  for (let k = 0; k < bins; k++) if (frequency[k]! > 0 && power[k]! > peakPower) peakPower = power[k]!;
  if (!(peakPower > 0)) {
    throw new BandshelfError('NOT_A_SPECTRUM', 'the reference has no spectral power above zero frequency');
  }

  const trace = options.trace;
  const end = trace === undefined ? 0 : prePulseEnd(trace);
  let noiseFrom: NoiseSource;
  if (requested === 'auto')
    noiseFrom = trace !== undefined && end >= minPrePulse ? 'pre-pulse' : 'high-frequency';
  else noiseFrom = requested;

  let noiseFloor: number;
  if (noiseFrom === 'pre-pulse') {
    if (trace === undefined || end < 3) {
      throw new BandshelfError(
        'BAD_OPTION',
        'the pre-pulse noise estimate needs the trace and at least 3 samples before the main pulse',
        { field: 'noiseFrom' },
      );
    }
    const n = trace.time.length;
    const step = n > 1 ? (trace.time[n - 1]! - trace.time[0]!) / (n - 1) : 1;
    let sumW2 = 0;
    const weights = options.weights;
    if (weights === undefined) sumW2 = n;
    else for (let i = 0; i < weights.length; i++) sumW2 += weights[i]! * weights[i]!;
    noiseFloor = step * step * detrendedVariance(trace, end) * sumW2;
  } else {
    const from = Math.floor(0.9 * (bins - 1));
    const top = Array.from(power.subarray(from, bins - 1)).sort((a, b) => a - b);
    const median = top.length === 0 ? 0 : top[Math.floor(top.length / 2)]!;
    noiseFloor = median / Math.LN2;
  }
  const orders = noiseFloor > 0 ? Math.min(MAX_ORDERS, Math.log10(peakPower / noiseFloor)) : MAX_ORDERS;
  return { orders, peakPower, noiseFloor, noiseFrom };
}

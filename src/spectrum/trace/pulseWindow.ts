// The sample range around a trace's main pulse that pulse alignment correlates over.
import { mainPulseIndex } from './mainPulseIndex.js';
import type { Trace } from './types.js';

export interface PulseWindowOptions {
  /**
   * Half-width of the window around the main pulse, fs; by default the pulse's own extent (the samples where
   * |field| ≥ 5 % of its peak) widened by that extent on each side.
   * @default undefined
   */
  halfWindow?: number;
}

/** First and last sample index (inclusive, clamped to the trace) of the window around the main pulse. */
export function pulseWindow(trace: Trace, options: PulseWindowOptions = {}): { lo: number; hi: number } {
  const { time, field } = trace;
  const n = field.length;
  const peak = Math.max(0, mainPulseIndex(trace));
  let lo: number;
  let hi: number;
  if (options.halfWindow !== undefined) {
    const step = n > 1 ? (time[n - 1]! - time[0]!) / (n - 1) : 1;
    const h = Math.max(1, Math.round(options.halfWindow / step));
    lo = peak - h;
    hi = peak + h;
  } else {
    const limit = 0.05 * Math.abs(field[peak] ?? 0);
    let a = peak;
    let b = peak;
    for (let i = 0; i < n; i++) {
      if (Math.abs(field[i]!) >= limit) {
        if (i < a) a = i;
        if (i > b) b = i;
      }
    }
    const extent = Math.max(4, b - a);
    lo = a - extent;
    hi = b + extent;
  }
  return { lo: Math.max(0, lo), hi: Math.min(n - 1, hi) };
}

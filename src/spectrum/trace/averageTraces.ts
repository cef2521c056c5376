// Averages repeated traces recorded on one delay axis, sample by sample.
import { BandshelfError } from '../../error.js';
import type { Trace } from './types.js';

export interface AverageTracesOptions {
  /**
   * Largest difference (as a fraction of the step) allowed between the traces' first and last delays.
   * @default 0.01
   */
  tolerance?: number;
}

/**
 * Returns the mean field of the traces on the first trace's delay axis. Traces of different length or with delay
 * axes that differ by more than `tolerance` × step give BAD_FORMAT: align them first (alignTraces puts every trace
 * on the first one's axis).
 */
export function averageTraces(traces: readonly Trace[], options: AverageTracesOptions = {}): Trace {
  const tolerance = options.tolerance ?? 0.01;
  const first = traces[0];
  if (first === undefined) throw new BandshelfError('TOO_FEW_POINTS', 'there are no traces to average');
  const n = first.time.length;
  const step = n > 1 ? (first.time[n - 1]! - first.time[0]!) / (n - 1) : 1;
  const sum = new Float64Array(n);
  for (const [index, trace] of traces.entries()) {
    if (trace.time.length !== n || trace.field.length !== n) {
      throw new BandshelfError(
        'BAD_FORMAT',
        `trace ${index + 1} has ${trace.field.length} samples, the first has ${n}: repeated traces must share one delay axis`,
      );
    }
    if (
      n > 0 &&
      (Math.abs(trace.time[0]! - first.time[0]!) > tolerance * step ||
        Math.abs(trace.time[n - 1]! - first.time[n - 1]!) > tolerance * step)
    ) {
      throw new BandshelfError(
        'BAD_FORMAT',
        `trace ${index + 1} runs from ${trace.time[0]} to ${trace.time[n - 1]} fs, the first from ${first.time[0]} to ${first.time[n - 1]} fs: repeated traces must share one delay axis`,
      );
    }
    const f = trace.field;
    for (let i = 0; i < n; i++) sum[i] = sum[i]! + f[i]!;
  }
  const m = traces.length;
  for (let i = 0; i < n; i++) sum[i] = sum[i]! / m;
  return { time: first.time.slice(), field: sum };
}

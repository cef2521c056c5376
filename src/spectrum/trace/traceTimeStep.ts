// The sampling step of a trace, after checking that the delay axis is finite, ascending and uniform enough to Fourier-transform.
import { BandshelfError } from '../../error.js';
import type { Trace } from './types.js';

export interface TraceTimeStepOptions {
  /**
   * Largest allowed deviation of any one step from the mean step, as a fraction of the mean step.
   * @default 0.01
   */
  tolerance?: number;
  /**
   * The fewest samples a trace may have.
   * @default 16
   */
  minPoints?: number;
  /**
   * The file the trace came from, named in any error.
   * @default undefined
   */
  file?: string;
}

/**
 * Returns the mean delay step in fs, (last − first) / (n − 1). Throws BandshelfError: BAD_FORMAT for unequal array
 * lengths or a non-uniform step, TOO_FEW_POINTS, NOT_FINITE, NOT_MONOTONIC for a delay that does not increase.
 */
export function traceTimeStep(trace: Trace, options: TraceTimeStepOptions = {}): number {
  const tolerance = options.tolerance ?? 0.01;
  const minPoints = options.minPoints ?? 16;
  const file = options.file;
  const { time, field } = trace;
  const n = time.length;
  if (field.length !== n) {
    throw new BandshelfError('BAD_FORMAT', `delay and field differ in length (${n} and ${field.length})`, {
      file,
    });
  }
  if (n < minPoints) {
    throw new BandshelfError(
      'TOO_FEW_POINTS',
      `a trace needs at least ${minPoints} samples, this one has ${n}`,
      {
        file,
      },
    );
  }
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(time[i]!) || !Number.isFinite(field[i]!)) {
      const what = Number.isFinite(time[i]!) ? 'field' : 'delay';
      throw new BandshelfError('NOT_FINITE', `sample ${i + 1} has a non-finite ${what}`, {
        file,
        field: what,
      });
    }
  }
  const step = (time[n - 1]! - time[0]!) / (n - 1);
  if (!(step > 0)) {
    throw new BandshelfError('NOT_MONOTONIC', 'the delay does not increase along the trace', {
      file,
      field: 'delay',
    });
  }
  let worst = 0;
  let worstAt = 0;
  for (let i = 1; i < n; i++) {
    const d = time[i]! - time[i - 1]!;
    if (d <= 0) {
      throw new BandshelfError('NOT_MONOTONIC', `the delay does not increase at sample ${i + 1}`, {
        file,
        field: 'delay',
      });
    }
    const deviation = Math.abs(d - step) / step;
    if (deviation > worst) {
      worst = deviation;
      worstAt = i;
    }
  }
  if (worst > tolerance) {
    throw new BandshelfError(
      'BAD_FORMAT',
      `the delay step is not uniform: step ${worstAt} → ${worstAt + 1} is ${(time[worstAt]! - time[worstAt - 1]!).toPrecision(4)} fs against a mean of ${step.toPrecision(4)} fs (tolerance ${(tolerance * 100).toPrecision(2)} %)`,
      { file, field: 'delay' },
    );
  }
  return step;
}

// Time-domain step 4: zero-fills a trace to a power-of-two length, which interpolates the spectrum onto finer bins.
import { BandshelfError } from '../../error.js';
import type { Trace } from './types.js';

export interface ZeroFillOptions {
  /**
   * The padded length is the next power of two at or above factor × the trace length.
   * @default 2
   */
  factor?: number;
  /**
   * An exact padded length (a power of two, at least the trace length) instead of the factor rule; used to put a
   * sample and a reference of different lengths on the same frequency bins.
   * @default undefined
   */
  length?: number;
}

/**
 * Returns the trace extended with zeros (and its delay axis continued at the same step) to a power-of-two length.
 * The step is the mean step (last − first) / (n − 1), so the trace must be uniformly sampled (see traceTimeStep).
 */
export function zeroFill(trace: Trace, options: ZeroFillOptions = {}): Trace {
  const factor = options.factor ?? 2;
  const { time, field } = trace;
  const n = time.length;
  if (!(Number.isInteger(factor) && factor >= 1)) {
    throw new BandshelfError(
      'BAD_RECIPE',
      `the zero-fill factor must be a whole number ≥ 1 (got ${factor})`,
      {
        field: 'timeDomain.zeroFill',
      },
    );
  }
  if (n < 2) {
    throw new BandshelfError('TOO_FEW_POINTS', 'a trace needs at least 2 samples to be zero-filled');
  }
  let length = options.length;
  if (length === undefined) {
    length = 2;
    while (length < n * factor) length *= 2;
  } else if (!(Number.isInteger(length) && length >= n && length >= 2 && (length & (length - 1)) === 0)) {
    throw new BandshelfError(
      'BAD_RECIPE',
      `a zero-fill length must be a power of two ≥ ${n} (got ${length})`,
      {
        field: 'timeDomain.zeroFill',
      },
    );
  }
  const t0 = time[0]!;
  const step = (time[n - 1]! - t0) / (n - 1);
  const outTime = new Float64Array(length);
  const outField = new Float64Array(length);
  outField.set(field);
  outTime.set(time);
  for (let i = n; i < length; i++) outTime[i] = t0 + i * step;
  return { time: outTime, field: outField };
}

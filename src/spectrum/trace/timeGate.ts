// Time-domain step 2: keeps one delay range (the molecular response after the pulse, or everything before an echo).
import { BandshelfError } from '../../error.js';
import type { Trace } from './types.js';

export interface TimeGateOptions {
  /**
   * First delay kept, fs.
   * @default -Infinity
   */
  start?: number;
  /**
   * Last delay kept, fs.
   * @default Infinity
   */
  end?: number;
  /**
   * Width (fs) of the raised-cosine edge inside each end of the gate; 0 is a hard cut.
   * @default 0
   */
  edge?: number;
}

/**
 * Returns a trace of the same length whose field is multiplied by a gate: 0 outside [start, end], rising as
 * ½(1 − cos) over the first `edge` fs, 1 in the middle and falling the same way over the last `edge` fs. The edges
 * lie inside the gate so nothing outside it leaks through (an echo after `end` is removed completely), and the
 * length is kept so sample and reference stay on the same frequency bins. A gate that misses the trace or edges
 * wider than half the gate give BAD_RECIPE.
 */
export function timeGate(trace: Trace, options: TimeGateOptions = {}): Trace {
  const start = options.start ?? Number.NEGATIVE_INFINITY;
  const end = options.end ?? Number.POSITIVE_INFINITY;
  const edge = options.edge ?? 0;
  const { time, field } = trace;
  if (!(end > start)) {
    throw new BandshelfError('BAD_RECIPE', `the time gate needs end > start (got ${start} … ${end})`, {
      field: 'timeDomain.gate',
    });
  }
  if (!(edge >= 0) || 2 * edge > end - start) {
    throw new BandshelfError(
      'BAD_RECIPE',
      `the time gate's edge (${edge}) must be between 0 and half the gate (${(end - start) / 2})`,
      { field: 'timeDomain.gate.edge' },
    );
  }
  const n = time.length;
  if (n === 0 || start > time[n - 1]! || end < time[0]!) {
    throw new BandshelfError(
      'BAD_RECIPE',
      `the time gate ${start} … ${end} fs does not overlap the trace (${time[0]} … ${time[n - 1]} fs)`,
      { field: 'timeDomain.gate' },
    );
  }
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = time[i]!;
    let w: number;
    if (t < start || t > end) w = 0;
    else if (edge > 0 && t < start + edge) w = 0.5 * (1 - Math.cos((Math.PI * (t - start)) / edge));
    else if (edge > 0 && t > end - edge) w = 0.5 * (1 - Math.cos((Math.PI * (end - t)) / edge));
    else w = 1;
    out[i] = field[i]! * w;
  }
  return { time: time.slice(), field: out };
}

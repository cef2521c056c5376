// Time-domain step 1: removes the field's constant offset so the zero-frequency bin does not dominate the spectrum.
import type { Trace } from './types.js';

export interface RemoveMeanOptions {
  /**
   * Delay range (fs) whose mean is subtracted from the whole trace; null uses every sample.
   * @default null
   */
  window?: { start: number; end: number } | null;
}

/** Returns a new trace whose field has zero mean over `window` (the whole trace by default). */
export function removeMean(trace: Trace, options: RemoveMeanOptions = {}): Trace {
  const window = options.window ?? null;
  const { time, field } = trace;
  let sum = 0;
  let count = 0;
  for (let i = 0; i < field.length; i++) {
    const t = time[i]!;
    if (window !== null && (t < window.start || t > window.end)) continue;
    sum += field[i]!;
    count++;
  }
  const mean = count > 0 ? sum / count : 0;
  const out = new Float64Array(field.length);
  for (let i = 0; i < field.length; i++) out[i] = field[i]! - mean;
  return { time: time.slice(), field: out };
}

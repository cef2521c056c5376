// Test helper: a trace sampled every `step` fs from `start`, with the field given by a function of time.
import type { Trace } from '../../../src/spectrum/trace/types.js';

export function uniformTrace(n: number, step: number, start: number, f: (t: number) => number): Trace {
  const time = new Float64Array(n);
  const field = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    time[i] = start + i * step;
    field[i] = f(time[i]!);
  }
  return { time, field };
}

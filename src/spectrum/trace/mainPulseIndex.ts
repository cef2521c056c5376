// Locates the main pulse of a trace: the sample with the largest field magnitude.
import type { Trace } from './types.js';

export interface MainPulseIndexOptions {
  /**
   * Search only this delay range (fs), e.g. to skip a stronger artefact; null searches the whole trace.
   * @default null
   */
  window?: { start: number; end: number } | null;
}

/** Index of the largest |field| (the first one on ties); −1 when no sample lies in the searched range. */
export function mainPulseIndex(trace: Trace, options: MainPulseIndexOptions = {}): number {
  const window = options.window ?? null;
  const { time, field } = trace;
  let best = -1;
  let bestValue = -1;
  for (let i = 0; i < field.length; i++) {
    if (window !== null && (time[i]! < window.start || time[i]! > window.end)) continue;
    const v = Math.abs(field[i]!);
    if (v > bestValue) {
      bestValue = v;
      best = i;
    }
  }
  return best;
}

// Delays a trace by a fraction of a sample with a Fourier phase ramp, the exact shift of a band-limited signal.
import FFT from 'fft.js';
import type { Trace } from './types.js';

export interface ShiftTraceOptions {
  /**
   * Delay in fs: the returned field is E(t − delay) on the same delay axis, so a positive delay moves the pulse later.
   * @default 0
   */
  delay?: number;
}

/**
 * Returns the trace delayed by `delay` fs on its own axis. The record is padded to at least twice its length with a
 * raised-cosine blend from its last value back to its first, so the periodic extension the FFT assumes is smooth
 * (no Gibbs ringing from a step at the ends) and nothing shifted out of one end wraps into the other. Samples that
 * come from outside the record take the blended padding, which is close to the edge values.
 */
export function shiftTrace(trace: Trace, options: ShiftTraceOptions = {}): Trace {
  const delay = options.delay ?? 0;
  const { time, field } = trace;
  const n = time.length;
  if (delay === 0 || n < 2) return { time: time.slice(), field: field.slice() };
  const step = (time[n - 1]! - time[0]!) / (n - 1);
  let size = 2;
  while (size < 2 * n) size *= 2;
  const first = field[0]!;
  const last = field[n - 1]!;
  const data = new Float64Array(2 * size);
  for (let i = 0; i < n; i++) data[2 * i] = field[i]!;
  const pad = size - n;
  for (let j = 0; j < pad; j++) {
    const u = (j + 1) / (pad + 1);
    data[2 * (n + j)] = last + (first - last) * 0.5 * (1 - Math.cos(Math.PI * u));
  }
  const fft = new FFT(size);
  const spectrum = new Float64Array(2 * size);
  fft.transform(spectrum, data);
  const samples = delay / step;
  for (let k = 0; k < size; k++) {
    // Signed bin index: bins above N/2 are the negative frequencies; the Nyquist bin gets a real factor so the
    // result stays real.
    const signed = k <= size / 2 ? k : k - size;
    const angle = (-2 * Math.PI * signed * samples) / size;
    const re = spectrum[2 * k]!;
    const im = spectrum[2 * k + 1]!;
    if (k === size / 2) {
      const c = Math.cos(angle);
      spectrum[2 * k] = re * c;
      spectrum[2 * k + 1] = im * c;
      continue;
    }
    const c = Math.cos(angle);
    const s = Math.sin(angle);
    spectrum[2 * k] = re * c - im * s;
    spectrum[2 * k + 1] = re * s + im * c;
  }
  const back = new Float64Array(2 * size);
  fft.inverseTransform(back, spectrum);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = back[2 * i]!;
  return { time: time.slice(), field: out };
}

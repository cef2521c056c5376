// Time-domain step 3: an apodisation window that tapers the record's far end so truncation does not ring in the spectrum.
import { mainPulseIndex } from './mainPulseIndex.js';
import type { Trace } from './types.js';

export type ApodisationWindow = 'none' | 'hann' | 'blackman-harris' | 'happ-genzel';

export interface ApodiseOptions {
  /**
   * The window shape: Hann ½(1 + cos πx), 4-term Blackman–Harris (−92 dB side lobes), Happ–Genzel 0.54 + 0.46 cos πx.
   * @default 'hann'
   */
  window?: ApodisationWindow;
  /**
   * Delay (fs) where the window is 1; the main pulse (largest |field|) by default.
   * @default undefined
   */
  centre?: number;
  /**
   * Half-width (fs) at which the window reaches its end value; by default the distance from the centre to the
   * farther end of the trace, so the whole record stays inside the window.
   * @default undefined
   */
  halfWidth?: number;
}

// Harris, Proc. IEEE 66:51 (1978), 4-term minimum side-lobe coefficients (from memory), written centred on x = 0.
const BH = [0.35875, 0.48829, 0.14128, 0.01168] as const;

/**
 * Returns the trace multiplied by w((t − centre) / halfWidth), w(0) = 1, w(±1) at the window's end value and 0 beyond.
 * The window is centred on the main pulse rather than the record's middle because the pulse sits near the start of a
 * field-resolved record with the molecular response after it; pass the same centre and half-width for sample and
 * reference so both see the same window.
 */
export function apodise(trace: Trace, options: ApodiseOptions = {}): Trace {
  const window = options.window ?? 'hann';
  const { time, field } = trace;
  const n = time.length;
  if (window === 'none' || n === 0) return { time: time.slice(), field: field.slice() };
  const centre = options.centre ?? time[Math.max(0, mainPulseIndex(trace))]!;
  const halfWidth =
    options.halfWidth ??
    Math.max(Math.abs(centre - time[0]!), Math.abs(time[n - 1]! - centre), Number.MIN_VALUE);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = (time[i]! - centre) / halfWidth;
    let w = 0;
    if (Math.abs(x) <= 1) {
      const c = Math.cos(Math.PI * x);
      if (window === 'hann') w = 0.5 * (1 + c);
      else if (window === 'happ-genzel') w = 0.54 + 0.46 * c;
      else w = BH[0] + BH[1] * c + BH[2] * Math.cos(2 * Math.PI * x) + BH[3] * Math.cos(3 * Math.PI * x);
    }
    out[i] = field[i]! * w;
  }
  return { time: time.slice(), field: out };
}

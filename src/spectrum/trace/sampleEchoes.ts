// Finds pulse replicas (reflection echoes) in a sample trace that the reference trace lacks at the same delay.
import { mainPulseIndex } from './mainPulseIndex.js';
import type { Trace } from './types.js';

export interface SampleEchoesOptions {
  /**
   * An echo is reported when its matched-filter amplitude is at least this fraction of the main pulse's (field
   * ratio; 0.05 in field is 0.25 % in power, yet raises absorbance noticeably when only the sample has it).
   * @default 0.05
   */
  fraction?: number;
  /** Only delays (fs) inside this window count (a gate removes what lies outside). @default null (the whole trace) */
  window?: { start: number; end: number } | null;
}

export interface SampleEcho {
  /** Delay of the echo after (positive) or before the main pulse, fs. */
  delay: number;
  /** Its matched-filter amplitude as a fraction of the main pulse's, in the sample. */
  sample: number;
  /** The same in the reference at the same relative delay. */
  reference: number;
}

/** How many times its surroundings' mean matched-filter level a replica's peak must reach. */
const STAND_OUT = 4;

/** Half-width (samples) of the reference's main pulse: where |E| stays above 1 % of its peak, with a margin. */
function pulseHalfWidth(reference: Trace, centre: number): number {
  const f = reference.field;
  const floor = 0.01 * Math.abs(f[centre]!);
  let lo = centre;
  let hi = centre;
  for (let i = centre; i >= 0; i--) if (Math.abs(f[i]!) > floor) lo = i;
  for (let i = centre; i < f.length; i++) if (Math.abs(f[i]!) > floor) hi = i;
  // The outermost samples above 1 %, bounded: a long molecular response must not make the pulse the whole trace.
  return Math.max(2, Math.min(Math.max(centre - lo, hi - centre), Math.floor(f.length / 16)));
}

/** |Σ trace(i + k) · pulse(k)| / Σ pulse², for every lag i (the pulse's first sample at i). */
function matchedFilter(trace: Float64Array, pulse: Float64Array): Float64Array {
  let energy = 0;
  for (const v of pulse) energy += v * v;
  const out = new Float64Array(Math.max(0, trace.length - pulse.length + 1));
  for (let i = 0; i < out.length; i++) {
    let s = 0;
    for (let k = 0; k < pulse.length; k++) s += trace[i + k]! * pulse[k]!;
    out[i] = energy > 0 ? Math.abs(s) / energy : 0;
  }
  return out;
}

/**
 * Matched filter (cross-correlation with the reference's own main pulse, common practice for locating a known
 * pulse shape in a trace): the sample's correlation peaks at its main pulse and again at each replica of it. A
 * local maximum at least two pulse widths from the main one, above `fraction` of it in the sample and at least
 * STAND_OUT times the mean level 2–10 pulse widths around it (a replica is as short as the pulse; a molecular
 * response, a free-induction decay, rings on at a similar level and is not reported), while the reference at the
 * same delay from its own main pulse stays below half that, is an echo only the sample has; its spectral
 * interference is then read as absorbance. Both traces share one delay step (as traceToSpectrum checks).
 * Returns the echoes, strongest first.
 */
export function sampleEchoes(
  sample: Trace,
  reference: Trace,
  options: SampleEchoesOptions = {},
): SampleEcho[] {
  const fraction = options.fraction ?? 0.05;
  const window = options.window ?? null;
  const rc = mainPulseIndex(reference);
  if (rc < 0 || sample.field.length < 8) return [];
  const half = pulseHalfWidth(reference, rc);
  const start = Math.max(0, rc - half);
  const pulse = reference.field.slice(start, Math.min(reference.field.length, rc + half + 1));
  const s = matchedFilter(sample.field, pulse);
  const r = matchedFilter(reference.field, pulse);
  if (s.length === 0) return [];
  let sMain = 0;
  for (let i = 1; i < s.length; i++) if (s[i]! > s[sMain]!) sMain = i;
  const rMain = start;
  const dt = sample.time.length > 1 ? sample.time[1]! - sample.time[0]! : 1;
  const width = 2 * half + 1;
  /** Mean matched-filter value 2–10 pulse widths either side of lag i: the level a replica must stand out of. */
  const surrounding = (i: number): number => {
    let sum = 0;
    let n = 0;
    for (let k = i - 10 * width; k <= i + 10 * width; k++) {
      if (k < 0 || k >= s.length || Math.abs(k - i) < 2 * width || Math.abs(k - sMain) < 2 * width) continue;
      sum += s[k]!;
      n++;
    }
    return n === 0 ? 0 : sum / n;
  };
  const found: (SampleEcho & { lag: number })[] = [];
  for (let i = 1; i + 1 < s.length; i++) {
    if (Math.abs(i - sMain) < 2 * width) continue;
    if (!(s[i]! >= s[i - 1]! && s[i]! > s[i + 1]!)) continue;
    const ratio = s[i]! / s[sMain]!;
    if (!(ratio >= fraction)) continue;
    // A replica is as short as the pulse; a molecular response rings on at a similar level around it.
    if (!(s[i]! >= STAND_OUT * surrounding(i))) continue;
    const t = sample.time[i + (rc - start)]!;
    if (window !== null && (t < window.start || t > window.end)) continue;
    const j = rMain + (i - sMain);
    const there = j >= 0 && j < r.length ? r[j]! / r[rMain]! : 0;
    if (there >= fraction / 2) continue;
    found.push({ delay: (i - sMain) * dt, sample: ratio, reference: there, lag: i });
  }
  // One echo per replica: the carrier's fringes around its peak are the same echo.
  found.sort((a, b) => b.sample - a.sample);
  const echoes: SampleEcho[] = [];
  const kept: number[] = [];
  for (const e of found) {
    if (kept.some((lag) => Math.abs(lag - e.lag) < 2 * width)) continue;
    kept.push(e.lag);
    echoes.push({ delay: e.delay, sample: e.sample, reference: e.reference });
  }
  return echoes.sort((a, b) => b.sample - a.sample);
}

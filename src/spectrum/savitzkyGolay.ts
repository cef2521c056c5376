// Savitzky–Golay smoothing or differentiation of an evenly spaced signal, with least-squares fits at the ends.
import { BandshelfError } from '../error.js';
import { savitzkyGolayCoefficients } from './savitzkyGolayCoefficients.js';

export interface SavitzkyGolayOptions {
  /**
   * Number of points in the moving window; odd.
   * @default 9
   */
  window?: number;
  /**
   * Order of the local polynomial; below the window.
   * @default 2
   */
  order?: number;
  /**
   * Which derivative to return (0 smooths); at most the order.
   * @default 0
   */
  derivative?: number;
  /**
   * Point spacing, in the units the derivative should be per (e.g. cm⁻¹); derivatives are divided by deltaᵈ.
   * @default 1
   */
  delta?: number;
}

/**
 * Filters `y` with a Savitzky–Golay window and returns a new array of the same length. The first and last
 * half-window of points are not zero-padded or mirrored: each takes the value (or derivative) of the
 * polynomial fitted to the first or last full window, evaluated at that point.
 *
 * NaN marks "not covered" in processed vectors, so every run of finite values is filtered on its own and
 * never mixed with data across a gap; a run shorter than the window cannot carry a fit and comes out NaN.
 */
export function savitzkyGolay(y: Float64Array, options: SavitzkyGolayOptions = {}): Float64Array {
  const window = options.window ?? 9;
  const order = options.order ?? 2;
  const derivative = options.derivative ?? 0;
  const delta = options.delta ?? 1;
  if (!Number.isFinite(delta) || delta === 0) {
    throw new BandshelfError('BAD_RECIPE', `the point spacing must be finite and non-zero, not ${delta}`, {
      field: 'smooth.delta',
    });
  }
  const centre = savitzkyGolayCoefficients(window, order, derivative);
  const m = (window - 1) / 2;
  const scale = 1 / delta ** derivative;
  // edge[e] holds the weights for offset e − m from the centre of an end window (e = 0 … 2m).
  const edge: Float64Array[] = [];
  for (let e = 0; e <= 2 * m; e++)
    edge.push(savitzkyGolayCoefficients(window, order, derivative, { at: e - m }));

  const n = y.length;
  const out = new Float64Array(n).fill(Number.NaN);
  let start = 0;
  while (start < n) {
    if (!Number.isFinite(y[start]!)) {
      start++;
      continue;
    }
    let end = start;
    while (end + 1 < n && Number.isFinite(y[end + 1]!)) end++;
    if (end - start + 1 >= window) filterRun(y, out, start, end, centre, edge, m, scale);
    start = end + 1;
  }
  return out;
}

/** Filters the finite run y[start … end] (inclusive, at least one window long) into out. */
function filterRun(
  y: Float64Array,
  out: Float64Array,
  start: number,
  end: number,
  centre: Float64Array,
  edge: Float64Array[],
  m: number,
  scale: number,
): void {
  const window = 2 * m + 1;
  for (let j = start + m; j <= end - m; j++) {
    let acc = 0;
    const base = j - m;
    for (let i = 0; i < window; i++) acc += centre[i]! * y[base + i]!;
    out[j] = acc * scale;
  }
  const lastBase = end - 2 * m;
  for (let e = 0; e < m; e++) {
    const head = edge[e]!;
    const tail = edge[2 * m - e]!;
    let accHead = 0;
    let accTail = 0;
    for (let i = 0; i < window; i++) {
      accHead += head[i]! * y[start + i]!;
      accTail += tail[i]! * y[lastBase + i]!;
    }
    out[start + e] = accHead * scale;
    out[end - e] = accTail * scale;
  }
}

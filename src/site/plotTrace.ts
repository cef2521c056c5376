// Prepares one trace for a page's plot: decimated for display and rounded to what a screen can show.
import { decimateTrace } from './decimateTrace.js';
import type { PlotTrace } from './types.js';

export interface PlotTraceOptions {
  /** Passed to decimateTrace.
   * @default 1200 */
  maxPoints?: number;
  /** Significant digits kept relative to the trace's range (a 1000 px plot resolves about 3).
   * @default 5 */
  digits?: number;
}

/** Returns null when the trace has no finite point. Downloads keep the full data; this is for display only. */
export function plotTrace(
  x: Float64Array,
  y: Float64Array | Float32Array,
  options: PlotTraceOptions = {},
): PlotTrace | null {
  const y64 = y instanceof Float64Array ? y : Float64Array.from(y);
  const thin = decimateTrace(x, y64, { maxPoints: options.maxPoints ?? 1200 });
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (const v of thin.y) {
    if (Number.isFinite(v)) {
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  if (!Number.isFinite(lo)) return null;
  const range = hi - lo || Math.abs(hi) || 1;
  const digits = options.digits ?? 5;
  const yStep = 10 ** (Math.floor(Math.log10(range)) - (digits - 1));
  const yDecimals = Math.max(0, -Math.floor(Math.log10(yStep)));
  const outX: number[] = new Array(thin.x.length);
  const outY: (number | null)[] = new Array(thin.y.length);
  for (let i = 0; i < thin.x.length; i++) {
    const xi = thin.x[i]!;
    const yi = thin.y[i]!;
    // Wavenumbers to 0.01 cm⁻¹, far below any band width. A break sits halfway between its neighbours: plots sort
    // points by x, and a break sharing its neighbour's x could sort to the wrong side and bridge the gap.
    const between = ((thin.x[i - 1] ?? 0) + (thin.x[i + 1] ?? thin.x[i - 1] ?? 0)) / 2;
    outX[i] = Math.round((Number.isFinite(xi) ? xi : between) * 100) / 100;
    outY[i] = Number.isFinite(yi)
      ? Number((Math.round(yi / yStep) * yStep).toFixed(Math.min(20, yDecimals)))
      : null;
  }
  return { x: outX, y: outY };
}

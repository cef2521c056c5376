// Flattens plot series into the row objects Vega-Lite reads, with the wavenumber range they cover.
import type { ReportPlotSeries } from '../types.js';

export interface SeriesRowsOptions {
  /** Range returned when no series has a finite point, cm⁻¹.
   * @default [600, 4000] */
  fallback?: [number, number];
}

export function seriesRows(
  series: ReportPlotSeries[],
  options: SeriesRowsOptions = {},
): { values: { x: number; y: number | null; series: string }[]; lo: number; hi: number } {
  const values: { x: number; y: number | null; series: string }[] = [];
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (const s of series) {
    for (let i = 0; i < s.x.length; i++) {
      const y = s.y[i] ?? null;
      values.push({ x: s.x[i]!, y, series: s.name });
      if (y !== null) {
        lo = Math.min(lo, s.x[i]!);
        hi = Math.max(hi, s.x[i]!);
      }
    }
  }
  if (!Number.isFinite(lo)) [lo, hi] = options.fallback ?? [600, 4000];
  return { values, lo, hi };
}

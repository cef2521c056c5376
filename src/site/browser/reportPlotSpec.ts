// The Vega-Lite specs of a match report: the unknown over its top hits, and the mixture fit with its residual
// and the unexplained bands marked.
import type { TopLevelSpec } from 'vega-lite';
import type { ReportPlotSeries } from '../types.js';
import { okabeIto } from './okabeIto.js';
import { plotConfig } from './plotConfig.js';

export interface ReportPlotSpecOptions {
  /** Positions to mark with a labelled rule (the unexplained bands), cm⁻¹.
   * @default [] */
  marks?: number[];
  /** Title of the y axis.
   * @default 'processed absorbance' */
  yTitle?: string;
  /** Plot height in px.
   * @default 300 */
  height?: number;
}

export function reportPlotSpec(series: ReportPlotSeries[], options: ReportPlotSpecOptions = {}): TopLevelSpec {
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
  if (!Number.isFinite(lo)) [lo, hi] = [600, 4000];
  // The unknown in black, the rest in the Okabe–Ito colours; the residual always vermillion.
  const palette = okabeIto();
  const names = series.map((s) => s.name);
  const colours = series.map((s, i) => (s.role === 'residual' ? '#D55E00' : (palette[i % palette.length] ?? '#000000')));
  const x = {
    field: 'x',
    type: 'quantitative' as const,
    title: 'wavenumber / cm⁻¹',
    scale: { domain: [lo, hi], reverse: true, zero: false, nice: false },
    axis: { tickCount: 10, labelFlush: true },
  };
  const marks = (options.marks ?? []).filter((p) => p >= lo && p <= hi).map((position) => ({ position, label: `${Math.round(position)}` }));
  return {
    width: 'container',
    height: options.height ?? 300,
    autosize: { type: 'fit-x', contains: 'padding' },
    config: plotConfig(),
    layer: [
      {
        data: { values },
        params: [{ name: 'zoom', select: { type: 'interval', encodings: ['x'] }, bind: 'scales' }],
        mark: { type: 'line', clip: true },
        encoding: {
          x,
          y: { field: 'y', type: 'quantitative', title: options.yTitle ?? 'processed absorbance', scale: { zero: false } },
          color: {
            field: 'series',
            type: 'nominal',
            title: null,
            scale: { domain: names, range: colours },
            sort: names,
          },
          strokeDash: {
            field: 'series',
            type: 'nominal',
            legend: null,
            scale: { domain: names, range: series.map((s) => (s.role === 'hit' ? [5, 3] : [1, 0])) },
          },
        },
      },
      ...(marks.length > 0
        ? [
            {
              data: { values: marks },
              mark: { type: 'rule' as const, color: '#D55E00', strokeDash: [2, 2], clip: true },
              encoding: { x: { ...x, field: 'position' } },
            },
            {
              data: { values: marks },
              mark: { type: 'text' as const, color: '#8a3b00', dy: -6, baseline: 'bottom' as const, clip: true },
              encoding: {
                x: { ...x, field: 'position' },
                y: { value: 12 },
                text: { field: 'label', type: 'nominal' as const },
              },
            },
          ]
        : []),
    ],
  };
}

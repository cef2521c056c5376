// The Vega-Lite spec of a match report's overlay: the unknown in black over its top hits, wavenumber high → low.
import type { TopLevelSpec } from 'vega-lite';
import type { ReportPlotSeries } from '../types.js';
import { okabeIto } from './okabeIto.js';
import { plotConfig } from './plotConfig.js';
import { seriesRows } from './seriesRows.js';

export interface ReportPlotSpecOptions {
  /** Title of the y axis.
   * @default 'processed absorbance' */
  yTitle?: string;
  /** Plot height in px.
   * @default 300 */
  height?: number;
}

export function reportPlotSpec(
  series: ReportPlotSeries[],
  options: ReportPlotSpecOptions = {},
): TopLevelSpec {
  const { values, lo, hi } = seriesRows(series);
  // The unknown in black, the hits in the other Okabe–Ito colours, dashed so they read apart from the unknown.
  const palette = okabeIto();
  const names = series.map((s) => s.name);
  return {
    width: 'container',
    height: options.height ?? 300,
    autosize: { type: 'fit-x', contains: 'padding' },
    config: plotConfig(),
    data: { values },
    params: [{ name: 'zoom', select: { type: 'interval', encodings: ['x'] }, bind: 'scales' }],
    mark: { type: 'line', clip: true, invalid: 'break-paths-show-domains' },
    encoding: {
      x: {
        field: 'x',
        type: 'quantitative',
        title: 'wavenumber / cm⁻¹',
        scale: { domain: [lo, hi], reverse: true, zero: false, nice: false },
        axis: { tickCount: 10, labelFlush: true },
      },
      y: {
        field: 'y',
        type: 'quantitative',
        title: options.yTitle ?? 'processed absorbance',
        scale: { zero: false },
      },
      color: {
        field: 'series',
        type: 'nominal',
        title: null,
        sort: names,
        scale: { domain: names, range: series.map((_, i) => palette[i % palette.length]!) },
      },
      // Same field as colour, so the two legends merge into one that shows both.
      strokeDash: {
        field: 'series',
        type: 'nominal',
        title: null,
        sort: names,
        scale: { domain: names, range: series.map((s) => (s.role === 'hit' ? [5, 3] : [1, 0])) },
      },
    },
  };
}

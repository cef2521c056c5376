// The Vega-Lite spec of a mixture fit: the unknown and the fit above, the residual below on its own scale, the
// unexplained bands marked in both; one zoom for the two panels.
import type { TopLevelSpec } from 'vega-lite';
import type { ReportPlotSeries } from '../types.js';
import { plotConfig } from './plotConfig.js';
import { seriesRows } from './seriesRows.js';

export interface MixturePlotSpecOptions {
  /** Heights of the fit and residual panels in px.
   * @default [260, 150] */
  heights?: [number, number];
}

/** `series`: the unknown, the fit and the residual (roles unknown, fit, residual); `unexplained` in cm⁻¹. */
export function mixturePlotSpec(
  series: ReportPlotSeries[],
  unexplained: number[],
  options: MixturePlotSpecOptions = {},
): TopLevelSpec {
  const [fitHeight, residualHeight] = options.heights ?? [260, 150];
  const top = series.filter((s) => s.role !== 'residual');
  const residual = series.filter((s) => s.role === 'residual');
  const { values: topRows, lo, hi } = seriesRows(top);
  const { values: residualRows } = seriesRows(residual);
  const marks = unexplained
    .filter((p) => p >= lo && p <= hi)
    .map((position) => ({ position, label: `${Math.round(position)}` }));
  const x = {
    field: 'x',
    type: 'quantitative' as const,
    title: 'wavenumber / cm⁻¹',
    scale: { domain: [lo, hi], reverse: true, zero: false, nice: false },
    axis: { tickCount: 10, labelFlush: true },
  };
  const names = top.map((s) => s.name);
  // The unknown black, the fit Okabe–Ito blue dashed; the residual vermillion, its bands marked in vermillion.
  const rules = {
    data: { values: marks },
    mark: { type: 'rule' as const, color: '#D55E00', strokeDash: [2, 2], clip: true },
    encoding: { x: { ...x, field: 'position' } },
  };
  return {
    config: plotConfig(),
    autosize: { type: 'fit-x', contains: 'padding' },
    vconcat: [
      {
        width: 'container',
        height: fitHeight,
        layer: [
          {
            data: { values: topRows },
            params: [{ name: 'zoom', select: { type: 'interval', encodings: ['x'] }, bind: 'scales' }],
            mark: { type: 'line', clip: true, invalid: 'break-paths-show-domains' },
            encoding: {
              x,
              y: { field: 'y', type: 'quantitative', title: 'unknown and fit', scale: { zero: false } },
              color: {
                field: 'series',
                type: 'nominal',
                title: null,
                sort: names,
                scale: { domain: names, range: top.map((s) => (s.role === 'fit' ? '#0072B2' : '#000000')) },
              },
              strokeDash: {
                field: 'series',
                type: 'nominal',
                title: null,
                sort: names,
                scale: { domain: names, range: top.map((s) => (s.role === 'fit' ? [6, 3] : [1, 0])) },
              },
            },
          },
          ...(marks.length > 0 ? [rules] : []),
        ],
      },
      {
        width: 'container',
        height: residualHeight,
        layer: [
          {
            data: { values: [{ zero: 0 }] },
            mark: { type: 'rule', color: '#8f8a80' },
            encoding: { y: { field: 'zero', type: 'quantitative' } },
          },
          {
            data: { values: residualRows },
            mark: { type: 'line', color: '#D55E00', clip: true, invalid: 'break-paths-show-domains' },
            encoding: {
              x,
              y: { field: 'y', type: 'quantitative', title: 'residual', scale: { zero: true } },
            },
          },
          ...(marks.length > 0
            ? [
                rules,
                {
                  data: { values: marks },
                  mark: {
                    type: 'text' as const,
                    color: '#8a3b00',
                    baseline: 'top' as const,
                    align: 'left' as const,
                    dx: 3,
                    fontSize: 11,
                    clip: true,
                  },
                  encoding: {
                    x: { ...x, field: 'position' },
                    y: { value: 2 },
                    text: { field: 'label', type: 'nominal' as const },
                  },
                },
              ]
            : []),
        ],
      },
    ],
    resolve: { scale: { x: 'shared' } },
  };
}

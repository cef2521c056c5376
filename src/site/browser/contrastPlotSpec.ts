// The Vega-Lite specs of a contrast page: the two group means with ± 1 SD bands, and the difference of means with
// its interval, the difference bands and significant band-level windows shaded; wavenumber high → low.
import type { TopLevelSpec } from 'vega-lite';
import type { ContrastPlotData } from '../types.js';
import { okabeIto } from './okabeIto.js';
import { plotConfig } from './plotConfig.js';

export interface ContrastPlotSpecOptions {
  /** Which plot. @default 'means' */
  plot?: 'means' | 'difference';
  /** Plot height in px. @default 280 */
  height?: number;
}

export function contrastPlotSpec(
  data: ContrastPlotData,
  options: ContrastPlotSpecOptions = {},
): TopLevelSpec {
  const palette = okabeIto();
  const finite = data.x.filter((_, i) => data.difference[i] !== null);
  const lo = finite.length > 0 ? Math.min(...finite) : Math.min(...data.x);
  const hi = finite.length > 0 ? Math.max(...finite) : Math.max(...data.x);
  const x = {
    field: 'x',
    type: 'quantitative' as const,
    title: 'wavenumber / cm⁻¹',
    scale: { domain: [lo, hi], reverse: true, zero: false, nice: false },
  };
  const base = {
    width: 'container' as const,
    height: options.height ?? 280,
    autosize: { type: 'fit-x' as const, contains: 'padding' as const },
    config: plotConfig(),
  };
  if ((options.plot ?? 'means') === 'means') {
    const values = data.x.flatMap((xv, i) =>
      (
        [
          [data.labelA, data.meanA[i], data.sdA[i]],
          [data.labelB, data.meanB[i], data.sdB[i]],
        ] as const
      ).map(([group, mean, sd]) => ({
        x: xv,
        group,
        mean: mean ?? null,
        low: mean === null || mean === undefined || sd === null || sd === undefined ? null : mean - sd,
        high: mean === null || mean === undefined || sd === null || sd === undefined ? null : mean + sd,
      })),
    );
    const color = {
      field: 'group',
      type: 'nominal' as const,
      title: null,
      scale: { domain: [data.labelA, data.labelB], range: [palette[1]!, palette[2]!] },
    };
    return {
      ...base,
      data: { values },
      layer: [
        {
          mark: { type: 'area', opacity: 0.25, clip: true },
          encoding: {
            x,
            y: { field: 'low', type: 'quantitative', title: 'processed absorbance' },
            y2: { field: 'high' },
            color,
          },
        },
        {
          mark: { type: 'line', clip: true },
          encoding: { x, y: { field: 'mean', type: 'quantitative' }, color },
        },
      ],
    };
  }
  const values = data.x.map((xv, i) => ({
    x: xv,
    difference: data.difference[i] ?? null,
    lower: data.lower[i] ?? null,
    upper: data.upper[i] ?? null,
  }));
  const shaded = [
    ...data.windows.map((w) => ({ ...w, kind: 'band-level window' })),
    ...data.regions.map((r) => ({ min: r.min, max: r.max, kind: 'difference band' })),
  ];
  return {
    ...base,
    layer: [
      {
        data: { values: shaded },
        mark: { type: 'rect', clip: true },
        encoding: {
          x: { field: 'min', type: 'quantitative', scale: x.scale, title: x.title },
          x2: { field: 'max' },
          opacity: {
            field: 'kind',
            type: 'nominal',
            title: null,
            scale: { domain: ['difference band', 'band-level window'], range: [0.35, 0.15] },
          },
          color: { value: palette[3]! },
        },
      },
      {
        data: { values },
        mark: { type: 'area', opacity: 0.3, clip: true, color: palette[5]! },
        encoding: {
          x,
          y: { field: 'lower', type: 'quantitative', title: `${data.labelA} − ${data.labelB}` },
          y2: { field: 'upper' },
        },
      },
      {
        data: { values },
        mark: { type: 'line', clip: true, color: palette[0]! },
        encoding: { x, y: { field: 'difference', type: 'quantitative' } },
      },
    ],
  };
}

// The Vega-Lite spec of several spectra overlaid on one wavenumber axis (high → low), one colour each.
import type { TopLevelSpec } from 'vega-lite';
import { okabeIto } from './okabeIto.js';
import { plotConfig } from './plotConfig.js';

export interface OverlayPlotSpecOptions {
  /** Plot width and height in px. @default { width: 800, height: 360 } */
  size?: { width: number; height: number };
  /** The y axis title. @default 'absorbance (processed)' */
  yTitle?: string;
}

/** `series[k].y[i]` belongs to `x[i]`; null or NaN breaks the line (not covered). */
export function overlayPlotSpec(
  data: { x: ArrayLike<number>; series: readonly { label: string; y: ArrayLike<number | null> }[] },
  options: OverlayPlotSpecOptions = {},
): TopLevelSpec {
  const size = options.size ?? { width: 800, height: 360 };
  const values: { x: number; y: number | null; spectrum: string }[] = [];
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (const s of data.series) {
    for (let i = 0; i < data.x.length; i++) {
      const y = s.y[i];
      const finite = typeof y === 'number' && Number.isFinite(y);
      values.push({ x: data.x[i]!, y: finite ? y : null, spectrum: s.label });
      if (finite) {
        lo = Math.min(lo, data.x[i]!);
        hi = Math.max(hi, data.x[i]!);
      }
    }
  }
  const colours = okabeIto({ withoutBlack: true });
  return {
    width: size.width,
    height: size.height,
    config: plotConfig(),
    data: { values },
    mark: { type: 'line', clip: true, invalid: 'break-paths-show-domains' },
    encoding: {
      x: {
        field: 'x',
        type: 'quantitative',
        title: 'wavenumber / cm⁻¹',
        scale: {
          domain: Number.isFinite(lo) ? [lo, hi] : [600, 4000],
          reverse: true,
          zero: false,
          nice: false,
        },
        axis: { tickCount: 10 },
      },
      y: {
        field: 'y',
        type: 'quantitative',
        title: options.yTitle ?? 'absorbance (processed)',
        scale: { zero: false },
      },
      color: {
        field: 'spectrum',
        type: 'nominal',
        title: null,
        sort: data.series.map((s) => s.label),
        scale: {
          domain: data.series.map((s) => s.label),
          range: data.series.map((_, i) => colours[i % colours.length]!),
        },
      },
    },
  };
}

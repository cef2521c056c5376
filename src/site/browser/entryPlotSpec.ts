// The Vega-Lite spec of an entry's plot: wavenumber high → low, absorbance up, zoom and pan on the wavenumber axis.
import type { TopLevelSpec } from 'vega-lite';
import type { EntryPlotData, PlotTrace } from '../types.js';
import { okabeIto } from './okabeIto.js';
import { plotConfig } from './plotConfig.js';

export interface EntryPlotSpecOptions {
  /** Which traces to draw.
   * @default { original: true, processed: false } */
  show?: { original: boolean; processed: boolean };
  /** Plot height in px.
   * @default 340 */
  height?: number;
}

function rows(trace: PlotTrace): { x: number; y: number | null }[] {
  const out = new Array<{ x: number; y: number | null }>(trace.x.length);
  for (let i = 0; i < trace.x.length; i++) out[i] = { x: trace.x[i]!, y: trace.y[i] ?? null };
  return out;
}

function extent(traces: PlotTrace[]): [number, number] {
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (const t of traces) {
    for (let i = 0; i < t.x.length; i++) {
      if (t.y[i] === null) continue;
      const v = t.x[i]!;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  return Number.isFinite(lo) ? [lo, hi] : [600, 4000];
}

/**
 * The x scale runs over the data's wavenumber range with `reverse`, so the high wavenumbers sit on the left as
 * the trade draws spectra. With both traces shown each keeps its own y axis (absorbance left, processed right):
 * their units differ, and one shared axis would flatten the processed trace.
 */
export function entryPlotSpec(data: EntryPlotData, options: EntryPlotSpecOptions = {}): TopLevelSpec {
  const show = options.show ?? { original: true, processed: false };
  const [blue, vermillion] = okabeIto({ withoutBlack: true });
  const layers: { trace: PlotTrace; title: string; colour: string }[] = [];
  if (show.original && data.original)
    layers.push({ trace: data.original, title: data.originalLabel, colour: blue! });
  if (show.processed && data.processed) {
    layers.push({ trace: data.processed, title: data.processedLabel, colour: vermillion! });
  }
  // Nothing chosen: draw the original rather than an empty frame.
  if (layers.length === 0 && data.original)
    layers.push({ trace: data.original, title: data.originalLabel, colour: blue! });
  if (layers.length === 0 && data.processed) {
    layers.push({ trace: data.processed, title: data.processedLabel, colour: vermillion! });
  }
  const [lo, hi] = extent(layers.map((l) => l.trace));
  const x = {
    field: 'x',
    type: 'quantitative' as const,
    title: 'wavenumber / cm⁻¹',
    scale: { domain: [lo, hi], reverse: true, zero: false, nice: false },
    axis: { tickCount: 10, labelFlush: true },
  };
  return {
    width: 'container',
    height: options.height ?? 340,
    autosize: { type: 'fit-x', contains: 'padding' },
    config: plotConfig(),
    layer: layers.map((l, i) => ({
      data: { values: rows(l.trace) },
      ...(i === 0
        ? {
            params: [
              {
                name: 'zoom',
                select: { type: 'interval' as const, encodings: ['x' as const] },
                bind: 'scales' as const,
              },
            ],
          }
        : {}),
      mark: {
        type: 'line' as const,
        color: l.colour,
        clip: true,
        invalid: 'break-paths-show-domains' as const,
      },
      encoding: {
        x,
        y: {
          field: 'y',
          type: 'quantitative' as const,
          title: l.title,
          scale: { zero: false },
          axis: {
            orient: i === 0 ? ('left' as const) : ('right' as const),
            titleColor: l.colour,
            tickCount: 6,
          },
        },
      },
    })),
    resolve: { scale: { y: 'independent' } },
  };
}

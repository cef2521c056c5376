// What an entry page's plot draws, made from the entry's JSON download in the browser (browser-safe).
import { gridAxis } from '../spectrum/gridAxis.js';
import { plotTrace } from './plotTrace.js';
import type { EntryDocument, EntryPlotData } from './types.js';

export interface EntryPlotDataOptions {
  /** Largest number of points per trace handed to the plot.
   * @default 1200 */
  maxPoints?: number;
}

function normaliseLabel(method: string): string {
  if (method === 'vector') return 'processed (unit vector)';
  if (method === 'minmax') return 'processed (min–max scaled)';
  if (method === 'area') return 'processed (unit area)';
  if (method === 'band') return 'processed (band maximum = 1)';
  return 'processed';
}

/** The page fetches the full data once (the JSON download) and thins it here, so the plot stays light. */
export function entryPlotData(document: EntryDocument, options: EntryPlotDataOptions = {}): EntryPlotData {
  const maxPoints = options.maxPoints ?? 1200;
  const x = Float64Array.from(document.original.x);
  const y = Float64Array.from(document.original.y);
  const processed = Float64Array.from(document.processed, (v) => (v === null ? Number.NaN : v));
  return {
    original: plotTrace(x, y, { maxPoints }),
    processed: plotTrace(gridAxis(document.grid), processed, { maxPoints }),
    originalLabel: 'absorbance (original)',
    processedLabel: normaliseLabel(document.recipe.normalise.method),
    originalPoints: x.length,
    processedPoints: processed.length,
  };
}

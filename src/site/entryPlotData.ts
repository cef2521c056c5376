// What an entry page's plot draws, made from the entry's JSON download in the browser (browser-safe).
import { gridAxis } from '../spectrum/gridAxis.js';
import { gridLength } from '../spectrum/gridLength.js';
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

/**
 * The page fetches the full data once (the JSON download and the processed float32 file) and thins it here, so
 * the plot stays light.
 */
export function entryPlotData(
  document: EntryDocument,
  processedVector: Float32Array | Float64Array | null,
  options: EntryPlotDataOptions = {},
): EntryPlotData {
  const maxPoints = options.maxPoints ?? 1200;
  const x = Float64Array.from(document.original.x);
  const y = Float64Array.from(document.original.y);
  const processed = processedVector ? Float64Array.from(processedVector) : new Float64Array(0);
  return {
    original: plotTrace(x, y, { maxPoints }),
    processed:
      processed.length === gridLength(document.grid)
        ? plotTrace(gridAxis(document.grid), processed, { maxPoints })
        : null,
    originalLabel: 'absorbance (original)',
    processedLabel: normaliseLabel(document.recipe.normalise.method),
    originalPoints: x.length,
    processedPoints: processed.length,
  };
}

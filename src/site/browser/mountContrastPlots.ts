// Wires a contrast page's two plots from the data embedded in the page.
import type { ContrastPlotData } from '../types.js';
import { contrastPlotSpec } from './contrastPlotSpec.js';
import { embedSpec } from './embedSpec.js';

export interface MountContrastPlotsOptions {
  /** Id of the JSON data block.
   * @default 'contrast-plot-data' */
  dataId?: string;
}

export function mountContrastPlots(doc: Document, options: MountContrastPlotsOptions = {}): void {
  const node = doc.getElementById(options.dataId ?? 'contrast-plot-data');
  if (!node) return;
  const data = JSON.parse(node.textContent ?? 'null') as ContrastPlotData | null;
  if (!data) return;
  for (const [id, plot] of [
    ['contrast-means', 'means'],
    ['contrast-difference', 'difference'],
  ] as const) {
    const target = doc.getElementById(id);
    if (!target) continue;
    embedSpec(target, contrastPlotSpec(data, { plot }), { downloadFileName: target.dataset.download })
      .then(() => {
        target.dataset.rendered = 'true';
      })
      .catch((error: unknown) => {
        target.textContent = `The plot could not be drawn: ${error instanceof Error ? error.message : String(error)}`;
      });
  }
}

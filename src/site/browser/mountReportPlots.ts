// Wires a match report page's two plots from the data embedded in the page.
import type { TopLevelSpec } from 'vega-lite';
import type { ReportPlotData } from '../types.js';
import { embedSpec } from './embedSpec.js';
import { mixturePlotSpec } from './mixturePlotSpec.js';
import { reportPlotSpec } from './reportPlotSpec.js';

export interface MountReportPlotsOptions {
  /** Id of the JSON data block.
   * @default 'report-plot-data' */
  dataId?: string;
}

export function mountReportPlots(doc: Document, options: MountReportPlotsOptions = {}): void {
  const node = doc.getElementById(options.dataId ?? 'report-plot-data');
  if (!node) return;
  const data = JSON.parse(node.textContent ?? 'null') as ReportPlotData | null;
  if (!data) return;
  const draw = (id: string, spec: TopLevelSpec | null): void => {
    const target = doc.getElementById(id);
    if (!target) return;
    if (!spec) {
      target.remove();
      return;
    }
    embedSpec(target, spec, { downloadFileName: target.dataset.download })
      .then(() => {
        target.dataset.rendered = 'true';
      })
      .catch((error: unknown) => {
        target.textContent = `The plot could not be drawn: ${error instanceof Error ? error.message : String(error)}`;
      });
  };
  draw('report-plot', data.overlay.length > 0 ? reportPlotSpec(data.overlay) : null);
  draw('report-residual', data.mixture.length > 0 ? mixturePlotSpec(data.mixture, data.unexplained) : null);
}

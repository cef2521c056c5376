// The plot specs compile with Vega-Lite itself (a general-purpose library) to Vega with a reversed wavenumber
// scale (high → low, as spectra are drawn) bound to zoom and pan.
import { compile } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { entryPlotSpec } from '../../src/site/browser/entryPlotSpec.js';
import { mixturePlotSpec } from '../../src/site/browser/mixturePlotSpec.js';
import { reportPlotSpec } from '../../src/site/browser/reportPlotSpec.js';
import type { EntryPlotData, ReportPlotSeries } from '../../src/site/types.js';

const trace = { x: [600, 1000, 1650, 4000], y: [0.1, 0.2, null, 0.3] };
const data: EntryPlotData = {
  original: trace,
  processed: { x: [600, 2000, 4000], y: [0.01, 0.03, 0.02] },
  originalLabel: 'absorbance (original)',
  processedLabel: 'processed (unit vector)',
  originalPoints: 4,
  processedPoints: 3,
};

function xScale(vega: { scales?: { name: string; reverse?: unknown; domain?: unknown }[] }) {
  return vega.scales?.find((s) => s.name === 'x');
}

describe('entryPlotSpec', () => {
  it('compiles to a reversed x scale over the data range, zoomable, one y axis per trace', () => {
    const spec = entryPlotSpec(data, { show: { original: true, processed: true } });
    const { spec: vega } = compile(spec);
    const x = xScale(vega as never)!;
    expect(x.reverse).toBe(true);
    expect(JSON.stringify(vega)).toContain('"zoom');
    const ys = (vega.scales ?? []).filter((s) => s.name.startsWith('layer_') && s.name.endsWith('_y'));
    expect(ys).toHaveLength(2);
    // Domain of the x data: 600 … 4000, the null point left out of the range.
    expect(
      (spec as { layer: { encoding: { x: { scale: { domain: number[] } } } }[] }).layer[0]!.encoding.x.scale
        .domain,
    ).toEqual([600, 4000]);
  });

  it('draws the original when nothing is ticked rather than an empty frame', () => {
    const spec = entryPlotSpec(data, { show: { original: false, processed: false } }) as { layer: unknown[] };
    expect(spec.layer).toHaveLength(1);
  });
});

describe('report plots', () => {
  const series: ReportPlotSeries[] = [
    { name: 'unknown', role: 'unknown', x: [600, 4000], y: [0, 1] },
    { name: 'fit', role: 'fit', x: [600, 4000], y: [0, 0.9] },
    { name: 'residual', role: 'residual', x: [600, 4000], y: [0, 0.1] },
  ];
  it('the overlay compiles with a reversed x scale', () => {
    expect(xScale(compile(reportPlotSpec(series.slice(0, 2))).spec as never)!.reverse).toBe(true);
  });
  it('the mixture plot marks each unexplained band inside the range, on both panels', () => {
    const spec = mixturePlotSpec(series, [1780, 5000]);
    const { spec: vega } = compile(spec);
    expect(xScale(vega as never)!.reverse).toBe(true);
    const text = JSON.stringify(spec);
    expect(text).toContain('"position":1780');
    expect(text).not.toContain('5000');
    expect((spec as { vconcat: unknown[] }).vconcat).toHaveLength(2);
  });
});

// overlayPlotSpec: one line per spectrum, wavenumber high → low, gaps as breaks.
import { describe, expect, it } from 'vitest';
import { overlayPlotSpec } from '../../src/site/browser/overlayPlotSpec.js';

describe('overlayPlotSpec', () => {
  it('puts every point of every series in the data, NaN as null, and reverses the wavenumber axis', () => {
    const spec = overlayPlotSpec({
      x: [1000, 1002, 1004],
      series: [
        { label: 'a', y: [1, Number.NaN, 3] },
        { label: 'b', y: [2, 2, null] },
      ],
    }) as unknown as {
      data: { values: { x: number; y: number | null; spectrum: string }[] };
      encoding: {
        x: { scale: { domain: number[]; reverse: boolean } };
        color: { scale: { domain: string[] } };
      };
    };
    expect(spec.data.values).toHaveLength(6);
    expect(spec.data.values[1]).toEqual({ x: 1002, y: null, spectrum: 'a' });
    // Spectroscopists draw mid-IR spectra from high to low wavenumber (common practice).
    expect(spec.encoding.x.scale.reverse).toBe(true);
    expect(spec.encoding.x.scale.domain).toEqual([1000, 1004]);
    expect(spec.encoding.color.scale.domain).toEqual(['a', 'b']);
  });
});

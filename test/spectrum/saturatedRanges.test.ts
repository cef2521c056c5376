// Saturated runs become wavenumber ranges reaching halfway to their good neighbours (small literal inputs).
import { describe, expect, it } from 'vitest';
import { saturatedRanges } from '../../src/spectrum/saturatedRanges.js';

const spectrum = {
  wavenumber: Float64Array.from([1000, 1002, 1004, 1006, 1008]),
  absorbance: Float64Array.from([1, 4, 4, 1, 4]),
};

describe('saturatedRanges', () => {
  it('spans each run to the midpoints with its neighbours (worked by hand)', () => {
    // Run 1002–1004 → midpoints 1001 and 1005; the run at the end stops at its own point 1008 from 1007.
    expect(saturatedRanges(spectrum, { saturated: Uint8Array.from([0, 1, 1, 0, 1]) })).toEqual([
      [1001, 1005],
      [1007, 1008],
    ]);
  });
  it('gives nothing without a mask', () => {
    expect(saturatedRanges(spectrum)).toEqual([]);
  });
});

// Point validation shared by the readers: order, duplicates, non-finite values.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { spectrumFromPoints } from '../../src/formats/spectrumFromPoints.js';

const f = (v: number[]): Float64Array => Float64Array.from(v);

describe('spectrumFromPoints', () => {
  it('keeps ascending input, reverses descending input, and leaves the input arrays alone', () => {
    const x = f([3, 2, 1]);
    const y = f([30, 20, 10]);
    const { spectrum } = spectrumFromPoints({ x, y });
    expect(Array.from(spectrum.wavenumber)).toEqual([1, 2, 3]);
    expect(Array.from(spectrum.absorbance)).toEqual([10, 20, 30]);
    expect(Array.from(x)).toEqual([3, 2, 1]);
  });

  it('averages readings of one x with different y, warning with the line of the first repeat', () => {
    const { spectrum, warnings } = spectrumFromPoints(
      { x: f([1, 2, 2, 3]), y: f([1, 2, 5, 3]) },
      { file: 'd.csv', lines: [4, 5, 6, 7] },
    );
    expect(Array.from(spectrum.wavenumber)).toEqual([1, 2, 3]);
    // (2 + 5) / 2, by hand.
    expect(Array.from(spectrum.absorbance)).toEqual([1, 3.5, 3]);
    expect(warnings).toHaveLength(1);
    expect(warnings[0]!.line).toBe(6);
    expect(warnings[0]!.message).toMatch(/averaged.*spread 3 at x = 2/);
  });

  it('refuses all points at one x', () => {
    expect(() => spectrumFromPoints({ x: f([5, 5, 5]), y: f([1, 1, 1]) })).toThrow(/all points share one x/);
  });

  it('refuses NaN with NOT_FINITE', () => {
    expect(() => spectrumFromPoints({ x: f([1, Number.NaN]), y: f([1, 2]) })).toThrow(BandshelfError);
  });
});

// Tests of the first recipe step: ascending order, merged repeats, typed errors for unusable points.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { sortAndMerge } from '../../src/spectrum/sortAndMerge.js';

const spectrum = (x: number[], y: number[]) => ({
  wavenumber: Float64Array.from(x),
  absorbance: Float64Array.from(y),
});

function codeOf(run: () => unknown): string | undefined {
  try {
    run();
  } catch (error) {
    return error instanceof BandshelfError ? error.code : `raw ${String(error)}`;
  }
  return undefined;
}

describe('sortAndMerge', () => {
  it('reverses a descending spectrum (the way most instruments write it)', () => {
    const out = sortAndMerge(spectrum([4000, 3000, 2000, 1000], [0.1, 0.2, 0.3, 0.4]));
    expect(Array.from(out.wavenumber)).toEqual([1000, 2000, 3000, 4000]);
    expect(Array.from(out.absorbance)).toEqual([0.4, 0.3, 0.2, 0.1]);
  });

  it('sorts a shuffled spectrum keeping each absorbance with its wavenumber', () => {
    const out = sortAndMerge(spectrum([1500, 1200, 1800, 1000, 1650], [5, 2, 8, 0, 6]));
    expect(Array.from(out.wavenumber)).toEqual([1000, 1200, 1500, 1650, 1800]);
    expect(Array.from(out.absorbance)).toEqual([0, 2, 5, 6, 8]);
  });

  it('merges a repeated point with the same absorbance into one', () => {
    const out = sortAndMerge(spectrum([1000, 1002, 1002, 1004], [0.5, 0.6, 0.6, 0.7]));
    expect(Array.from(out.wavenumber)).toEqual([1000, 1002, 1004]);
    expect(Array.from(out.absorbance)).toEqual([0.5, 0.6, 0.7]);
  });

  it('averages repeated wavenumbers with different absorbances, and says how many (the usual practice)', () => {
    const seen: number[] = [];
    const out = sortAndMerge(spectrum([1000, 1002, 1004, 1002, 1002], [0.5, 0.6, 0.7, 0.65, 0.7]), {
      onAveraged: (count) => seen.push(count),
    });
    expect(Array.from(out.wavenumber)).toEqual([1000, 1002, 1004]);
    // (0.6 + 0.65 + 0.7) / 3 = 0.65, by hand.
    expect(out.absorbance[1]).toBeCloseTo(0.65, 12);
    expect(seen).toEqual([1]);
  });

  it('refuses NaN and Infinity with NOT_FINITE and names which axis', () => {
    expect(codeOf(() => sortAndMerge(spectrum([1000, Number.NaN, 1004], [1, 2, 3])))).toBe('NOT_FINITE');
    let caught: BandshelfError | undefined;
    try {
      sortAndMerge(spectrum([1000, 1002, 1004], [1, Number.POSITIVE_INFINITY, 3]));
    } catch (error) {
      caught = error as BandshelfError;
    }
    expect(caught?.code).toBe('NOT_FINITE');
    expect(caught?.field).toBe('absorbance');
  });

  it('refuses fewer than two distinct points', () => {
    expect(codeOf(() => sortAndMerge(spectrum([1000], [1])))).toBe('TOO_FEW_POINTS');
    expect(codeOf(() => sortAndMerge(spectrum([], [])))).toBe('TOO_FEW_POINTS');
    expect(codeOf(() => sortAndMerge(spectrum([1000, 1000], [1, 1])))).toBe('TOO_FEW_POINTS');
  });

  it('refuses axes of different lengths', () => {
    expect(codeOf(() => sortAndMerge(spectrum([1000, 1002], [1])))).toBe('BAD_FORMAT');
  });

  it('does not modify its input and returns fresh arrays even when already ascending', () => {
    const input = spectrum([1400, 1000, 1200], [3, 1, 2]);
    const before = [Array.from(input.wavenumber), Array.from(input.absorbance)];
    sortAndMerge(input);
    expect([Array.from(input.wavenumber), Array.from(input.absorbance)]).toEqual(before);
    const ascending = spectrum([1000, 1200], [1, 2]);
    const out = sortAndMerge(ascending);
    expect(out.wavenumber).not.toBe(ascending.wavenumber);
    expect(out.absorbance).not.toBe(ascending.absorbance);
  });
});

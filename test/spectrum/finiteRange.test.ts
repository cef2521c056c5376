// finiteRange: the extremes of the finite values only, checked by hand on small literal arrays.
import { describe, expect, it } from 'vitest';
import { finiteRange } from '../../src/spectrum/finiteRange.js';

describe('finiteRange', () => {
  it('skips NaN and ±Infinity (by hand: the finite values are 3, −2, 7.5)', () => {
    expect(
      finiteRange(
        Float64Array.of(3, Number.NaN, -2, Number.POSITIVE_INFINITY, 7.5, Number.NEGATIVE_INFINITY),
      ),
    ).toEqual({ min: -2, max: 7.5 });
  });

  it('gives +Infinity / −Infinity when nothing is finite, so every range test on it fails', () => {
    expect(finiteRange(Float64Array.of(Number.NaN))).toEqual({
      min: Number.POSITIVE_INFINITY,
      max: Number.NEGATIVE_INFINITY,
    });
    expect(finiteRange([])).toEqual({ min: Number.POSITIVE_INFINITY, max: Number.NEGATIVE_INFINITY });
  });
});

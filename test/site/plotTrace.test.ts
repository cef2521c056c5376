// Display copies of a trace: decimated, rounded to what a screen resolves, breaks placed between their neighbours.
import { describe, expect, it } from 'vitest';
import { plotTrace } from '../../src/site/plotTrace.js';

describe('plotTrace', () => {
  it('rounds x to 0.01 cm⁻¹ and y to 5 significant digits of the range', () => {
    const x = Float64Array.from([1000.123456, 1001.987654, 1003.5]);
    const y = Float64Array.from([0.123456789, 0.5, 1.000004]);
    const t = plotTrace(x, y)!;
    expect(t.x).toEqual([1000.12, 1001.99, 1003.5]);
    // range ≈ 0.877 → step 1e-5
    expect(t.y).toEqual([0.12346, 0.5, 1]);
  });

  it('places a gap between its neighbours so a plot that sorts by x cannot bridge it', () => {
    const x = Float64Array.from([1, 2, 3, 4, 5]);
    const y = Float64Array.from([1, 2, Number.NaN, 4, 5]);
    const t = plotTrace(x, y)!;
    expect(t.y).toEqual([1, 2, null, 4, 5]);
    expect(t.x).toEqual([1, 2, 3, 4, 5]);
    const gap = plotTrace(
      Float64Array.from([1, 2, 10, 11]),
      Float64Array.from([1, Number.NaN, Number.NaN, 2]),
    )!;
    expect(gap.x).toEqual([1, 6, 11]);
    expect(gap.y).toEqual([1, null, 2]);
  });

  it('is null for a trace with nothing covered', () => {
    expect(plotTrace(Float64Array.from([1, 2]), Float64Array.from([Number.NaN, Number.NaN]))).toBeNull();
  });
});

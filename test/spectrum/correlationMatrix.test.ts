// correlationMatrix against a general-purpose statistics library (simple-statistics).
import { sampleCorrelation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { correlationMatrix } from '../../src/spectrum/correlationMatrix.js';

describe('correlationMatrix', () => {
  it('gives each pair’s Pearson r over the points both cover, symmetric', () => {
    const N = Number.NaN;
    const a = Float64Array.of(1, 2, 3, 4, 5, 6);
    const b = Float64Array.of(2, 1, 4, 3, 6, N);
    const c = Float64Array.of(6, 5, 4, 3, 2, 1);
    const m = correlationMatrix([a, b, c]);
    // simple-statistics' sampleCorrelation on the shared points (the first five for pairs with b).
    expect(m[0]![1]).toBeCloseTo(sampleCorrelation([1, 2, 3, 4, 5], [2, 1, 4, 3, 6]), 12);
    expect(m[1]![2]).toBeCloseTo(sampleCorrelation([2, 1, 4, 3, 6], [6, 5, 4, 3, 2]), 12);
    expect(m[0]![2]).toBeCloseTo(-1, 12);
    expect(m[2]![0]).toBe(m[0]![2]);
    expect(m[1]![1]).toBeCloseTo(1, 12);
  });
});

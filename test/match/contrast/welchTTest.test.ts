// Welch's t-test against a published worked example and a general-purpose statistics library.
import { mean, sampleVariance } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { welchTTest } from '../../../src/match/contrast/welchTTest.js';

// The two samples of the worked example on the encyclopaedia page "Welch's t-test" (from memory): t = −2.46,
// df ≈ 25.0, two-sided p ≈ 0.021.
const A1 = [27.5, 21.0, 19.0, 23.6, 17.0, 17.9, 16.9, 20.1, 21.9, 22.6, 23.1, 19.6, 19.0, 21.7, 21.4];
const A2 = [27.1, 22.0, 20.8, 23.4, 23.4, 23.5, 25.8, 22.0, 24.8, 20.2, 21.9, 22.1, 22.9, 20.5, 24.4];

describe('welchTTest', () => {
  it('reproduces the worked example', () => {
    const r = welchTTest(A1, A2);
    expect(r.t).toBeCloseTo(-2.46, 2);
    expect(r.df).toBeCloseTo(24.99, 1);
    expect(r.p).toBeCloseTo(0.021, 3);
  });

  it('agrees with t and df built from simple-statistics means and variances (general-purpose library)', () => {
    const va = sampleVariance(A1) / A1.length;
    const vb = sampleVariance(A2) / A2.length;
    const t = (mean(A1) - mean(A2)) / Math.sqrt(va + vb);
    const df = (va + vb) ** 2 / (va ** 2 / (A1.length - 1) + vb ** 2 / (A2.length - 1));
    const r = welchTTest(A1, A2);
    expect(r.t).toBeCloseTo(t, 12);
    expect(r.df).toBeCloseTo(df, 12);
  });

  it('is symmetric and refuses groups of one', () => {
    expect(welchTTest(A2, A1).t).toBeCloseTo(-welchTTest(A1, A2).t, 12);
    expect(() => welchTTest([1], [1, 2])).toThrow(/at least two/);
  });
});

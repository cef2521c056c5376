// pointwiseContrast: the per-point Welch test, its interval and the untested points.
import jStatModule from 'jstat';
import { describe, expect, it } from 'vitest';
import { pointwiseContrast } from '../../../src/match/contrast/pointwiseContrast.js';

const { jStat } = jStatModule;

// The two samples of the worked example on the encyclopaedia page "Welch's t-test" (from memory): t = −2.46,
// df ≈ 25.0, p ≈ 0.021.
const A1 = [27.5, 21.0, 19.0, 23.6, 17.0, 17.9, 16.9, 20.1, 21.9, 22.6, 23.1, 19.6, 19.0, 21.7, 21.4];
const A2 = [27.1, 22.0, 20.8, 23.4, 23.4, 23.5, 25.8, 22.0, 24.8, 20.2, 21.9, 22.1, 22.9, 20.5, 24.4];

describe('pointwiseContrast', () => {
  it('gives the worked example at a point, with the 95 % Welch interval, and skips points with < 2 values', () => {
    const groupA = A1.map((v, i) => [v, i === 0 ? 1 : Number.NaN]);
    const groupB = A2.map((v) => [v, 2]);
    const r = pointwiseContrast(groupA, groupB);
    expect(r.t[0]).toBeCloseTo(-2.46, 2);
    expect(r.df[0]).toBeCloseTo(25.0, 0);
    expect(r.p[0]).toBeCloseTo(0.021, 3);
    // Student's t table (any statistics handbook): t(0.975, 25) = 2.060; the interval is d ± t · SE, SE = d / t.
    const se = r.difference[0]! / r.t[0]!;
    expect((r.upper[0]! - r.lower[0]!) / 2 / se).toBeCloseTo(2.06, 2);
    expect(jStat.studentt.inv(0.975, 25)).toBeCloseTo(2.06, 3);
    expect(r.lower[0]).toBeLessThan(r.difference[0]!);
    expect(Number.isNaN(r.t[1]!)).toBe(true);
    expect(Number.isNaN(r.q[1]!)).toBe(true);
    expect(r.tested).toBe(1);
    // With one test, the Benjamini–Hochberg q equals p.
    expect(r.q[0]).toBeCloseTo(r.p[0]!, 12);
  });
});

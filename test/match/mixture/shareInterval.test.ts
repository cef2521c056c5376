// The share's interval by the delta method, against a worked example and a seeded Monte Carlo of the same ratio.
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../src/demo/seededRandom.js';
import { shareInterval } from '../../../src/match/mixture/shareInterval.js';

describe('shareInterval', () => {
  it('propagates independent weight errors through s = a·w / Σ a·w (worked by hand)', () => {
    // w = (1, 3), a = (1, 1), SE = (0.1, 0.2), no covariance. s₁ = 1/4. By hand (first-order propagation of
    // uncertainty, GUM JCGM 100:2008 §5.1.2): ∂s₁/∂w₁ = w₂/S² = 3/16, ∂s₁/∂w₂ = −w₁/S² = −1/16;
    // Var = (3/16)²·0.01 + (1/16)²·0.04 = (0.09 + 0.04)/256 = 0.13/256.
    const [first, second] = shareInterval({ weights: [1, 3], areas: [1, 1], covariance: [0.01, 0, 0, 0.04] });
    expect(first!.share).toBeCloseTo(0.25, 12);
    expect(first!.standardError).toBeCloseTo(Math.sqrt(0.13 / 256), 12);
    // z₀.₉₇₅ = 1.959964 (standard normal table).
    expect(first!.interval[0]).toBeCloseTo(0.25 - 1.959964 * Math.sqrt(0.13 / 256), 6);
    // Two shares sum to 1, so their errors are equal.
    expect(second!.standardError).toBeCloseTo(first!.standardError, 12);
  });

  it('gives a single component share 1 with no error, and clips to [0, 1]', () => {
    const [only] = shareInterval({ weights: [2], areas: [3], covariance: [0.5] });
    expect(only).toEqual({ share: 1, standardError: 0, interval: [1, 1] });
    const [small] = shareInterval({ weights: [0.01, 1], areas: [1, 1], covariance: [0.01, 0, 0, 0] });
    expect(small!.interval[0]).toBe(0);
  });

  it('covers the share of simulated weights near 95 % when the errors are small (seeded Monte Carlo)', () => {
    // Correlated normal weights (ρ = −0.6, as collinear components give): the delta-method interval around the
    // true share should hold ~95 % of the simulated shares (first-order propagation holds for small errors).
    const random = seededRandom(21);
    const w = [0.2, 0.5, 0.3];
    const a = [1.2, 0.8, 1];
    const se = [0.01, 0.015, 0.012];
    const rho = -0.6;
    const cov = [
      se[0]! ** 2,
      rho * se[0]! * se[1]!,
      0,
      rho * se[0]! * se[1]!,
      se[1]! ** 2,
      0,
      0,
      0,
      se[2]! ** 2,
    ];
    const [truth] = shareInterval({ weights: w, areas: a, covariance: cov });
    let inside = 0;
    const runs = 4000;
    for (let r = 0; r < runs; r++) {
      const z0 = random.normal();
      const z1 = rho * z0 + Math.sqrt(1 - rho * rho) * random.normal();
      const v = [w[0]! + se[0]! * z0, w[1]! + se[1]! * z1, w[2]! + se[2]! * random.normal()];
      const s = (a[0]! * v[0]!) / (a[0]! * v[0]! + a[1]! * v[1]! + a[2]! * v[2]!);
      if (s >= truth!.interval[0] && s <= truth!.interval[1]) inside++;
    }
    expect(inside / runs).toBeGreaterThan(0.93);
    expect(inside / runs).toBeLessThan(0.97);
  });
});

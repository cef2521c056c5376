// The per-point Whittaker penalty from a stiffness in wavenumber units.
import { describe, expect, it } from 'vitest';
import { alsBaseline } from '../../src/spectrum/alsBaseline.js';
import { lambdaPerPoint } from '../../src/spectrum/lambdaPerPoint.js';

describe('lambdaPerPoint', () => {
  it('scales λ by h^(−2d): Eilers, Anal. Chem. 75:3631 (2003), the penalty as a roughness integral', () => {
    // d = 2 at h = 2 cm⁻¹: λₚ = λ / 2⁴; d = 1 at h = 0.5 cm⁻¹: λₚ = λ · 0.5⁻², by hand.
    expect(lambdaPerPoint(1.6e6, { differences: 2, spacing: 2 })).toBeCloseTo(1e5, 6);
    expect(lambdaPerPoint(100, { differences: 1, spacing: 0.5 })).toBeCloseTo(400, 9);
    expect(lambdaPerPoint(123)).toBe(123);
  });

  it('the same λ in cm⁴ gives the same ALS baseline at 1 and 4 cm⁻¹ spacing (Eilers & Boelens 2005)', () => {
    // A slow curved baseline under one band, sampled twice; the baselines agree where the points coincide.
    const sample = (h: number) => {
      const n = Math.round(2000 / h) + 1;
      const x = new Float64Array(n);
      const y = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        x[i] = 1000 + i * h;
        y[i] = 0.2 + 1e-7 * (x[i]! - 2000) ** 2 + Math.exp(-0.5 * ((x[i]! - 1700) / 15) ** 2);
      }
      return { wavenumber: x, absorbance: y };
    };
    const fine = alsBaseline(sample(1), { lambda: 1e8, spacing: 1 });
    const coarse = alsBaseline(sample(4), { lambda: 1e8, spacing: 4 });
    let worst = 0;
    for (let i = 0; i < coarse.length; i++) worst = Math.max(worst, Math.abs(coarse[i]! - fine[4 * i]!));
    expect(worst).toBeLessThan(0.01);
    // Per point (version 1) the same number gives a different baseline: the scaling is what makes them agree.
    const perPoint = alsBaseline(sample(4), { lambda: 1e8 });
    let apart = 0;
    for (let i = 0; i < coarse.length; i++) apart = Math.max(apart, Math.abs(perPoint[i]! - fine[4 * i]!));
    expect(apart).toBeGreaterThan(2 * worst);
  });
});

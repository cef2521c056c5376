import { describe, expect, it } from 'vitest';
import { lineShapeTerms } from '../../../src/match/mixture/lineShapeTerms.js';

describe('lineShapeTerms', () => {
  it('differentiates a quadratic exactly (central differences are exact to second order, common practice)', () => {
    // v = x² on a 2 cm⁻¹ grid: v′ = 2x, v″ = 2 (calculus); the end points lack a neighbour and get 0.
    const x = [0, 2, 4, 6, 8];
    const [first, second] = lineShapeTerms(
      x.map((v) => v * v),
      { step: 2, lorentzian: false },
    ) as [Float64Array, Float64Array];
    expect(Array.from(first)).toEqual([0, 4, 8, 12, 0]);
    expect(Array.from(second)).toEqual([0, 2, 2, 2, 0]);
  });

  it('gives v − δ·v′ ≈ v(ν − δ) for a small shift (first Taylor term, from memory)', () => {
    const axis = Float64Array.from({ length: 201 }, (_, i) => 1500 + i);
    const band = (centre: number) => Float64Array.from(axis, (x) => Math.exp(-0.5 * ((x - centre) / 8) ** 2));
    const v = band(1600);
    const [first] = lineShapeTerms(v, { step: 1 }) as [Float64Array];
    const shifted = band(1600.3);
    let worst = 0;
    for (let i = 0; i < v.length; i++)
      worst = Math.max(worst, Math.abs(v[i]! - 0.3 * first[i]! - shifted[i]!));
    // The neglected second-order term is δ²/2·v″ ≤ 0.045·(1/64) ≈ 7e-4 of the peak.
    expect(worst).toBeLessThan(1e-3);
  });

  it('leaves points next to a gap at 0 and does not change its input', () => {
    const v = [1, 2, Number.NaN, 4, 5, 6];
    const copy = [...v];
    const [first, second] = lineShapeTerms(v, { lorentzian: false }) as [Float64Array, Float64Array];
    expect(Array.from(first)).toEqual([0, 0, 0, 0, 1, 0]);
    expect(Array.from(second)).toEqual([0, 0, 0, 0, 0, 0]);
    expect(v).toEqual(copy);
  });
});

// The HAC (Newey–West) test of one further column, on literal inputs worked out by hand from its definition.
import { inverse, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../src/demo/seededRandom.js';
import { hacScoreTest } from '../../../src/match/mixture/hacScoreTest.js';

describe('hacScoreTest', () => {
  it("gives White's standard error at bandwidth 0 and Newey–West's Bartlett weights beyond", () => {
    // d = (1, 2, 1), b = (2, 4, 3), e = (0.1, −0.2, 0.3). By hand: ⟨d,d⟩ = 6, ⟨d,b⟩ = 13, β̂ = 13/6;
    // scores s = d·e = (0.1, −0.4, 0.3); Σ s² = 0.26 (White, Econometrica 48:817, 1980): SE = √0.26 / 6.
    const input = { direction: [1, 2, 1], query: [2, 4, 3], residual: [0.1, -0.2, 0.3] };
    const white = hacScoreTest(input);
    expect(white.estimate).toBeCloseTo(13 / 6, 12);
    expect(white.standardError).toBeCloseTo(Math.sqrt(0.26) / 6, 12);
    // L = 1 (Newey & West, Econometrica 55:703, 1987): Ŝ = Σ s² + 2·(1 − 1/2)·Σ s_t s_{t−1}
    // = 0.26 + (0.1·(−0.4) + (−0.4)·0.3) = 0.26 − 0.16 = 0.10.
    const nw = hacScoreTest(input, { bandwidth: 1 });
    expect(nw.standardError).toBeCloseTo(Math.sqrt(0.1) / 6, 12);
    // One-sided normal p-value: P(Z ≥ z) (common practice).
    // z = (13/6)/(√0.1/6) ≈ 41.1: far in the tail.
    expect(nw.z).toBeCloseTo(13 / Math.sqrt(0.1), 9);
    expect(nw.pValue).toBeLessThan(1e-6);
  });

  it('equals the sandwich (XᵀX)⁻¹ Xᵀ diag(e²) X (XᵀX)⁻¹ of a two-column OLS fit, computed with ml-matrix', () => {
    // The further column's weight in y = a·x₁ + c·x₂ + e with x₁ already in the fit: by Frisch–Waugh–Lovell, the
    // direction is x₂ net of x₁, and White's HC0 variance of ĉ is the (2,2) element of the sandwich (White 1980).
    const random = seededRandom(5);
    const n = 40;
    const x1 = Array.from({ length: n }, (_, t) => 1 + Math.sin(t / 5));
    const x2 = Array.from({ length: n }, (_, t) => Math.exp(-(((t - 20) / 6) ** 2)));
    const y = x1.map((v, t) => 2 * v + 0.7 * x2[t]! + 0.05 * (1 + t / n) * random.normal());
    const X = new Matrix(x1.map((v, t) => [v, x2[t]!]));
    const Y = Matrix.columnVector(y);
    const xtxInv = inverse(X.transpose().mmul(X));
    const beta = xtxInv.mmul(X.transpose()).mmul(Y);
    const e = Y.sub(X.mmul(beta)).to1DArray();
    const meat = X.transpose()
      .mmul(Matrix.diag(e.map((v) => v * v)))
      .mmul(X);
    const sandwich = xtxInv.mmul(meat).mmul(xtxInv);
    const k = x1.reduce((s, v, t) => s + v * x2[t]!, 0) / x1.reduce((s, v) => s + v * v, 0);
    const direction = x2.map((v, t) => v - k * x1[t]!);
    const test = hacScoreTest({ direction, query: y, residual: e });
    expect(test.estimate).toBeCloseTo(beta.get(1, 0), 10);
    expect(test.standardError).toBeCloseTo(Math.sqrt(sandwich.get(1, 1)), 10);
  });

  it('holds its level under correlated noise where the independent-points error would not (seeded)', () => {
    // AR(1) noise with ρ = 0.8 and a smooth column: the true variance of ⟨d, e⟩ is ≈ (1 + ρ)/(1 − ρ) = 9 × the
    // white-noise one, so the plain test rejects far too often; the HAC test at a bandwidth of several correlation
    // lengths stays near the nominal 5 % (Newey & West 1987; AR(1) variance, common practice).
    const n = 800;
    const direction = Float64Array.from({ length: n }, (_, t) => Math.exp(-(((t - 400) / 60) ** 2)));
    const random = seededRandom(17);
    let plain = 0;
    let robust = 0;
    const runs = 300;
    for (let r = 0; r < runs; r++) {
      const e = new Float64Array(n);
      let prev = 0;
      for (let t = 0; t < n; t++) {
        prev = 0.8 * prev + Math.sqrt(1 - 0.64) * random.normal();
        e[t] = prev;
      }
      if (hacScoreTest({ direction, query: e, residual: e }).pValue < 0.05) plain++;
      if (hacScoreTest({ direction, query: e, residual: e }, { bandwidth: 40 }).pValue < 0.05) robust++;
    }
    expect(plain / runs).toBeGreaterThan(0.2);
    expect(robust / runs).toBeLessThan(0.1);
  });
});

// The HAC covariance of several weights, against ml-matrix's OLS sandwich and against hacScoreTest's diagonal.
import { inverse, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../src/demo/seededRandom.js';
import { hacCovariance } from '../../../src/match/mixture/hacCovariance.js';
import { hacScoreTest } from '../../../src/match/mixture/hacScoreTest.js';

describe('hacCovariance', () => {
  it("equals White's sandwich (XᵀX)⁻¹ Xᵀ diag(e²) X (XᵀX)⁻¹ of a three-column OLS fit, computed with ml-matrix", () => {
    // By Frisch–Waugh–Lovell each weight is ⟨dⱼ, y⟩/⟨dⱼ, dⱼ⟩ with dⱼ = column j net of the others, i.e. the rows of
    // (XᵀX)⁻¹Xᵀ are dⱼ/⟨dⱼ, dⱼ⟩; so the HC0 sandwich (White, Econometrica 48:817, 1980) is the bandwidth-0 matrix.
    const random = seededRandom(11);
    const n = 50;
    const cols = [
      Array.from({ length: n }, (_, t) => 1 + Math.sin(t / 6)),
      Array.from({ length: n }, (_, t) => Math.exp(-(((t - 20) / 5) ** 2))),
      Array.from({ length: n }, (_, t) => Math.exp(-(((t - 28) / 7) ** 2))),
    ];
    const y = Array.from(
      { length: n },
      (_, t) =>
        2 * cols[0]![t]! + 0.7 * cols[1]![t]! + 0.4 * cols[2]![t]! + 0.05 * (1 + t / n) * random.normal(),
    );
    const X = new Matrix(Array.from({ length: n }, (_, t) => cols.map((c) => c[t]!)));
    const xtxInv = inverse(X.transpose().mmul(X));
    const beta = xtxInv.mmul(X.transpose()).mmul(Matrix.columnVector(y));
    const e = Matrix.columnVector(y).sub(X.mmul(beta)).to1DArray();
    const sandwich = xtxInv
      .mmul(
        X.transpose()
          .mmul(Matrix.diag(e.map((v) => v * v)))
          .mmul(X),
      )
      .mmul(xtxInv);
    const rows = xtxInv.mmul(X.transpose());
    // Row j of (XᵀX)⁻¹Xᵀ is dⱼ/⟨dⱼ, dⱼ⟩, so dⱼ = row / ⟨row, row⟩.
    const directions = [0, 1, 2].map((j) => {
      const row = rows.getRow(j);
      const norm = row.reduce((s, v) => s + v * v, 0);
      return row.map((v) => v / norm);
    });
    const cov = hacCovariance({ directions, residual: e });
    for (let j = 0; j < 3; j++) {
      for (let l = 0; l < 3; l++) {
        expect(cov[j * 3 + l]! / sandwich.get(j, l)).toBeCloseTo(1, 9);
      }
    }
  });

  it("has hacScoreTest's squared standard error on its diagonal at a Bartlett bandwidth", () => {
    // The same Newey–West estimator (Newey & West, Econometrica 55:703, 1987) for one weight and for several.
    const random = seededRandom(3);
    const n = 120;
    const d1 = Float64Array.from({ length: n }, (_, t) => Math.exp(-(((t - 40) / 9) ** 2)));
    const d2 = Float64Array.from({ length: n }, (_, t) => Math.exp(-(((t - 80) / 12) ** 2)) - 0.3);
    const e = Float64Array.from({ length: n }, () => random.normal());
    const cov = hacCovariance({ directions: [d1, d2], residual: e }, { bandwidth: 5 });
    const one = hacScoreTest({ direction: d1, query: e, residual: e }, { bandwidth: 5 });
    const two = hacScoreTest({ direction: d2, query: e, residual: e }, { bandwidth: 5 });
    expect(Math.sqrt(cov[0]!)).toBeCloseTo(one.standardError, 12);
    expect(Math.sqrt(cov[3]!)).toBeCloseTo(two.standardError, 12);
    expect(cov[1]).toBe(cov[2]);
  });
});

// NNLS against published worked examples and against a general-purpose NNLS library on random problems.
import { fcnnlsVector } from 'ml-fcnnls';
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../src/demo/seededRandom.js';
import { BandshelfError } from '../../src/error.js';
import { nnls } from '../../src/match/nnls.js';

describe('nnls', () => {
  it('solves the small worked example with one active constraint pattern', () => {
    // Lawson & Hanson (1974) active-set method; the example and its answer are a worked example in a
    // general-purpose scientific library's documentation (recomputed by hand: column 1 fits mean(2, 1) = 1.5).
    const columns = [new Float64Array([1, 1, 0]), new Float64Array([0, 0, 1])];
    const result = nnls(columns, [2, 1, 1]);
    expect(result.x[0]).toBeCloseTo(1.5, 10);
    expect(result.x[1]).toBeCloseTo(1, 10);
    // The published residual norm 0.70710678 is √(1/2).
    expect(result.residualNorm).toBeCloseTo(Math.SQRT1_2, 8);
    const negative = nnls(columns, [-1, -1, -1]);
    expect(Array.from(negative.x)).toEqual([0, 0]);
    expect(negative.residualNorm).toBeCloseTo(Math.sqrt(3), 12);
  });

  it('solves the four-by-two worked example where the unconstrained answer is infeasible', () => {
    // Worked example from a numerical package's documentation (values in references.md, recomputed):
    // unconstrained least squares gives [-2.5627, 3.1108]; NNLS gives [0, 0.6929344], residual 0.9118421.
    const c = [
      [0.0372, 0.2869],
      // biome-ignore lint/suspicious/noApproximativeNumericConstant: the published matrix entry, not 1/√2.
      [0.6861, 0.7071],
      [0.6233, 0.6245],
      [0.6344, 0.617],
    ];
    const colMajor = new Float64Array([...c.map((r) => r[0]!), ...c.map((r) => r[1]!)]);
    const result = nnls(colMajor, [0.8587, 0.1781, 0.0747, 0.8405]);
    expect(result.x[0]).toBe(0);
    expect(result.x[1]).toBeCloseTo(0.6929344, 6);
    expect(result.residualNorm).toBeCloseTo(0.9118421, 6);
    expect(result.converged).toBe(true);
  });

  it('agrees with ml-fcnnls on seeded random well-conditioned problems', () => {
    // ml-fcnnls (Van Benthem & Keenan 2004, a general-purpose reference implementation) is the outside check.
    const random = seededRandom(20240611);
    let someActive = 0;
    for (let trial = 0; trial < 40; trial++) {
      const rows = 12 + Math.floor(random.uniform() * 30);
      const n = 2 + Math.floor(random.uniform() * 7);
      const a: number[][] = Array.from({ length: rows }, () =>
        Array.from({ length: n }, () => random.uniform() * 2 - 0.5),
      );
      const b = Array.from({ length: rows }, () => random.normal());
      const columns = Array.from({ length: n }, (_, j) => Float64Array.from(a, (row) => row[j]!));
      const ours = nnls(columns, b);
      const theirs = fcnnlsVector(a, b, { gradientTolerance: 1e-12 }).K.to1DArray();
      for (let j = 0; j < n; j++) expect(ours.x[j]!).toBeCloseTo(theirs[j]!, 6);
      if (ours.x.some((v) => v === 0)) someActive++;
      // Karush–Kuhn–Tucker conditions of the constrained minimum, checked independently of both solvers.
      for (let j = 0; j < n; j++) {
        let g = 0;
        for (let i = 0; i < rows; i++) {
          let r = b[i]!;
          for (let k = 0; k < n; k++) r -= a[i]![k]! * ours.x[k]!;
          g += a[i]![j]! * r;
        }
        expect(ours.x[j]!).toBeGreaterThanOrEqual(0);
        if (ours.x[j]! > 0) expect(Math.abs(g)).toBeLessThan(1e-9);
        else expect(g).toBeLessThan(1e-9);
      }
    }
    // The random problems must exercise the constraints, or the comparison proves little.
    expect(someActive).toBeGreaterThan(10);
  });

  it('keeps a duplicated column out instead of cycling', () => {
    const col = new Float64Array([1, 2, 3, 4]);
    const result = nnls([col, col, new Float64Array([1, 0, 0, 1])], [2, 4, 6, 8]);
    expect(result.x[0]! + result.x[1]!).toBeCloseTo(2, 10);
    expect(result.x[2]).toBeCloseTo(0, 10);
    expect(result.residualNorm).toBeLessThan(1e-9);
  });

  it('rejects mismatched or non-finite input with a typed error', () => {
    expect(() => nnls([new Float64Array([1, 2])], [1, 2, 3])).toThrow(BandshelfError);
    expect(() => nnls(new Float64Array([1, 2, 3]), [1, 2])).toThrow(BandshelfError);
    expect(() => nnls([new Float64Array([1, Number.NaN])], [1, 2])).toThrow(/not finite/);
  });
});

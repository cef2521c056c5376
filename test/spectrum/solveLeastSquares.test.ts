// Tests of the small dense least-squares solver against a statistics library and hand-checked fits.
import { linearRegression } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { solveLeastSquares } from '../../src/spectrum/solveLeastSquares.js';
import { mulberry32 } from '../mulberry32.js';

function lineProblem(x: number[], y: number[]) {
  const m = x.length;
  const matrix = new Float64Array(2 * m);
  matrix.fill(1, 0, m);
  matrix.set(x, m);
  return { matrix, rows: m, cols: 2, b: Float64Array.from(y) };
}

describe('solveLeastSquares', () => {
  it('fits a straight line exactly as simple-statistics’ linearRegression does', () => {
    const rnd = mulberry32(1234);
    for (let trial = 0; trial < 20; trial++) {
      const x = Array.from({ length: 30 }, () => 1000 + 800 * rnd());
      const y = x.map((v) => 0.3 - 2e-4 * v + 0.05 * (rnd() - 0.5));
      const c = solveLeastSquares(lineProblem(x, y))!;
      // Outside check: a general-purpose statistics library's ordinary least-squares line.
      const reference = linearRegression(x.map((v, i) => [v, y[i]!]));
      expect(c[0]).toBeCloseTo(reference.b, 9);
      expect(c[1]).toBeCloseTo(reference.m, 12);
    }
  });

  it('recovers an exact quadratic on a hand-checkable case', () => {
    // y = 1 − 2x + 3x² at x = 0…4: 1, 2, 9, 22, 41.
    const x = [0, 1, 2, 3, 4];
    const matrix = Float64Array.from([...x.map(() => 1), ...x, ...x.map((v) => v * v)]);
    const c = solveLeastSquares({ matrix, rows: 5, cols: 3, b: Float64Array.from([1, 2, 9, 22, 41]) })!;
    expect(Array.from(c).map((v) => Number(v.toFixed(10)))).toEqual([1, -2, 3]);
  });

  it('gives the mean for a constant model (the least-squares estimate of a location)', () => {
    const c = solveLeastSquares({
      matrix: new Float64Array(4).fill(1),
      rows: 4,
      cols: 1,
      b: Float64Array.from([1, 2, 3, 10]),
    })!;
    expect(c[0]).toBeCloseTo(4, 12);
  });

  it('returns undefined for a rank-deficient or under-determined problem', () => {
    // Second column = 2 × first.
    const dependent = Float64Array.from([1, 2, 3, 2, 4, 6]);
    expect(
      solveLeastSquares({ matrix: dependent, rows: 3, cols: 2, b: Float64Array.from([1, 2, 3]) }),
    ).toBeUndefined();
    const zeroColumn = Float64Array.from([1, 2, 3, 0, 0, 0]);
    expect(
      solveLeastSquares({ matrix: zeroColumn, rows: 3, cols: 2, b: Float64Array.from([1, 2, 3]) }),
    ).toBeUndefined();
    expect(
      solveLeastSquares({ matrix: new Float64Array(2), rows: 1, cols: 2, b: new Float64Array(1) }),
    ).toBeUndefined();
  });

  it('does not modify its inputs', () => {
    const p = lineProblem([1, 2, 3], [2, 4, 7]);
    const matrix = p.matrix.slice();
    const b = p.b.slice();
    solveLeastSquares(p);
    expect(p.matrix).toEqual(matrix);
    expect(p.b).toEqual(b);
  });
});

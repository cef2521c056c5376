// Tests of the weighted Whittaker smoother against an independent dense solve of the same system.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { whittakerSmooth } from '../../src/spectrum/whittakerSmooth.js';
import { mulberry32 } from '../mulberry32.js';

// An independent dense solve of (W + λ DᵀD) z = W y: D built row by row, Gaussian elimination with pivoting.
function denseWhittaker(y: number[], w: number[], lambda: number, order: 1 | 2): number[] {
  const n = y.length;
  const stencil = order === 1 ? [-1, 1] : [1, -2, 1];
  const a = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? w[i]! : 0)));
  for (let r = 0; r + stencil.length <= n; r++) {
    for (let p = 0; p < stencil.length; p++) {
      for (let q = 0; q < stencil.length; q++) a[r + p]![r + q]! += lambda * stencil[p]! * stencil[q]!;
    }
  }
  const b = y.map((v, i) => v * w[i]!);
  for (let c = 0; c < n; c++) {
    let pivot = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r]![c]!) > Math.abs(a[pivot]![c]!)) pivot = r;
    [a[c], a[pivot]] = [a[pivot]!, a[c]!];
    [b[c], b[pivot]] = [b[pivot]!, b[c]!];
    for (let r = c + 1; r < n; r++) {
      const f = a[r]![c]! / a[c]![c]!;
      for (let k = c; k < n; k++) a[r]![k]! -= f * a[c]![k]!;
      b[r]! -= f * b[c]!;
    }
  }
  const z = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = b[r]!;
    for (let k = r + 1; k < n; k++) s -= a[r]![k]! * z[k]!;
    z[r] = s / a[r]![r]!;
  }
  return z;
}

describe('whittakerSmooth', () => {
  it('agrees with a dense solve of the same system', () => {
    const rnd = mulberry32(11);
    for (const n of [3, 4, 5, 12, 40]) {
      for (const order of [1, 2] as const) {
        for (const lambda of [0.3, 50, 1e5]) {
          const y = Array.from({ length: n }, () => rnd() * 2 - 1);
          const w = Array.from({ length: n }, () => (rnd() < 0.3 ? 0 : rnd()));
          w[0] = 1;
          w[n - 1] = 0.5;
          const z = whittakerSmooth(
            { y: Float64Array.from(y), weights: Float64Array.from(w) },
            { lambda, differences: order },
          );
          const expected = denseWhittaker(y, w, lambda, order);
          for (let i = 0; i < n; i++) expect(z[i]).toBeCloseTo(expected[i]!, 9);
        }
      }
    }
  });

  it('leaves a straight line unchanged under the second-difference penalty (D·line = 0)', () => {
    const n = 200;
    const y = Float64Array.from({ length: n }, (_, i) => 0.3 - 0.002 * i);
    const weights = Float64Array.from({ length: n }, (_, i) => (i % 3 === 0 ? 1 : 0.01));
    for (const lambda of [1, 1e3, 1e6]) {
      const z = whittakerSmooth({ y, weights }, { lambda });
      for (let i = 0; i < n; i++) expect(z[i]).toBeCloseTo(y[i]!, 8);
    }
  });

  it('does not modify its inputs', () => {
    const y = Float64Array.from([1, 3, 2, 5, 4]);
    const weights = Float64Array.from([1, 1, 0, 1, 1]);
    whittakerSmooth({ y, weights }, { lambda: 10 });
    expect(Array.from(y)).toEqual([1, 3, 2, 5, 4]);
    expect(Array.from(weights)).toEqual([1, 1, 0, 1, 1]);
  });

  it('refuses bad weights, a bad λ and a singular system', () => {
    const y = Float64Array.from([1, 2, 3, 4]);
    const bad =
      (weights: number[], lambda = 1) =>
      () =>
        whittakerSmooth({ y, weights: Float64Array.from(weights) }, { lambda });
    expect(bad([1, 1, 1])).toThrow(BandshelfError);
    expect(bad([1, -1, 1, 1])).toThrow(/≥ 0/);
    expect(bad([1, Number.NaN, 1, 1])).toThrow(BandshelfError);
    expect(bad([1, 1, 1, 1], 0)).toThrow(/lambda/);
    // One weighted point cannot pin down a line: the second-difference system is singular.
    expect(bad([0, 1, 0, 0])).toThrow(/singular/);
  });
});

// Min–max decimation for display: fewer points, every band maximum and minimum kept, gaps kept open.
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../src/demo/seededRandom.js';
import { decimateTrace } from '../../src/site/decimateTrace.js';

function trace(n: number, seed = 1) {
  const rng = seededRandom(seed);
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    x[i] = 600 + i * 0.5;
    y[i] = 0.01 * rng.normal() + Math.exp(-0.5 * ((x[i]! - 1652) / 3) ** 2);
  }
  return { x, y };
}

describe('decimateTrace', () => {
  it('returns small traces unchanged', () => {
    const x = Float64Array.from([1, 2, 3]);
    const y = Float64Array.from([0.5, 0.25, 0.125]);
    const out = decimateTrace(x, y, { maxPoints: 10 });
    expect(Array.from(out.x)).toEqual([1, 2, 3]);
    expect(Array.from(out.y)).toEqual([0.5, 0.25, 0.125]);
  });

  it('keeps at most maxPoints, both ends, and the exact maximum and minimum of a narrow band', () => {
    const { x, y } = trace(6801);
    const copy = Float64Array.from(y);
    const out = decimateTrace(x, y, { maxPoints: 600 });
    expect(out.x.length).toBeLessThanOrEqual(600);
    expect(out.x.length).toBeGreaterThan(500);
    expect(out.x[0]).toBe(x[0]);
    expect(out.x.at(-1)).toBe(x.at(-1));
    const max = Math.max(...y);
    const min = Math.min(...y);
    expect(Math.max(...out.y)).toBe(max);
    expect(Math.min(...out.y)).toBe(min);
    expect(out.x[Array.from(out.y).indexOf(max)]).toBe(x[Array.from(y).indexOf(max)]);
    for (let i = 1; i < out.x.length; i++) expect(out.x[i]!).toBeGreaterThan(out.x[i - 1]!);
    expect(Array.from(y)).toEqual(Array.from(copy));
  });

  it('hand-checkable: buckets of four keep their lowest and highest point in order', () => {
    // 2 ends + inner 8 points in 2 buckets of 4 → 6 points.
    const x = Float64Array.from([0, 1, 2, 3, 4, 5, 6, 7, 8, 9]);
    const y = Float64Array.from([0, 5, 1, 9, 2, 3, 8, 4, 7, 6]);
    const out = decimateTrace(x, y, { maxPoints: 6 });
    expect(Array.from(out.x)).toEqual([0, 2, 3, 5, 6, 9]);
    expect(Array.from(out.y)).toEqual([0, 1, 9, 3, 8, 6]);
  });

  it('keeps a not-covered gap as one NaN break and never bridges it', () => {
    const { x, y } = trace(4001);
    for (let i = 1500; i < 1800; i++) y[i] = Number.NaN;
    const out = decimateTrace(x, y, { maxPoints: 400 });
    const breaks = Array.from(out.y).filter((v) => Number.isNaN(v));
    expect(breaks).toHaveLength(1);
    const at = Array.from(out.y).findIndex((v) => Number.isNaN(v));
    expect(out.x[at - 1]).toBe(x[1499]);
    expect(out.x[at + 1]).toBe(x[1800]);
  });
});

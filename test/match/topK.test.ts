// topK against a full sort: same indices in the same order, ties to the lower index, non-finite values skipped.
import { describe, expect, it } from 'vitest';
import { topK } from '../../src/match/topK.js';
import { seeded } from './searchFixtures.js';

function bySort(values: ArrayLike<number>, k: number, order: 'desc' | 'asc'): number[] {
  const sign = order === 'desc' ? -1 : 1;
  return Array.from(values, (v, i) => [v, i] as const)
    .filter(([v]) => Number.isFinite(v))
    .sort((a, b) => sign * (a[0] - b[0]) || a[1] - b[1])
    .slice(0, k)
    .map(([, i]) => i);
}

describe('topK', () => {
  it('picks the largest values of a small hand-checked array, best first', () => {
    expect(Array.from(topK([0.2, 0.9, Number.NaN, 0.5, 0.9, -1], { k: 3 }))).toEqual([1, 4, 3]);
    expect(Array.from(topK([0.2, 0.9, Number.NaN, 0.5, 0.9, -1], { k: 2, order: 'asc' }))).toEqual([5, 0]);
  });

  it('equals a full sort on seeded random data with ties, for many k', () => {
    const random = seeded(42);
    for (let trial = 0; trial < 30; trial++) {
      const n = 1 + Math.floor(random() * 3000);
      const values = Float32Array.from({ length: n }, () => {
        const u = random();
        if (u < 0.02) return Number.NaN;
        if (u < 0.03) return Number.POSITIVE_INFINITY;
        return Math.round(random() * 200) / 100; // coarse values: many ties
      });
      for (const k of [1, 5, 11, 300]) {
        expect(Array.from(topK(values, { k }))).toEqual(bySort(values, k, 'desc'));
        expect(Array.from(topK(values, { k, order: 'asc' }))).toEqual(bySort(values, k, 'asc'));
      }
    }
  });

  it('returns fewer when fewer values are finite, and nothing for k = 0', () => {
    expect(Array.from(topK([Number.NaN, 3, Number.NaN], { k: 5 }))).toEqual([1]);
    expect(topK([1, 2, 3], { k: 0 })).toHaveLength(0);
  });
});

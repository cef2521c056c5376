// differenceRegions: runs of passing points, split by sign and by untested points.
import { describe, expect, it } from 'vitest';
import { differenceRegions } from '../../../src/match/contrast/differenceRegions.js';

describe('differenceRegions', () => {
  it('splits at a failing point, a sign change and an untested point', () => {
    const N = Number.NaN;
    const difference = [1, 2, 3, 1, -1, -2, 5, N, 4, 4];
    const q = [0.01, 0.02, 0.001, 0.2, 0.03, 0.04, 0.01, N, 0.05, 0.06];
    expect(differenceRegions({ difference, q })).toEqual([
      { from: 0, to: 2, peak: 2, sign: 'higher', smallestQ: 0.001 },
      { from: 4, to: 5, peak: 5, sign: 'lower', smallestQ: 0.03 },
      { from: 6, to: 6, peak: 6, sign: 'higher', smallestQ: 0.01 },
      { from: 8, to: 8, peak: 8, sign: 'higher', smallestQ: 0.05 },
    ]);
    // At q = 0.01 points 0, 2 and 6 pass; point 1 (q 0.02) no longer joins 0 and 2.
    expect(differenceRegions({ difference, q }, { q: 0.01 }).map((r) => r.from)).toEqual([0, 2, 6]);
  });
});

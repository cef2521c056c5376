// Hedges' g with its small-sample correction, worked by hand from the published formula.
import { describe, expect, it } from 'vitest';
import { hedgesG } from '../../../src/match/contrast/hedgesG.js';

describe('hedgesG', () => {
  it('applies J = 1 − 3/(4N − 9) (Hedges, J. Educ. Stat. 6:107, 1981)', () => {
    // Means 3 and 5, pooled SD √(20/8) = 1.58114, d = −1.26491, J = 1 − 3/31 = 0.903226, g = −1.14250 (by hand).
    expect(hedgesG([1, 2, 3, 4, 5], [3, 4, 5, 6, 7])).toBeCloseTo(-1.1425, 4);
  });

  it('is NaN when both groups are constant', () => {
    expect(hedgesG([2, 2], [2, 2])).toBeNaN();
  });
});

// robustDistances: distances from the point-wise median and the modified z-score rule.
import { describe, expect, it } from 'vitest';
import { robustDistances } from '../../../src/match/contrast/robustDistances.js';

describe('robustDistances', () => {
  it('measures RMS distance from the point-wise median over points every spectrum covers', () => {
    // Median of {0, 1, 2, 10} per point is 1.5 (hand computed); the NaN column is skipped.
    const v = [
      [0, 0, Number.NaN],
      [1, 1, 5],
      [2, 2, 5],
      [10, 10, 5],
    ];
    const r = robustDistances(v);
    expect(r.distance).toEqual([1.5, 0.5, 0.5, 8.5]);
    // Median distance 1, MAD = median{0.5, 0.5, 0.5, 7.5} = 0.5; z = 0.6745 (8.5 − 1) / 0.5 = 10.1175 > 3.5
    // (modified z-score, Iglewicz & Hoaglin 1993).
    expect(r.robustZ[3]).toBeCloseTo(10.1175, 10);
    expect(r.outlier).toEqual([false, false, false, true]);
  });

  it('flags nothing when the MAD is 0', () => {
    const r = robustDistances([[1], [1], [1]]);
    expect(r.robustZ).toEqual([null, null, null]);
    expect(r.outlier).toEqual([false, false, false]);
  });
});

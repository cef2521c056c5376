import { describe, expect, it } from 'vitest';
import { detectionLimit } from '../../../src/match/mixture/detectionLimit.js';

describe('detectionLimit', () => {
  it('is 3.3 σ/S as ICH Q2(R1) §6.3 states it (worked by hand)', () => {
    // ICH Q2(R1) "Validation of analytical procedures", DL = 3.3 σ / S. Hand-worked: a response standard deviation
    // σ = 0.012 and a slope S = 0.80 give DL = 3.3 × 0.012 / 0.80 = 0.0495.
    const limit = detectionLimit({ sigma: 0.012, sensitivity: 0.8, area: 2, signal: 10 });
    expect(limit.weight).toBeCloseTo(0.0495, 12);
    // Its share of the signal were it present at that weight: 0.0495·2 / (10 + 0.0495·2) (arithmetic).
    expect(limit.share).toBeCloseTo(0.099 / 10.099, 12);
  });

  it('is unbounded for a component the others mimic entirely (S = 0)', () => {
    const limit = detectionLimit({ sigma: 0.01, sensitivity: 0, area: 1, signal: 1 });
    expect(limit.weight).toBe(Number.POSITIVE_INFINITY);
    expect(limit.share).toBe(1);
  });
});

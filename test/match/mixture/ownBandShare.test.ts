// Own-band share: the part of the residual at a candidate's bands, beyond the noise, that the candidate explains.
import { describe, expect, it } from 'vitest';
import { ownBandShare } from '../../../src/match/mixture/ownBandShare.js';

describe('ownBandShare', () => {
  it('counts only the points at the candidate’s own bands and subtracts the noise there', () => {
    // Column peaks at points 1–2 (≥ 20 % of its peak); point 3 (0.1 < 0.2) and 0 are not its bands.
    // By hand: before = 0.5² + 0.4² = 0.41, left = 0.1² + 0.1² = 0.02, excess = 0.41 − 2·0.1² = 0.39,
    // share = (0.41 − 0.02)/0.39 = 1.
    const column = [0, 1, 0.5, 0.1];
    expect(
      ownBandShare({ column, without: [9, 0.5, 0.4, 9], with: [9, 0.1, 0.1, 9], noiseSigma: 0.1 }),
    ).toBeCloseTo(1, 12);
    // A candidate that trims a misfit: before 0.41, left 0.33 → (0.08)/(0.39) ≈ 0.205.
    expect(
      ownBandShare({ column, without: [0, 0.5, 0.4, 0], with: [0, 0.45, 0.35, 0], noiseSigma: 0.1 }),
    ).toBeCloseTo((0.41 - (0.45 ** 2 + 0.35 ** 2)) / 0.39, 12);
    // Nothing beyond the noise at its bands: the bands show nothing, share 0.
    expect(
      ownBandShare({ column, without: [0, 0.1, 0.1, 0], with: [0, 0.05, 0.05, 0], noiseSigma: 0.2 }),
    ).toBe(0);
  });
});

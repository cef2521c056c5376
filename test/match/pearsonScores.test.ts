// The direct scoring functions against simple-statistics and the textbook formulas, on seeded random data.
import { sampleCorrelation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { cosineScores } from '../../src/match/cosineScores.js';
import { euclideanScores } from '../../src/match/euclideanScores.js';
import { maskedRowScore } from '../../src/match/maskedRowScore.js';
import { pearsonScores } from '../../src/match/pearsonScores.js';
import { seeded, shared } from './searchFixtures.js';

const rows = 40;
const cols = 257;
const random = seeded(2024);
const matrix = Float32Array.from({ length: rows * cols }, () =>
  random() < 0.05 ? Number.NaN : random() * 3 + 1,
);
const query = Float64Array.from({ length: cols }, () => (random() < 0.05 ? Number.NaN : random() * 2 - 0.5));
const row = (r: number) => matrix.subarray(r * cols, (r + 1) * cols);

describe('pearsonScores / cosineScores / euclideanScores', () => {
  it('pearson equals simple-statistics sampleCorrelation to 1e-6 over the shared points (general-purpose reference library: simple-statistics)', () => {
    const scores = pearsonScores(matrix, rows, cols, query);
    for (let r = 0; r < rows; r++) {
      const [x, y] = shared(row(r), query);
      expect(Math.abs(scores[r]! - sampleCorrelation(x, y))).toBeLessThan(1e-6);
    }
  });

  it('cosine and euclidean equal the direct formulas (common practice)', () => {
    const cos = cosineScores(matrix, rows, cols, query);
    const dist = euclideanScores(matrix, rows, cols, query);
    for (let r = 0; r < rows; r++) {
      const [x, y] = shared(row(r), query);
      const nx = Math.hypot(...x);
      const ny = Math.hypot(...y);
      const dot = x.reduce((acc, v, i) => acc + v * y[i]!, 0);
      expect(Math.abs(cos[r]! - dot / (nx * ny))).toBeLessThan(1e-6);
      const d = Math.sqrt(x.reduce((acc, v, i) => acc + (v / nx - y[i]! / ny) ** 2, 0));
      expect(Math.abs(dist[r]! - d)).toBeLessThan(1e-6);
    }
  });

  it('a mask restricts the points', () => {
    const mask = Uint8Array.from({ length: cols }, (_, i) => (i >= 50 && i < 150 ? 1 : 0));
    const scores = pearsonScores(matrix, rows, cols, query, { mask });
    const [x, y] = shared(row(7), query, (i) => mask[i] === 1);
    expect(Math.abs(scores[7]! - sampleCorrelation(x, y))).toBeLessThan(1e-6);
  });

  it('hand-checked: a perfect line correlates 1, its mirror −1, a flat row is NaN', () => {
    const m = Float32Array.from([1, 2, 3, 4, 4, 3, 2, 1, 5, 5, 5, 5]);
    const scores = pearsonScores(m, 3, 4, [2, 4, 6, 8]);
    expect(scores[0]).toBeCloseTo(1, 12);
    expect(scores[1]).toBeCloseTo(-1, 12);
    expect(scores[2]).toBeNaN();
  });

  it('maskedRowScore reports the overlap over neighbouring shared points', () => {
    const a = [1, 2, Number.NaN, 4, 5, 6, 7];
    const b = [1, 3, 2, 5, 4, 6, Number.NaN];
    const score = maskedRowScore(a, b, new Uint8Array(7).fill(1), { step: 2 });
    // shared points 0, 1, 3, 4, 5: neighbouring pairs (0,1), (3,4), (4,5) → 3 × 2 cm⁻¹
    expect(score.points).toBe(5);
    expect(score.overlap).toBe(6);
    expect(score.score).toBeCloseTo(sampleCorrelation([1, 2, 4, 5, 6], [1, 3, 5, 4, 6]), 12);
  });

  it('refuses shapes that do not fit', () => {
    expect(() => pearsonScores(matrix, rows, cols, query.subarray(1))).toThrow(/expected/);
  });
});

// The best-wrong-hit null and its empirical p-value on a literal four-row library, worked by hand.
import { sampleCorrelation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { empiricalPValue } from '../../src/match/empiricalPValue.js';
import { scoringMask } from '../../src/match/scoringMask.js';
import { searchSpectra } from '../../src/match/searchSpectra.js';
import { wrongHitNull } from '../../src/match/wrongHitNull.js';
import { syntheticSet } from './searchFixtures.js';

// Rows 0 and 3 are the same substance (same name), so neither may be the other's wrong hit.
const entries = [
  { id: 'a', name: 'Alpha' },
  { id: 'b', name: 'Beta' },
  { id: 'c', name: 'Gamma' },
  { id: 'a-film', name: 'alpha' },
];
const processed = Float64Array.from([1, 2, 3, 1, 2, 4, 3, 2, 1, 1, 2, 3]);
// By hand: r([1,2,3],[1,2,4]) = 3 / √(2 · 42/9) = 0.981981; r([1,2,3],[3,2,1]) = −1; r([1,2,4],[3,2,1]) = −0.981981.
const R = 3 / Math.sqrt((2 * 42) / 9);

describe('wrongHitNull', () => {
  it('gives each entry its best r against other substances, ascending', () => {
    // simple-statistics' sampleCorrelation agrees with the hand value.
    expect(sampleCorrelation([1, 2, 3], [1, 2, 4])).toBeCloseTo(R, 12);
    const n = wrongHitNull({ cols: 3, processed, entries }, { minPoints: 3 });
    // Row 0 → row 1 (row 3 is Alpha too); row 1 → 0 or 3; row 2 → row 1 (−R beats −1); row 3 → row 1.
    expect(Array.from(n.scores)).toEqual([-R, R, R, R].map((v) => expect.closeTo(v, 12)));
    expect([n.entries, n.sampled]).toEqual([4, 4]);
  });

  it('samples evenly spaced rows when the library is larger than maxRows', () => {
    const n = wrongHitNull({ cols: 3, processed, entries }, { minPoints: 3, maxRows: 2 });
    // Rows 0 and 2 by the even spacing 4 / 2: best wrong hits R and −R.
    expect(Array.from(n.scores)).toEqual([expect.closeTo(-R, 12), expect.closeTo(R, 12)]);
  });
});

describe('empiricalPValue', () => {
  const nullScores = Float64Array.from([-R, R, R, R]);
  it('is (1 + count at least as good) / (1 + n)', () => {
    // By hand with n = 4: above every null score → 1/5; tied with the three R's → 4/5; below all → 5/5.
    expect(empiricalPValue({ score: 0.99, nullScores })).toBeCloseTo(0.2, 12);
    expect(empiricalPValue({ score: R, nullScores })).toBeCloseTo(0.8, 12);
    expect(empiricalPValue({ score: 0.5, nullScores })).toBeCloseTo(0.8, 12);
    expect(empiricalPValue({ score: -1, nullScores })).toBeCloseTo(1, 12);
    // Distances: lower is better; 0.1 is beaten or tied by none of [0.2, 0.3] → 1/3.
    expect(empiricalPValue({ score: 0.1, nullScores: [0.2, 0.3] }, { higherIsBetter: false })).toBeCloseTo(
      1 / 3,
    );
    expect(empiricalPValue({ score: 0.5, nullScores: [] })).toBeNull();
  });
});

describe('wrongHitNull on a seeded library of fully and partly covered rows', () => {
  it("gives each row's best wrong r as simple-statistics' sampleCorrelation over the shared points", () => {
    const cols = 40;
    const rows = 12;
    let state = 7;
    const uniform = () => {
      state = (state * 1103515245 + 12345) % 2147483648; // LCG of the C standard's example rand(), seeded
      return state / 2147483648;
    };
    const processed = new Float64Array(rows * cols);
    for (let r = 0; r < rows; r++) {
      for (let i = 0; i < cols; i++) processed[r * cols + i] = r % 4 === 3 && i < 10 ? Number.NaN : uniform();
    }
    const list = Array.from({ length: rows }, (_, r) => ({ id: `e${r}`, name: `E${r}` }));
    const result = wrongHitNull({ cols, processed, entries: list });
    const expected = Array.from({ length: rows }, (_, a) => {
      let best = Number.NEGATIVE_INFINITY;
      for (let b = 0; b < rows; b++) {
        if (b === a) continue;
        const x: number[] = [];
        const y: number[] = [];
        for (let i = 0; i < cols; i++) {
          const u = processed[a * cols + i]!;
          const v = processed[b * cols + i]!;
          if (!Number.isNaN(u) && !Number.isNaN(v)) {
            x.push(u);
            y.push(v);
          }
        }
        best = Math.max(best, sampleCorrelation(x, y));
      }
      return best;
    }).sort((p, q) => p - q);
    expect(result.scores.length).toBe(rows);
    result.scores.forEach((s, k) => {
      expect(s).toBeCloseTo(expected[k]!, 12);
    });
  });
});

describe('wrongHitNull through the match search', () => {
  // Seeded families of similar band spectra (rows of a family are each other's best hits), a CO₂-like exclusion
  // window, no row covering the grid's first 3 points, every fourth row missing 9 more, and rows 0 and 1 one
  // substance (same name, other ids).
  const base = syntheticSet({ rows: 40, family: 4, exclude: [{ min: 1400, max: 1360 }] });
  const cols = base.processed.length / base.entries.length;
  const processed = Float32Array.from(base.processed);
  for (let r = 0; r < 40; r++) processed.fill(Number.NaN, r * cols, r * cols + (r % 4 === 3 ? 12 : 3));
  const entries = base.entries.map((e, r) => (r === 1 ? { ...e, name: base.entries[0]!.name } : e));
  const set = { ...base, processed, entries };
  const excluded = scoringMask(new Float64Array(cols), set.grid, { exclude: set.recipe.exclude });
  let searched = 0;
  const search = (queries: readonly Float32Array[], k: number) => {
    searched += queries.length;
    return searchSpectra(set, queries, { k });
  };

  it("gives each sampled row's best wrong r as simple-statistics' sampleCorrelation outside the exclusions", () => {
    const result = wrongHitNull(
      { cols, processed, entries, grid: set.grid, exclude: set.recipe.exclude },
      { search },
    );
    const expected: number[] = [];
    for (let a = 0; a < 40; a++) {
      if (a % 4 === 3) continue; // of the less common coverage: not sampled on this path
      let best = Number.NEGATIVE_INFINITY;
      for (let b = 0; b < 40; b++) {
        if (b === a || (a <= 1 && b <= 1)) continue;
        const x: number[] = [];
        const y: number[] = [];
        for (let i = 0; i < cols; i++) {
          const u = processed[a * cols + i]!;
          const v = processed[b * cols + i]!;
          if (excluded[i] === 1 && !Number.isNaN(u) && !Number.isNaN(v)) {
            x.push(u);
            y.push(v);
          }
        }
        best = Math.max(best, sampleCorrelation(x, y));
      }
      expected.push(best);
    }
    expected.sort((p, q) => p - q);
    // 40 sample points; each of the less common coverage moves on to the next row, of the common one.
    expect([result.entries, result.sampled, searched]).toEqual([40, 30, 30]);
    result.scores.forEach((s, k) => {
      expect(s).toBeCloseTo(expected[k]!, 5); // float32 kernels
    });
  });

  it('reads only the sampled rows (the lazy reader), never the whole matrix', () => {
    const read: number[] = [];
    const input = {
      cols,
      get processed(): Float32Array {
        throw new Error('the whole matrix was read');
      },
      row: (r: number) => {
        read.push(r);
        return processed.subarray(r * cols, (r + 1) * cols);
      },
      entries,
      grid: set.grid,
      exclude: set.recipe.exclude,
    };
    const result = wrongHitNull(input, { search, maxRows: 8 });
    // Sample points 0, 5, 10, …, 35 first; points 15 and 35 are of the less common coverage (r % 4 = 3) and move
    // on to rows 16 and 36.
    expect(read).toEqual([0, 5, 10, 15, 20, 25, 30, 35, 16, 36]);
    expect(result.sampled).toBe(8);
  });

  it('falls back to exact pairs when most sample points find no row of the common coverage', () => {
    // Each row misses one grid point of its own: 40 coverages.
    const partial = Float32Array.from(processed);
    for (let r = 0; r < 40; r++) partial[r * cols + 20 + r] = Number.NaN;
    const viaSearch = wrongHitNull({ cols, processed: partial, entries, grid: set.grid }, { search });
    const plain = wrongHitNull({ cols, processed: partial, entries });
    expect(Array.from(viaSearch.scores)).toEqual(Array.from(plain.scores));
    expect(viaSearch.sampled).toBe(40);
  });
});

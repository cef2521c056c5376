// Full-spectrum search: scores against a general-purpose statistics library, partial coverage, int8 path, errors.
import * as ss from 'simple-statistics';
import { sampleCorrelation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { buildSearchMatrix } from '../../src/match/buildSearchMatrix.js';
import { derivativeVector } from '../../src/match/derivativeVector.js';
import { matrixScores } from '../../src/match/matrixScores.js';
import { searchSpectra } from '../../src/match/searchSpectra.js';
import type { QuerySummary } from '../../src/match/searchTypes.js';
import { seeded, shared, syntheticSet, vectorFromBands } from './searchFixtures.js';

const cols = (set: { processed: Float32Array; entries: readonly unknown[] }) =>
  set.processed.length / set.entries.length;
const rowOf = (set: { processed: Float32Array; entries: readonly unknown[] }, r: number) =>
  set.processed.subarray(r * cols(set), (r + 1) * cols(set));

/** A query from the same family generator: a jittered copy of row `r` plus noise. */
function noisyCopy(row: ArrayLike<number>, seed: number, noise = 0.01): Float64Array {
  const random = seeded(seed);
  return Float64Array.from(row, (v) => (Number.isFinite(v) ? v + noise * (random() - 0.5) : Number.NaN));
}

function cosine(a: number[], b: number[]): number {
  let ab = 0;
  let aa = 0;
  let bb = 0;
  for (let i = 0; i < a.length; i++) {
    ab += a[i]! * b[i]!;
    aa += a[i]! * a[i]!;
    bb += b[i]! * b[i]!;
  }
  return ab / Math.sqrt(aa * bb);
}

function fullScores(
  metric: 'pearson' | 'cosine' | 'euclidean' | 'derivative',
  set: ReturnType<typeof syntheticSet>,
  query: Float64Array,
) {
  const hits = searchSpectra(set, [query], {
    metric,
    k: set.entries.length,
    minOverlap: 0,
    precision: 'exact',
  })[0]!;
  const byRow = new Float64Array(set.entries.length).fill(Number.NaN);
  for (const h of hits) byRow[h.row] = h.rawScore;
  return { hits, byRow };
}

describe('searchSpectra scores', () => {
  const set = syntheticSet({ rows: 60, seed: 3, exclude: [{ min: 1300, max: 1340 }] });
  const query = noisyCopy(rowOf(set, 17), 99, 0.02);
  const excluded = (i: number) => !(set.axis[i]! >= 1300 && set.axis[i]! <= 1340);

  it('pearson equals simple-statistics sampleCorrelation to 1e-6 (general-purpose reference library: simple-statistics)', () => {
    const { byRow } = fullScores('pearson', set, query);
    for (let r = 0; r < 60; r++) {
      const [x, y] = shared(rowOf(set, r), query, excluded);
      expect(Math.abs(byRow[r]! - sampleCorrelation(x, y))).toBeLessThan(1e-6);
    }
  });

  it('cosine equals the direct formula a·b/(‖a‖‖b‖) to 1e-6 (common practice)', () => {
    const { byRow } = fullScores('cosine', set, query);
    for (let r = 0; r < 60; r++) {
      const [x, y] = shared(rowOf(set, r), query, excluded);
      expect(Math.abs(byRow[r]! - cosine(x, y))).toBeLessThan(1e-6);
    }
  });

  it('euclidean is the distance between the unit-normalised vectors (common practice)', () => {
    const { byRow, hits } = fullScores('euclidean', set, query);
    for (let r = 0; r < 60; r++) {
      const [x, y] = shared(rowOf(set, r), query, excluded);
      const nx = Math.hypot(...x);
      const ny = Math.hypot(...y);
      const d = Math.sqrt(x.reduce((acc, v, i) => acc + (v / nx - y[i]! / ny) ** 2, 0));
      expect(Math.abs(byRow[r]! - d)).toBeLessThan(1e-5);
    }
    // Ranked closest first.
    for (let j = 1; j < hits.length; j++) expect(hits[j]!.score).toBeGreaterThanOrEqual(hits[j - 1]!.score);
    expect(hits[0]!.row).toBe(17);
  });

  it('derivative is Pearson of Savitzky–Golay first derivatives (simple-statistics)', () => {
    const { byRow } = fullScores('derivative', set, query);
    const dq = derivativeVector(query, { window: 9, order: 2, step: set.grid.step });
    let checked = 0;
    for (let r = 0; r < 60; r += 7) {
      const dr = derivativeVector(rowOf(set, r), { window: 9, order: 2, step: set.grid.step });
      const [x, y] = shared(dr, dq, excluded);
      expect(Math.abs(byRow[r]! - sampleCorrelation(x, y))).toBeLessThan(1e-6);
      checked++;
    }
    expect(checked).toBe(9);
  });

  it('derivative ignores an added offset and slope where pearson does not', () => {
    const tilted = Float64Array.from(query, (v, i) => v + 0.05 + 0.0005 * i);
    const plain = fullScores('derivative', set, query).byRow[17]!;
    const slanted = fullScores('derivative', set, tilted).byRow[17]!;
    expect(Math.abs(plain - slanted)).toBeLessThan(1e-6);
    const p0 = fullScores('pearson', set, query).byRow[17]!;
    const p1 = fullScores('pearson', set, tilted).byRow[17]!;
    expect(Math.abs(p0 - p1)).toBeGreaterThan(1e-3);
  });

  it('ranks the source row first, with each hit’s z taken against the other scores', () => {
    const summaries: QuerySummary[] = [];
    const hits = searchSpectra(set, [query], { k: 5, onQuery: (_, s) => summaries.push(s) })[0]!;
    expect(hits).toHaveLength(5);
    expect(hits[0]!.id).toBe('ref-17');
    const all = fullScores('pearson', set, query).byRow;
    const values = Array.from(all);
    const mean = values.reduce((a, b) => a + b, 0) / values.length;
    const sorted = [...values].sort((a, b) => b - a);
    for (let j = 0; j < 5; j++) {
      expect(hits[j]!.rawScore).toBeCloseTo(sorted[j]!, 12);
      expect(hits[j]!.gapToNext!).toBeCloseTo(sorted[j]! - sorted[j + 1]!, 12);
      // The spread leaves the hit itself out: mean and sample sd of the other 59 scores (simple-statistics).
      const others = values.filter((_, i) => i !== hits[j]!.row);
      expect(hits[j]!.z!).toBeCloseTo((sorted[j]! - ss.mean(others)) / ss.sampleStandardDeviation(others), 9);
      expect(hits[j]!.overlap).toBe(summaries[0]!.overlap);
    }
    expect(summaries[0]!.fullRows).toBe(60);
    expect(summaries[0]!.mean).toBeCloseTo(mean, 12);
  });

  it('clamps negative correlations to 0 in score and keeps the signed value in rawScore', () => {
    const inverted = Float64Array.from(rowOf(set, 4), (v) => -v);
    const hits = fullScores('pearson', set, inverted).hits;
    const last = hits[hits.length - 1]!;
    expect(last.row).toBe(4);
    expect(last.rawScore).toBeLessThan(-0.99);
    expect(last.score).toBe(0);
    expect(last.gapToNext).toBeNull();
  });

  it('restricts scoring to ranges (order-insensitive), still leaving out exclusions', () => {
    const ranged = searchSpectra(set, [query], {
      ranges: [{ min: 1500, max: 1100 }],
      k: 60,
      minOverlap: 0,
    })[0]!;
    const inRange = (i: number) => excluded(i) && set.axis[i]! >= 1100 && set.axis[i]! <= 1500;
    for (const hit of ranged.slice(0, 10)) {
      const [x, y] = shared(rowOf(set, hit.row), query, inRange);
      expect(Math.abs(hit.rawScore - sampleCorrelation(x, y))).toBeLessThan(1e-6);
    }
    // 1500–1100 on a 4 cm⁻¹ grid minus the excluded 1300–1340 (1296→1344 is a gap): 400 − 48 cm⁻¹.
    expect(ranged[0]!.overlap).toBe(352);
  });
});

describe('partial coverage', () => {
  const set = syntheticSet({ rows: 40, seed: 5 });
  const axis = set.axis;
  // Rows 0–9 cover only 1500–1000 cm⁻¹ (a tunable-laser reference), row 10 only 1100–1000 (too little).
  // The query below covers 1148–1000 on the 4 cm⁻¹ grid: 148 cm⁻¹.
  const c = cols(set);
  for (let r = 0; r <= 10; r++) {
    for (let i = 0; i < c; i++) {
      const w = axis[i]!;
      const keep = r === 10 ? w >= 1000 && w <= 1100 : w >= 1000 && w <= 1500;
      if (!keep) set.processed[r * c + i] = Number.NaN;
    }
  }

  it('scores a partial row exactly over the intersection and reports that overlap', () => {
    const query = noisyCopy(rowOf(syntheticSet({ rows: 40, seed: 5 }), 3), 8);
    const summaries: QuerySummary[] = [];
    const hits = searchSpectra(set, [query], { k: 40, onQuery: (_, s) => summaries.push(s) })[0]!;
    const three = hits.find((h) => h.row === 3)!;
    const [x, y] = shared(rowOf(set, 3), query);
    expect(Math.abs(three.rawScore - sampleCorrelation(x, y))).toBeLessThan(1e-9);
    expect(three.overlap).toBe(500);
    expect(hits.find((h) => h.row === 20)!.overlap).toBe(1000);
    // Row 10 shares 100 cm⁻¹ only: left out, not ranked.
    expect(hits.some((h) => h.row === 10)).toBe(false);
    expect(summaries[0]).toMatchObject({ fullRows: 29, partialRows: 10, dropped: 1 });
  });

  it('a partial query takes the fast path for every row that covers its range', () => {
    const query = new Float64Array(c).fill(Number.NaN);
    const source = rowOf(syntheticSet({ rows: 40, seed: 5 }), 25);
    // 1400–1000 cm⁻¹: inside the coverage of the partial rows 0–9, so they join the matrix scan.
    for (let i = 0; i < c; i++) if (axis[i]! >= 1000 && axis[i]! <= 1400) query[i] = source[i]!;
    const summaries: QuerySummary[] = [];
    const hits = searchSpectra(set, [query], { k: 40, onQuery: (_, s) => summaries.push(s) })[0]!;
    expect(hits[0]!.row).toBe(25);
    expect(hits[0]!.overlap).toBe(400);
    for (const hit of hits) {
      const [x, y] = shared(rowOf(set, hit.row), query);
      expect(Math.abs(hit.rawScore - sampleCorrelation(x, y))).toBeLessThan(1e-6);
    }
    expect(hits.find((h) => h.row === 3)!.overlap).toBe(400);
    expect(summaries[0]).toMatchObject({ overlap: 400, fullRows: 39, partialRows: 0, dropped: 1 });
  });

  it('refuses a query overlap below the minimum with SMALL_OVERLAP and a clear message', () => {
    const query = new Float64Array(c).fill(Number.NaN);
    for (let i = 0; i < c; i++) if (axis[i]! >= 1000 && axis[i]! <= 1150) query[i] = Math.sin(i);
    const attempt = () => searchSpectra(set, [query]);
    expect(attempt).toThrow(BandshelfError);
    try {
      attempt();
    } catch (error) {
      expect((error as BandshelfError).code).toBe('SMALL_OVERLAP');
      expect((error as BandshelfError).oneLine()).toMatch(
        /^the unknown covers only 148 cm⁻¹.*at least 200 cm⁻¹/,
      );
    }
    expect(() => searchSpectra(set, [query], { ranges: [{ min: 1200, max: 1900 }] })).toThrow(
      /covers only 0 cm⁻¹/,
    );
    // A lower minimum lets it through.
    expect(searchSpectra(set, [query], { minOverlap: 100 })[0]!.length).toBeGreaterThan(0);
  });
});

describe('matrix paths', () => {
  const set = syntheticSet({ rows: 5000, seed: 21, family: 50, grid: { start: 1800, stop: 900, step: 2 } });
  const c = cols(set);
  const queries = Array.from({ length: 12 }, (_, q) => noisyCopy(rowOf(set, q * 397), 1000 + q, 0.03));

  it('the int8 scan with exact rescoring gives the exact scan’s top 10 on every query', () => {
    for (const query of queries) {
      const exact = searchSpectra(set, [query], { precision: 'exact' })[0]!;
      const summaries: QuerySummary[] = [];
      const fast = searchSpectra(set, [query], {
        precision: 'int8',
        onQuery: (_, s) => summaries.push(s),
      })[0]!;
      expect(summaries[0]!.path).toBe('int8+exact');
      expect(summaries[0]!.rescored).toBeGreaterThanOrEqual(11);
      expect(summaries[0]!.rescored).toBeLessThan(5000);
      expect(fast.map((h) => h.id)).toEqual(exact.map((h) => h.id));
      for (const [j, h] of fast.entries()) expect(h.rawScore).toBe(exact[j]!.rawScore);
    }
  });

  it('a batch of queries equals the queries one by one (exact and int8 blocked kernels)', () => {
    const exactPaths: string[] = [];
    const batch = searchSpectra(set, queries, {
      precision: 'exact',
      onQuery: (_, s) => exactPaths.push(s.path),
    });
    const fastPaths: string[] = [];
    const fastBatch = searchSpectra(set, queries, { onQuery: (_, s) => fastPaths.push(s.path) });
    expect(new Set(exactPaths)).toEqual(new Set(['exact-batch']));
    expect(new Set(fastPaths)).toEqual(new Set(['int8+exact-batch']));
    for (const [q, query] of queries.entries()) {
      const single = searchSpectra(set, [query], { precision: 'exact' })[0]!;
      expect(batch[q]!.map((h) => h.id)).toEqual(single.map((h) => h.id));
      // Rescored rows go through the single-query kernel: the int8 batch's top scores are bit-identical to it.
      expect(fastBatch[q]!.map((h) => [h.id, h.rawScore])).toEqual(single.map((h) => [h.id, h.rawScore]));
      for (const [j, h] of batch[q]!.entries())
        expect(Math.abs(h.rawScore - single[j]!.rawScore)).toBeLessThan(1e-6);
    }
  });

  it('a batch of more than 32 queries is split into blocks', () => {
    const many = Array.from({ length: 37 }, (_, q) => queries[q % queries.length]!);
    const hits = searchSpectra(set, many, { k: 3 });
    expect(hits).toHaveLength(37);
    expect(hits[36]!.map((h) => h.id)).toEqual(hits[0]!.map((h) => h.id));
  });

  it('prepared matrix rows dot prepared queries to Pearson r (simple-statistics)', () => {
    const matrix = buildSearchMatrix(set, { int8: false });
    const mask = new Uint8Array(c).fill(1);
    const q = queries[0]!;
    let mean = 0;
    for (const v of q) mean += v / c;
    const centred = Float32Array.from(q, (v) => v - mean);
    const norm = Math.hypot(...centred);
    const prepared = new Float32Array(matrix.layout.stride);
    prepared.set(centred.map((v) => v / norm));
    const [scores] = matrixScores(matrix, [prepared]);
    for (let r = 0; r < 5000; r += 499) {
      const [x, y] = shared(rowOf(set, r), q, (i) => mask[i] === 1);
      expect(Math.abs(scores!.scores[r]! - sampleCorrelation(x, y))).toBeLessThan(1e-6);
    }
  });
});

describe('bad input', () => {
  const set = syntheticSet({ rows: 10 });
  const query = Float64Array.from(rowOf(set, 2));

  it('an empty library is EMPTY_LIBRARY', () => {
    const empty = { ...set, entries: [], processed: new Float32Array(0) };
    expect(() => searchSpectra(empty, [query])).toThrow(expect.objectContaining({ code: 'EMPTY_LIBRARY' }));
  });

  it('a query off the grid is BAD_FORMAT, a bad metric or k BAD_OPTION, a range off the grid BAD_OPTION', () => {
    expect(() => searchSpectra(set, [query.subarray(1)])).toThrow(
      expect.objectContaining({ code: 'BAD_FORMAT' }),
    );
    expect(() => searchSpectra(set, [query], { metric: 'manhattan' as 'pearson' })).toThrow(
      expect.objectContaining({ code: 'BAD_OPTION' }),
    );
    expect(() => searchSpectra(set, [query], { k: 0 })).toThrow(
      expect.objectContaining({ code: 'BAD_OPTION' }),
    );
    expect(() => searchSpectra(set, [query], { ranges: [{ min: 4000, max: 3000 }] })).toThrow(
      /outside the library grid/,
    );
  });

  it('a flat unknown is refused rather than scored', () => {
    expect(() => searchSpectra(set, [new Float64Array(query.length).fill(0.3)])).toThrow(/flat/);
  });

  it('does not change its inputs', () => {
    const before = set.processed.slice();
    const q = query.slice();
    searchSpectra(set, [q], { metric: 'derivative' });
    expect(set.processed).toEqual(before);
    expect(q).toEqual(query);
  });
});

describe('fixtures', () => {
  it('vectorFromBands gives unit vectors', () => {
    const axis = Float64Array.from({ length: 50 }, (_, i) => 1000 + 4 * i);
    const v = vectorFromBands(axis, [{ centre: 1100, width: 10, height: 1 }], seeded(1), 0.05);
    expect(Math.hypot(...v)).toBeCloseTo(1, 12);
  });
});

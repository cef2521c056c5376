// The match report assembled from hand-made parts: schema-valid, NaN as null, standing verdicts, revision set.
import { describe, expect, it } from 'vitest';
import { buildMatchReport, type MatchReportInput } from '../../src/match/buildMatchReport.js';
import type { Hit } from '../../src/match/searchTypes.js';
import { matchReportSchema } from '../../src/schema/matchReport.js';
import { recipeSchema } from '../../src/schema/recipe.js';

const grid = { start: 1010, stop: 1000, step: 2 };
const hit = (id: string, rawScore: number, z: number | null, gap: number | null): Hit => ({
  id,
  revision: 1,
  name: id,
  class: 'other',
  row: 0,
  score: Math.max(0, rawScore),
  rawScore,
  overlap: 10,
  gapToNext: gap,
  z,
});

function input(hits: Hit[], entries = 40): MatchReportInput {
  return {
    query: {
      file: 'u.csv',
      hash: 'a'.repeat(64),
      recipe: recipeSchema.parse({}),
      recipeSource: 'library',
      grid,
      ranges: [],
      // Six grid points 1000…1010; the first is not covered.
      processed: Float64Array.from([Number.NaN, 0.1, 0.2, 0.3, 0.2, 0.1]),
      warnings: [],
    },
    library: {
      name: 'test',
      release: null,
      stateKey: 'k',
      entries: Array.from({ length: entries }, (_, i) => ({ id: `e${i}`, revision: 1 })),
    },
    settings: { top: 10, minOverlap: 0, tolerance: 4, maxComponents: 6, with: [] },
    metrics: ['pearson'],
    hitsByMetric: { pearson: hits },
    mixture: null,
    bands: [],
  };
}

describe('buildMatchReport', () => {
  it('writes NaN as null, the coverage it scored, and validates against the schema', () => {
    const report = buildMatchReport(input([hit('a', 0.99, 5, 0.05)]));
    expect(matchReportSchema.safeParse(report).success).toBe(true);
    expect(report.query.processed).toEqual([null, 0.1, 0.2, 0.3, 0.2, 0.1]);
    // Points 1002–1010 are covered: five points, four neighbouring pairs × 2 cm⁻¹.
    expect(report.query.coverage).toEqual({ min: 1002, max: 1010, points: 5, overlap: 8 });
    expect(report.hits[0]).toMatchObject({ rank: 1, id: 'a', score: 0.99 });
    expect(report.library.revisions).toHaveLength(40);
  });

  it('reads the best hit from its p-value against the wrong-hit null, and z and gap stay as given', () => {
    // A null of 9 best-wrong scores 0.1 … 0.9: p = (1 + count ≥ score) / 10 (add-one empirical p-value).
    const wrongHitNull = {
      metric: 'pearson' as const,
      scores: Float64Array.from([0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9]),
      entries: 9,
      sampled: 9,
    };
    const run = (hits: Hit[]) => buildMatchReport({ ...input(hits), wrongHitNull });
    const r = run([hit('a', 0.95, 5, 0.1), hit('b', 0.85, 3, 0.2), hit('c', 0.35, 1, null)]);
    expect(r.hits.map((h) => h.pValue)).toEqual([0.1, 0.2, 0.7].map((v) => expect.closeTo(v, 12)));
    expect(r.standing.verdict).toBe('ambiguous');
    expect(r.confidence).toMatchObject({ metric: 'pearson', nullSize: 9, entries: 9 });
    expect(r.confidence!.text).toMatch(/not the probability that the identification is right/);
    expect(run([hit('a', 0.5, 5, 0.1)]).standing.verdict).toBe('weak');
    // Above every null score: p at its floor 1/10, too coarse to call it distinct.
    expect(run([hit('a', 0.99, 5, 0.1)]).standing.text).toMatch(/9 entries are too few to show p ≤ 0.01/);
    // Without a null nothing is called distinct.
    expect(buildMatchReport(input([hit('a', 0.99, 5, 0.05)])).standing.verdict).toBe('ambiguous');
    expect(buildMatchReport(input([hit('a', 0.85, 4, 0.3)])).standing.verdict).toBe('weak');
    expect(buildMatchReport(input([hit('a', 0.99, 5, 0.05)])).hits[0]!.pValue).toBeNull();
    expect(buildMatchReport(input([])).standing.verdict).toBe('none');
  });

  it('leaves the revision list out of reports on large libraries', () => {
    const report = buildMatchReport(input([hit('a', 0.99, 5, 0.05)], 50), { maxRevisions: 10 });
    expect(report.library.revisions).toBeUndefined();
    expect(report.library.entries).toBe(50);
  });
});

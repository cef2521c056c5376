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

  it('reads the best hit as distinct, ambiguous or weak', () => {
    expect(buildMatchReport(input([hit('a', 0.99, 5, 0.05), hit('b', 0.94, 3, 0.1)])).standing.verdict).toBe(
      'distinct',
    );
    expect(
      buildMatchReport(input([hit('a', 0.99, 5, 0.005), hit('b', 0.985, 4.9, 0.1)])).standing.verdict,
    ).toBe('ambiguous');
    expect(
      buildMatchReport(input([hit('a', 0.96, 2.5, 0.08), hit('b', 0.88, 2, 0.1)])).standing.text,
    ).toMatch(/not far out of the library's spread/);
    expect(
      buildMatchReport(input([hit('a', 0.93, 4.9, 0.55), hit('b', 0.38, 2, 0.1)])).standing.verdict,
    ).toBe('distinct');
    expect(buildMatchReport(input([hit('a', 0.85, 4, 0.3)])).standing.verdict).toBe('weak');
    // Neither 1.5 SD out nor 0.02 ahead: weak even at a high score.
    expect(
      buildMatchReport(input([hit('a', 0.95, 1.2, 0.005), hit('b', 0.945, 1.1, 0.1)])).standing.verdict,
    ).toBe('weak');
    // A near-perfect hit in a library of one family (low z) with a clear lead is still distinct.
    expect(
      buildMatchReport(input([hit('a', 0.9996, 1.98, 0.072), hit('b', 0.9277, 1.7, 0.1)])).standing.verdict,
    ).toBe('distinct');
    // Under 20 entries the z-score cannot reach 3, so it is not used.
    expect(
      buildMatchReport(input([hit('a', 0.99, 1.9, 0.5), hit('b', 0.49, 0, null)], 6)).standing.verdict,
    ).toBe('distinct');
    expect(buildMatchReport(input([])).standing.verdict).toBe('none');
  });

  it('leaves the revision list out of reports on large libraries', () => {
    const report = buildMatchReport(input([hit('a', 0.99, 5, 0.05)], 50), { maxRevisions: 10 });
    expect(report.library.revisions).toBeUndefined();
    expect(report.library.entries).toBe(50);
  });
});

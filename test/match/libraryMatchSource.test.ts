// The library source reads only what a match needs: with a current disk cache, no bulk read of processed vectors,
// only the rows the report shows, and originals only for the mixture candidates that need re-processing.
import { rmSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { closeLibrary } from '../../src/library/store/closeLibrary.js';
import { openLibrary } from '../../src/library/store/openLibrary.js';
import { readSearchSet } from '../../src/library/store/readSearchSet.js';
import type { Library } from '../../src/library/types.js';
import { libraryMatchSource } from '../../src/match/libraryMatchSource.js';
import { runMatchPipeline } from '../../src/match/pipeline/runMatchPipeline.js';
import type { MatchUnknown } from '../../src/match/pipeline/types.js';
import { bandsFor, syntheticSpectrum } from '../cli/bandshelfCli.js';
import { addEntry, newLibrary } from '../library/libraryFixture.js';

let dir: string;
let path: string;

beforeAll(() => {
  const made = newLibrary();
  dir = made.dir;
  path = made.library.path;
  for (let k = 0; k < 12; k++)
    addEntry(made.library, `synthetic-${String(k).padStart(2, '0')}`, bandsFor(k), k + 1);
  closeLibrary(made.library);
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Entry 5's bands with fresh noise (seed 99): an unknown on the library's own 4000–600 cm⁻¹ span. */
function unknownOf(k: number, span: { start?: number; stop?: number } = {}): MatchUnknown {
  const s = syntheticSpectrum(bandsFor(k), { seed: 99, ...span });
  const order = s.x.map((_, i) => s.x.length - 1 - i);
  return {
    file: 'unknown.csv',
    hash: '0'.repeat(64),
    spectrum: {
      wavenumber: Float64Array.from(order, (i) => s.x[i]!),
      absorbance: Float64Array.from(order, (i) => s.y[i]!),
    },
    warnings: [],
  };
}

/** Opens the library with every SQL text it prepares recorded, and a lazy search set whose reads are counted. */
function instrumented() {
  const library: Library = openLibrary(path, { readonly: true });
  const sql: string[] = [];
  const prepare = library.db.prepare.bind(library.db);
  vi.spyOn(library.db, 'prepare').mockImplementation(((text: string) => {
    sql.push(text);
    return prepare(text);
  }) as typeof library.db.prepare);
  const set = readSearchSet(library, { lazy: true });
  const rowsRead: number[] = [];
  const row = set.row!;
  set.row = (r) => {
    rowsRead.push(r);
    return row(r);
  };
  const bulk = vi.spyOn(set, 'processed', 'get');
  const { source, scorer } = libraryMatchSource(library, set);
  const originals = vi.spyOn(source, 'originals');
  return { library, sql, rowsRead, bulk, source, scorer, originals };
}

describe('libraryMatchSource', () => {
  it('with a current cache reads no processed vector in bulk: only the rows of the hits it reports', async () => {
    // First run: builds the matrix and the wrong-hit null and writes both to the cache folder.
    const warm = instrumented();
    const first = await runMatchPipeline(
      { unknown: unknownOf(5), source: warm.source, scorer: warm.scorer, assignments: [] },
      { top: 3 },
    );
    closeLibrary(warm.library);
    expect(first.hitsByMetric.pearson![0]!.id).toBe('synthetic-05');

    const run = instrumented();
    try {
      // Like with like is off here: it reads the originals of hits recorded at another resolution to degrade them
      // (compareAtCoarserResolution); this test is about what the search itself reads.
      const report = await runMatchPipeline(
        { unknown: unknownOf(5), source: run.source, scorer: run.scorer, assignments: [] },
        { top: 3, likeWithLike: false },
      );
      expect(report.hitsByMetric.pearson!.map((h) => h.id)).toEqual(
        first.hitsByMetric.pearson!.map((h) => h.id),
      );
      expect(run.bulk).not.toHaveBeenCalled();
      // The three hits' rows (their per-region contributions need the vectors), each read once.
      const hitRows = report.hitsByMetric.pearson!.map((h) =>
        run.source.entries.findIndex((e) => e.id === h.id),
      );
      expect([...new Set(run.rowsRead)].sort()).toEqual([...hitRows].sort());
      // Every statement that names the processed column is the one-row reader's.
      const naming = run.sql.filter((s) => /processed/.test(s));
      expect(naming.every((s) => /WHERE entry_id = \? AND revision = \?/.test(s))).toBe(true);
      expect(run.sql.some((s) => /original_x|original_y|SELECT \*/.test(s))).toBe(false);
      expect(run.originals).not.toHaveBeenCalled();
    } finally {
      closeLibrary(run.library);
    }
  });

  it('reads originals only for the mixture candidates when the unknown covers part of the grid', async () => {
    const run = instrumented();
    try {
      // 1800–1000 cm⁻¹ only: candidates reaching beyond it are processed again over that span.
      const report = await runMatchPipeline(
        {
          unknown: unknownOf(5, { start: 1800, stop: 1000 }),
          source: run.source,
          scorer: run.scorer,
          assignments: [],
        },
        { top: 3, mixture: true, candidates: 4, minOverlap: 100 },
      );
      expect(run.bulk).not.toHaveBeenCalled();
      // Once to process the candidates again over the span; like with like may ask again for some of them (to bring
      // them to a common resolution) and for the reported hits: never more rows than the candidates at a time.
      expect(run.originals).toHaveBeenCalled();
      for (const [asked] of run.originals.mock.calls) expect(asked.length).toBeLessThanOrEqual(4);
      expect(report.mixture).not.toBeNull();
    } finally {
      closeLibrary(run.library);
    }
  });

  it('a lazy set reads the same vectors as an eager one, by row and in bulk', () => {
    const library = openLibrary(path, { readonly: true });
    try {
      const eager = readSearchSet(library);
      const lazy = readSearchSet(library, { lazy: true });
      expect(lazy.stateKey).toBe(eager.stateKey);
      expect(Array.from(lazy.row!(7))).toEqual(
        Array.from(eager.processed.subarray(7 * eager.cols, 8 * eager.cols)),
      );
      expect(Array.from(lazy.processed)).toEqual(Array.from(eager.processed));
    } finally {
      closeLibrary(library);
    }
  });
});

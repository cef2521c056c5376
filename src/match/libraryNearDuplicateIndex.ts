// An add's near-duplicate shortlists on the match kernels and search cache, and that cache carried over to the
// library state the add leaves behind (the stored matrix extended by the new rows, not rebuilt from the library).
import { BandshelfError } from '../error.js';
import type { CommittedVector, NearDuplicateIndex } from '../library/ingest/ingestTypes.js';
import { readSearchSet } from '../library/store/readSearchSet.js';
import { stateKeyOf } from '../library/store/stateKeyOf.js';
import type { Library, SearchSet } from '../library/types.js';
import { buildSearchMatrix } from './buildSearchMatrix.js';
import { searchLibrary } from './searchLibrary.js';
import { searchMatrixCachePath } from './searchMatrixCachePath.js';
import type { Hit, ScoringEntry, ScoringSet, SearchMatrix } from './searchTypes.js';
import { writeCachedSearchMatrix } from './writeCachedSearchMatrix.js';

export interface LibraryNearDuplicateIndexOptions {
  /** Best library entries kept per new vector before the floor applies.
   * @default 8 */
  shortlist?: number;
  /** Write the next state's search matrices to the cache when the add is over.
   * @default true */
  cache?: boolean;
}

/** SQLite orders TEXT keys by their UTF-8 bytes (BINARY collation); so does the next state's row order here. */
const byUtf8 = (a: string, b: string): number => Buffer.compare(Buffer.from(a), Buffer.from(b));

/**
 * Each block of new vectors is one Pearson search (queries sharing a mask in one pass over the matrix), over the
 * library as the add found it: the matrix from the disk cache when current, else built once and cached. On
 * `close` every matrix the add used is extended to the state the add left (its rows copied, the new and replaced
 * rows prepared from the add's vectors) and written under that state's key, so the next `match` reads it.
 */
export function libraryNearDuplicateIndex(
  library: Library,
  options: LibraryNearDuplicateIndexOptions = {},
): NearDuplicateIndex {
  const per = options.shortlist ?? 8;
  let set: SearchSet | null = null;
  const used = new Map<string, SearchMatrix>();
  const stored: CommittedVector[] = [];

  const search = (s: SearchSet, vectors: readonly Float64Array[]): Hit[][] =>
    searchLibrary(library, vectors, {
      set: s,
      metric: 'pearson',
      k: Math.min(s.rows, per),
      minOverlap: 0,
      onMatrix: (_origin, key, matrix) => used.set(key, matrix),
    });

  const shortlist = (vectors: readonly Float64Array[], floor: number) => {
    // Read at the first block, before anything of this add is committed.
    set ??= readSearchSet(library, { lazy: true });
    const s = set;
    if (s.rows === 0) return vectors.map(() => []);
    let hits: Hit[][];
    try {
      hits = search(s, vectors);
    } catch (error) {
      if (!(error instanceof BandshelfError)) throw error;
      // One vector the search refuses (flat, nothing covered) must not cost the others their check.
      hits = vectors.map((v) => {
        try {
          return search(s, [v])[0]!;
        } catch (inner) {
          if (!(inner instanceof BandshelfError)) throw inner;
          return [];
        }
      });
    }
    return hits.map((list) =>
      list.filter((h) => h.rawScore > floor).map((h) => ({ id: h.id, revision: h.revision })),
    );
  };

  const close = () => {
    const memoryOnly = library.path === '' || library.path === ':memory:';
    if (options.cache === false || memoryOnly || set === null || stored.length === 0 || used.size === 0)
      return;
    const next = nextState(set, stored);
    for (const matrix of used.values()) {
      const { layout, memory } = matrix;
      const mask = new Uint8Array(memory.buffer, layout.mask, layout.cols).slice();
      const extended = buildSearchMatrix(next.set, {
        preparation: matrix.preparation,
        mask,
        reuse: { matrix, rows: next.from },
      });
      writeCachedSearchMatrix(
        searchMatrixCachePath({ libraryPath: library.path, key: extended.key }),
        extended,
      );
    }
  };

  return { shortlist, committed: (revisions) => stored.push(...revisions), close };
}

/** The state after the add: the old rows with replaced and new entries merged in, and each row's old index or −1. */
function nextState(
  set: SearchSet,
  stored: readonly CommittedVector[],
): { set: ScoringSet; from: Int32Array } {
  const latest = new Map(stored.map((r) => [r.id, r]));
  const rows: { entry: ScoringEntry & { hash: string }; from: number; vector?: Float64Array }[] = [];
  set.entries.forEach((e, i) => {
    const replaced = latest.get(e.id);
    if (replaced === undefined) rows.push({ entry: e, from: i });
  });
  for (const r of latest.values()) {
    rows.push({
      entry: { id: r.id, revision: r.revision, hash: r.hash, name: r.id, class: 'other' },
      from: -1,
      vector: r.processed,
    });
  }
  rows.sort((a, b) => byUtf8(a.entry.id, b.entry.id));
  const entries = rows.map((r) => r.entry);
  const next: ScoringSet = {
    grid: set.grid,
    recipe: set.recipe,
    stateKey: stateKeyOf({ grid: set.grid, entries }),
    entries,
    row: (r) => Float32Array.from(rows[r]!.vector!),
    get processed(): Float32Array {
      throw new Error('the next state is built from the reused matrix and the add’s own vectors only');
    },
  };
  return { set: next, from: Int32Array.from(rows, (r) => r.from) };
}

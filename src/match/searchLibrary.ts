// Full-spectrum search of a library file (Node): the library's search set, matrices from the disk cache, and the
// kernels split across worker threads.
import { readSearchSet } from '../library/store/readSearchSet.js';
import type { Library, SearchSet } from '../library/types.js';
import { buildSearchMatrix } from './buildSearchMatrix.js';
import { createScorePool, type ScorePool } from './createScorePool.js';
import { readCachedSearchMatrix } from './readCachedSearchMatrix.js';
import { searchMatrixCachePath } from './searchMatrixCachePath.js';
import { type SearchSpectraOptions, searchSpectra } from './searchSpectra.js';
import type { Hit, MatrixPreparation, ScoringSet, SearchMatrix } from './searchTypes.js';
import { writeCachedSearchMatrix } from './writeCachedSearchMatrix.js';

export interface SearchLibraryOptions extends Omit<SearchSpectraOptions, 'matrices' | 'runner'> {
  /**
   * A release tag to search, or the working state.
   * @default undefined
   */
  at?: string | null;
  /**
   * A search set already read from this library at `at` (the match command needs it for the mixture fit too).
   * @default undefined
   */
  set?: SearchSet;
  /**
   * Keep search matrices in `<library>.cache/` so the next query need not rebuild them.
   * @default true
   */
  cache?: boolean;
  /**
   * Reuse matrices this process already holds (the two most recent); false reads the disk cache afresh.
   * @default true
   */
  reuse?: boolean;
  /**
   * Worker threads for the kernels (1: the calling thread only).
   * @default Math.min(2, os.availableParallelism())
   */
  threads?: number;
  /**
   * Called with where each matrix came from, and the matrix (an add extends it into the next state's cache).
   * @default undefined
   */
  onMatrix?: (origin: 'memory' | 'disk' | 'built', key: string, matrix: SearchMatrix) => void;
}

/** Below this many rows the kernels run on the calling thread. */
const SPLIT_ROWS = 4096;

/** Matrices of this process, newest last: a batch of unknowns reuses them without touching the disk. */
const recent = new Map<string, SearchMatrix>();
const pools = new WeakMap<WebAssembly.Memory, ScorePool>();

/**
 * Like `searchSpectra` (see there for scores and hits), for a library file. A cached matrix is used only when its
 * key (library state, preparation, mask) matches; a cache that cannot be written is silently skipped.
 */
export function searchLibrary(
  library: Library,
  queries: readonly ArrayLike<number>[],
  options: SearchLibraryOptions = {},
): Hit[][] {
  const set = options.set ?? readSearchSet(library, { at: options.at, lazy: true });
  const useCache = (options.cache ?? true) && library.path !== ':memory:' && library.path !== '';
  const threads = options.threads;
  const matrices = (s: ScoringSet, preparation: MatrixPreparation, mask: Uint8Array, key: string) => {
    const remembered = options.reuse === false ? undefined : recent.get(key);
    if (remembered !== undefined) {
      recent.delete(key);
      recent.set(key, remembered);
      options.onMatrix?.('memory', key, remembered);
      return remembered;
    }
    const rows = s.entries.length;
    const cols = mask.length;
    const path = searchMatrixCachePath({ libraryPath: library.path, key });
    let matrix = useCache ? readCachedSearchMatrix(path, { key, rows, cols }, { shared: true }) : null;
    if (matrix !== null) options.onMatrix?.('disk', key, matrix);
    else {
      matrix = buildSearchMatrix(s, { preparation, mask, shared: true });
      options.onMatrix?.('built', key, matrix);
      if (useCache) writeCachedSearchMatrix(path, matrix);
    }
    recent.set(key, matrix);
    while (recent.size > 2) {
      const oldest = recent.keys().next().value!;
      const dropped = recent.get(oldest);
      recent.delete(oldest);
      if (dropped) pools.get(dropped.memory)?.close();
    }
    return matrix;
  };
  const runner = (matrix: SearchMatrix) => {
    let pool = pools.get(matrix.memory);
    if (pool === undefined) {
      // Starting workers costs tens of milliseconds: more than a small library's whole scan.
      const small = matrix.layout.rows < SPLIT_ROWS;
      pool = createScorePool(matrix.memory, {
        minRowsToSplit: SPLIT_ROWS,
        ...(small ? { threads: 1 } : threads === undefined ? {} : { threads }),
      });
      pools.set(matrix.memory, pool);
    }
    return pool;
  };
  const {
    at: _at,
    set: _set,
    cache: _cache,
    reuse: _reuse,
    threads: _threads,
    onMatrix: _onMatrix,
    ...rest
  } = options;
  return searchSpectra(set, queries, { ...rest, matrices, runner });
}

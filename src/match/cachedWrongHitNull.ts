// The wrong-hit null of a library state (Node): read from its own small cache file beside the library, or computed.
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import type { SearchSet } from '../library/types.js';
import { gridLength } from '../spectrum/gridLength.js';
import { type WrongHitNull, type WrongHitNullOptions, wrongHitNull } from './wrongHitNull.js';

export interface CachedWrongHitNullOptions extends WrongHitNullOptions {
  /**
   * Keep the null in `<library>.cache/wrong-hit-null-<state>.json`; false (or an in-memory library) computes it afresh.
   * @default true
   */
  cache?: boolean;
}

const FORMAT = 2;

/** Keyed by the state key and the sampling options; a cache file that cannot be read or written is ignored. */
export function cachedWrongHitNull(
  input: {
    libraryPath: string;
    set: Pick<SearchSet, 'stateKey' | 'grid' | 'entries' | 'processed' | 'row'> & {
      recipe: Pick<SearchSet['recipe'], 'exclude'>;
    };
  },
  options: CachedWrongHitNullOptions = {},
): WrongHitNull {
  const { libraryPath, set } = input;
  const { cache, ...nullOptions } = options;
  const { search, ...sampling } = nullOptions;
  // The kernel path scores outside the exclusion windows, the plain-JS path over every shared point.
  const key = JSON.stringify({
    format: FORMAT,
    state: set.stateKey,
    ...sampling,
    kernels: search !== undefined,
  });
  const useCache = (cache ?? true) && libraryPath !== '' && libraryPath !== ':memory:';
  const path = `${libraryPath}.cache/wrong-hit-null-${createHash('sha256').update(key).digest('hex').slice(0, 32)}.json`;
  if (useCache) {
    try {
      const stored = JSON.parse(readFileSync(path, 'utf8'));
      if (stored.key === key && Array.isArray(stored.scores)) {
        return {
          metric: 'pearson',
          scores: Float64Array.from(stored.scores as number[]),
          entries: stored.entries,
          sampled: stored.sampled,
        };
      }
    } catch {
      // Absent or unreadable: compute it.
    }
  }
  const computed = wrongHitNull(
    {
      cols: gridLength(set.grid),
      // A lazy set's `processed` reads every row: only the plain-JS path touches it.
      get processed() {
        return set.processed;
      },
      ...(set.row === undefined ? {} : { row: set.row }),
      entries: set.entries,
      grid: set.grid,
      exclude: set.recipe.exclude,
    },
    nullOptions,
  );
  if (useCache) {
    try {
      mkdirSync(`${libraryPath}.cache`, { recursive: true });
      const temp = `${path}.${process.pid}.tmp`;
      writeFileSync(
        temp,
        JSON.stringify({
          key,
          scores: Array.from(computed.scores),
          entries: computed.entries,
          sampled: computed.sampled,
        }),
      );
      renameSync(temp, path);
    } catch {
      // A read-only folder only costs the recomputation next time.
    }
  }
  return computed;
}

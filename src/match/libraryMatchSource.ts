// A library's search set as the match pipeline's source, and the Node scorer (worker/WASM kernels, disk cache).
import { BandshelfError } from '../error.js';
import { readEntry } from '../library/store/readEntry.js';
import { recipeReferences } from '../library/store/recipeReferences.js';
import type { Library, SearchSet } from '../library/types.js';
import type { Spectrum } from '../spectrum/types.js';
import { cachedWrongHitNull } from './cachedWrongHitNull.js';
import type { EntryOriginal, MatchScorer, MatchSource } from './pipeline/types.js';
import { searchLibrary } from './searchLibrary.js';

export interface LibraryMatchSourceOptions {
  /** The release tag the set was read at (reference spectra are read from it). @default undefined */
  at?: string;
}

/**
 * Reads nothing per row up front: processed vectors come through the set (lazy or not), and an entry's original
 * only when the pipeline asks for that row (mixture candidates over a partial span).
 * Originals are read once per row and kept for the life of the source, so a batch reads each at most once.
 * The scorer reuses the given search set rather than reading it again.
 */
export function libraryMatchSource(
  library: Library,
  set: SearchSet,
  options: LibraryMatchSourceOptions = {},
): { source: MatchSource; scorer: MatchScorer } {
  const read = new Map<number, EntryOriginal>();
  const references: Map<string, Spectrum> = recipeReferences(
    library,
    set.recipe,
    options.at === undefined ? {} : { at: options.at },
  );
  // The set's own descriptors, not a spread: a lazy set's `processed` is a getter that reads every row.
  const own: Omit<MatchSource, keyof SearchSet> = {
    name: library.name,
    references,
    wrongHitNull: cachedWrongHitNull(
      { libraryPath: library.path, set },
      { search: (queries, k) => searchLibrary(library, queries, { set, k, metric: 'pearson' }) },
    ),
    originals: async (rows: readonly number[]) => {
      const out = new Map<number, EntryOriginal>();
      for (const row of rows) {
        let view = read.get(row);
        if (view === undefined) {
          const e = set.entries[row]!;
          const entry = readEntry(library, e.id, { revision: e.revision });
          // A stored entry's recipe pins the revision of every spectrum it names.
          try {
            view = {
              original: entry.original,
              recipe: entry.recipe,
              references: recipeReferences(library, entry.recipe),
              ...(entry.extras.resolution === undefined ? {} : { resolution: entry.extras.resolution.value }),
            };
          } catch (error) {
            // Without its references the entry keeps its stored vector.
            if (!(error instanceof BandshelfError)) throw error;
            continue;
          }
          read.set(row, view);
        }
        out.set(row, view);
      }
      return out;
    },
  };
  const source = Object.defineProperties(own, Object.getOwnPropertyDescriptors(set)) as MatchSource;
  const scorer: MatchScorer = (_source, queries, scoring) =>
    searchLibrary(library, queries, { ...scoring, set });
  return { source, scorer };
}

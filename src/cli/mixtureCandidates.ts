// The library spectra offered to one unknown's mixture fit; processed again over its span when it covers only part.
import { BandshelfError } from '../error.js';
import { readEntry } from '../library/store/readEntry.js';
import type { EntryView, Library, SearchSet } from '../library/types.js';
import { reprocessOverWindow } from '../match/reprocessOverWindow.js';
import { spectrumExtent } from '../match/spectrumExtent.js';
import type { MixtureCandidate } from '../match/types.js';
import type { Recipe, WavenumberWindow } from '../schema/recipe.js';
import type { Spectrum } from '../spectrum/types.js';
import { recipeReferences } from './recipeReferences.js';

export interface MixtureCandidatesOptions {
  /**
   * Entry views already read, by search-set row; shared across the unknowns of a batch so each is read once.
   * @default a new map
   */
  views?: Map<number, EntryView>;
}

export interface MixtureCandidateSet {
  candidates: MixtureCandidate[];
  /** The unknown's span when it covers only part of the grid (the window references were processed over). */
  window: WavenumberWindow | null;
  /** Ids of the candidates processed again over `window`. */
  reprocessed: string[];
}

/**
 * One candidate per search-set row, in the order given. When the unknown's data (inside its recipe's crop) stop
 * more than a grid step short of either end of the grid, every candidate whose original reaches beyond that
 * span is processed again over it with its own recipe (reprocessOverWindow): the unknown's baseline and
 * normalisation only saw that span, and the fit should compare like with like. A full-coverage unknown keeps
 * the stored vectors; so does a candidate whose recipe cannot run on the narrower span.
 */
export function mixtureCandidates(
  library: Library,
  set: SearchSet,
  rows: readonly number[],
  unknown: Spectrum,
  recipe: Recipe,
  options: MixtureCandidatesOptions = {},
): MixtureCandidateSet {
  const views = options.views ?? new Map<number, EntryView>();
  const gridMin = Math.min(set.grid.start, set.grid.stop);
  const gridMax = Math.max(set.grid.start, set.grid.stop);
  const span = spectrumExtent(unknown, { crop: recipe.crop });
  const window =
    span !== null && (span.min > gridMin + set.grid.step || span.max < gridMax - set.grid.step) ? span : null;
  const reprocessed: string[] = [];
  const candidates = rows.map((row): MixtureCandidate => {
    const e = set.entries[row]!;
    let vector: ArrayLike<number> = set.processed.subarray(row * set.cols, (row + 1) * set.cols);
    if (window !== null) {
      let view = views.get(row);
      if (view === undefined) {
        view = readEntry(library, e.id, { revision: e.revision });
        views.set(row, view);
      }
      try {
        // A stored entry's recipe pins the revision of every spectrum it names.
        const references = recipeReferences(library, view.recipe);
        const again = reprocessOverWindow(view.original, view.recipe, set.grid, window, { references });
        if (again !== null) {
          vector = again;
          if (!reprocessed.includes(e.id)) reprocessed.push(e.id);
        }
      } catch (error) {
        if (!(error instanceof BandshelfError)) throw error;
      }
    }
    return { id: e.id, revision: e.revision, name: e.name, class: e.class, vector };
  });
  return { candidates, window, reprocessed };
}

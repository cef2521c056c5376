// The library spectra offered to one unknown's mixture fit; processed again over its span when it covers only part.
import { BandshelfError } from '../../error.js';
import type { Recipe, WavenumberWindow } from '../../schema/recipe.js';
import type { Spectrum } from '../../spectrum/types.js';
import { processedRow } from '../processedRow.js';
import { reprocessOverWindow } from '../reprocessOverWindow.js';
import { spectrumExtent } from '../spectrumExtent.js';
import type { MixtureCandidate } from '../types.js';
import type { MatchSource } from './types.js';

export interface OfferMixtureCandidatesOptions {
  /** The recipe the unknown was processed with. @default source.recipe */
  recipe?: Recipe;
}

export interface MixtureCandidateSet {
  candidates: MixtureCandidate[];
  /** The unknown's span when it covers only part of the grid (the window references were processed over). */
  window: WavenumberWindow | null;
  /** Ids of the candidates processed again over `window`. */
  reprocessed: string[];
}

/**
 * One candidate per source row, in the order given. When the unknown's data (inside its recipe's crop) stop
 * more than a grid step short of either end of the grid, every candidate whose original reaches beyond that
 * span is processed again over it with its own recipe (reprocessOverWindow): the unknown's baseline and
 * normalisation only saw that span, and the fit should compare like with like. A full-coverage unknown keeps
 * the stored vectors; so does a candidate whose recipe cannot run on the narrower span.
 */
export async function offerMixtureCandidates(
  input: { source: MatchSource; rows: readonly number[]; unknown: Spectrum },
  options: OfferMixtureCandidatesOptions = {},
): Promise<MixtureCandidateSet> {
  const { source, rows, unknown } = input;
  const recipe = options.recipe ?? source.recipe;
  const { grid } = source;
  const gridMin = Math.min(grid.start, grid.stop);
  const gridMax = Math.max(grid.start, grid.stop);
  const span = spectrumExtent(unknown, { crop: recipe.crop });
  const window =
    span !== null && (span.min > gridMin + grid.step || span.max < gridMax - grid.step) ? span : null;
  const originals = window === null ? new Map() : await source.originals([...new Set(rows)]);
  const reprocessed: string[] = [];
  const candidates = rows.map((row): MixtureCandidate => {
    const e = source.entries[row]!;
    let vector: ArrayLike<number> = processedRow(source, row);
    const view = originals.get(row);
    if (window !== null && view !== undefined) {
      try {
        const again = reprocessOverWindow(view.original, view.recipe, grid, window, {
          references: view.references,
        });
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

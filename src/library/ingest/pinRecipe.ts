// Pins the library spectra a recipe names (reference subtraction, EMSC) to a revision, so the processed vector
// stays reproducible after those entries change.
import { BandshelfError } from '../../error.js';
import type { Recipe } from '../../schema/recipe.js';
import { pinAtr } from '../../spectrum/pinAtr.js';
import { pinResolution } from '../../spectrum/pinResolution.js';
import type { Resolution } from '../../spectrum/resolutionOf.js';
import { headRevision } from '../store/headRevision.js';
import type { Library } from '../types.js';

export interface PinRecipeOptions {
  /** The entry the recipe is for: it may not name itself. */
  entryId?: string;
  /** The file named in errors. */
  file?: string;
  /** The entry's metadata technique, for the technique-aware ATR default. @default undefined (not ATR) */
  technique?: string;
  /** The entry's resolution (stated or estimated), pinned into a resolution step. @default undefined */
  resolution?: Resolution;
}

/**
 * The subtraction step with each reference pinned; an entry named among the references is left out of its own
 * step (adding the water entry under a liquid-biofluid recipe), and a step left with no reference is dropped.
 */
function pinSubtract(
  recipe: Recipe,
  entryId: string | undefined,
  pin: <T extends { id: string; revision?: number | undefined }>(step: T, field: string) => T,
): { subtract?: NonNullable<Recipe['subtract']> } {
  if (recipe.subtract === undefined) return {};
  const others = recipe.subtract.references.filter((r) => r.id !== entryId);
  if (others.length === 0) return {};
  return {
    subtract: {
      ...recipe.subtract,
      references: others.map((r, k) => pin(r, `subtract.references.${k}`)),
    },
  };
}

export function pinRecipe(library: Library, recipe: Recipe, options: PinRecipeOptions = {}): Recipe {
  const pin = <T extends { id: string; revision?: number | undefined }>(step: T, field: string): T => {
    if (step.id === options.entryId) {
      throw new BandshelfError('BAD_RECIPE', `an entry cannot use itself as its ${field} spectrum`, {
        file: options.file,
        field: `${field}.id`,
      });
    }
    if (step.revision !== undefined) {
      const exists = library.db
        .prepare("SELECT 1 FROM revisions WHERE entry_id = ? AND revision = ? AND kind != 'retire'")
        .get(step.id, step.revision);
      if (exists === undefined) {
        throw new BandshelfError(
          'NOT_FOUND',
          `the ${field} spectrum '${step.id}' has no revision ${step.revision} with data`,
          { file: options.file, field: `${field}.revision` },
        );
      }
      return step;
    }
    const head = headRevision(library, step.id);
    if (head === undefined || head.kind === 'retire') {
      throw new BandshelfError(
        'NOT_FOUND',
        `the ${field} spectrum '${step.id}' is not in the library${head ? ' (it is retired)' : ''}; add it first`,
        { file: options.file, field: `${field}.id` },
      );
    }
    return { ...step, revision: head.revision };
  };
  const withAtr = pinAtr(recipe, options.technique === undefined ? {} : { technique: options.technique });
  const { subtract: _subtract, ...rest } = pinResolution(
    withAtr,
    options.resolution === undefined ? {} : { resolution: options.resolution },
  );
  return {
    ...rest,
    reference: recipe.reference === null ? null : pin(recipe.reference, 'reference'),
    emsc: recipe.emsc === null ? null : pin(recipe.emsc, 'emsc'),
    ...pinSubtract(recipe, options.entryId, pin),
  };
}

// The original spectra a recipe's reference subtraction or EMSC step needs, read from the library.

import type { Recipe } from '../../schema/recipe.js';
import type { Spectrum } from '../../spectrum/types.js';
import type { Library } from '../types.js';
import { readEntry } from './readEntry.js';

export interface RecipeReferencesOptions {
  /**
   * Read the referenced entries from this release instead of the working state.
   * @default undefined
   */
  at?: string;
}

/** By entry id; a step's pinned revision is read where the recipe pins one. */
export function recipeReferences(
  library: Library,
  recipe: Recipe,
  options: RecipeReferencesOptions = {},
): Map<string, Spectrum> {
  const map = new Map<string, Spectrum>();
  for (const step of [recipe.reference, recipe.emsc, ...(recipe.subtract?.references ?? [])]) {
    if (step === null || map.has(step.id)) continue;
    const view = readEntry(library, step.id, {
      ...(options.at === undefined ? {} : { at: options.at }),
      ...(step.revision === undefined ? {} : { revision: step.revision }),
    });
    map.set(step.id, view.original);
  }
  return map;
}

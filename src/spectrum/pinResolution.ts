// Pins a spectrum's own resolution into the recipe's resolution step, so the stored recipe alone fixes the vector.
import type { Recipe } from '../schema/recipe.js';
import type { Resolution } from './resolutionOf.js';

export interface PinResolutionOptions {
  /** The spectrum's resolution (see `resolutionOf`). @default undefined (left to processSpectrum's estimate) */
  resolution?: Resolution;
}

/**
 * The recipe with `resolution.own` and `resolution.estimated` set from `options.resolution` when the recipe has a
 * resolution step and no own value yet (a recipe that names one keeps it); any other recipe is returned as it is.
 */
export function pinResolution(recipe: Recipe, options: PinResolutionOptions = {}): Recipe {
  const step = recipe.resolution;
  const resolution = options.resolution;
  if (step === undefined || step === null || step.own !== undefined || resolution === undefined)
    return recipe;
  if (!(Number.isFinite(resolution.value) && resolution.value > 0)) return recipe;
  return { ...recipe, resolution: { ...step, own: resolution.value, estimated: resolution.estimated } };
}

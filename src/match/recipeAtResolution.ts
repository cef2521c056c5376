// A recipe whose resolution step brings a spectrum of known resolution to a coarser target (Gaussian line shape).
import type { Recipe } from '../schema/recipe.js';

/**
 * The recipe with its resolution step replaced by one that convolves a spectrum of resolution `own` (cm⁻¹) with a
 * Gaussian of FWHM √(target² − own²), so it reaches `target` (Gaussian widths add in quadrature, common practice).
 * Every other step is kept. The recipe given is not modified.
 */
export function recipeAtResolution(recipe: Recipe, resolution: { own: number; target: number }): Recipe {
  return {
    ...recipe,
    resolution: { target: resolution.target, lineShape: 'gaussian', own: resolution.own, estimated: false },
  };
}

// The technique-aware ATR default made explicit in a recipe, for an entry at ingest and for an unknown at match.
import type { Recipe } from '../schema/recipe.js';

export interface PinAtrOptions {
  /** The spectrum's technique (metadata `technique`, or the user's word for an unknown). @default undefined (not ATR) */
  technique?: string;
}

/**
 * The recipe's ATR step made explicit: 'auto' or absent → the diamond preset at 45° (sample index 1.5, equal to the
 * measured absorbance at 1000 cm⁻¹) for a spectrum measured by ATR, no step otherwise (the key left out, as in
 * recipes written before the step existed). An explicit step, or null (never correct), is kept as it is. The recipe
 * given is not modified.
 */
export function pinAtr(recipe: Recipe, options: PinAtrOptions = {}): Recipe {
  const { atr, ...rest } = recipe;
  if (atr === null || (atr !== undefined && atr !== 'auto')) return recipe;
  if (options.technique?.toLowerCase() !== 'atr') return rest;
  return {
    ...rest,
    atr: { crystal: 'diamond', sampleIndex: 1.5, angle: 45, referenceWavenumber: 1000 },
  };
}

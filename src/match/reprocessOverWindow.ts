// A library spectrum processed again over an unknown's narrower span, so the mixture fit compares like with like.
import type { Grid, Recipe, WavenumberWindow } from '../schema/recipe.js';
import { processSpectrum } from '../spectrum/processSpectrum.js';
import type { Spectrum } from '../spectrum/types.js';
import { spectrumExtent } from './spectrumExtent.js';

export interface ReprocessOverWindowOptions {
  /**
   * Original spectra of the library entries the recipe names (reference subtraction, EMSC), by entry id.
   * @default an empty map
   */
  references?: ReadonlyMap<string, Spectrum>;
  /**
   * How far (cm⁻¹) the reference may reach beyond the window before it is processed again; within it the
   * stored vector already saw the same span.
   * @default the grid step
   */
  tolerance?: number;
}

/**
 * The whole recipe of a library entry run again on its original spectrum with the crop narrowed to `window`
 * (the span the unknown's own processing saw). A rubberband or ALS baseline anchors on the ends and minima of
 * the span it is given, and vector normalisation sums over it: a reference processed over 4000–600 cm⁻¹ and an
 * unknown processed over 1750–1000 differ in shape, not only in scale, where a strong band straddles an end of
 * the short span. Processing the reference over the same span removes that difference; the non-negative fit's
 * weight takes up the scale.
 *
 * Returns null when there is nothing to redo: the reference (inside its own crop) reaches no more than
 * `tolerance` beyond the window on either side, or does not overlap it at all. Errors of the recipe steps
 * (too few points left) propagate as BandshelfError; callers then keep the stored vector.
 */
export function reprocessOverWindow(
  original: Spectrum,
  recipe: Recipe,
  grid: Grid,
  window: WavenumberWindow,
  options: ReprocessOverWindowOptions = {},
): Float64Array | null {
  const tolerance = options.tolerance ?? grid.step;
  const own = spectrumExtent(original, { crop: recipe.crop });
  if (own === null) return null;
  const lo = Math.max(own.min, Math.min(window.min, window.max));
  const hi = Math.min(own.max, Math.max(window.min, window.max));
  if (!(hi > lo)) return null;
  if (own.min >= lo - tolerance && own.max <= hi + tolerance) return null;
  const narrowed: Recipe = { ...recipe, crop: { min: lo, max: hi } };
  return processSpectrum(
    original,
    narrowed,
    grid,
    options.references ? { references: options.references } : {},
  ).processed;
}

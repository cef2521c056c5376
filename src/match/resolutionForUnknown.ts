// The recipe an unknown is processed with when the library matches resolutions: its own resolution pinned in.
import type { Recipe } from '../schema/recipe.js';
import { pinResolution } from '../spectrum/pinResolution.js';
import { resolutionOf } from '../spectrum/resolutionOf.js';
import type { Spectrum } from '../spectrum/types.js';

export interface ResolutionForUnknownOptions {
  /** The resolution the unknown's file states (JCAMP-DX `##RESOLUTION=`), cm⁻¹. @default undefined (estimated) */
  stated?: unknown;
}

export interface UnknownResolution {
  /** The recipe with the unknown's resolution pinned; the very same object when the recipe has no resolution step. */
  recipe: Recipe;
  /** A note when the unknown is coarser than the recipe's target (it is then kept as it is). */
  warnings: string[];
}

/**
 * The unknown gets the library entries' treatment: its stated resolution (else two point spacings, flagged as an
 * estimate) is pinned into the recipe's resolution step, so the pipeline degrades it to the common target exactly
 * as ingest does an entry. Browser-safe: the CLI's match and the site's dropped-file match both call it.
 */
export function resolutionForUnknown(
  spectrum: Spectrum,
  recipe: Recipe,
  options: ResolutionForUnknownOptions = {},
): UnknownResolution {
  const step = recipe.resolution;
  if (step === undefined || step === null) return { recipe, warnings: [] };
  const resolution = resolutionOf(spectrum, { stated: options.stated });
  const pinned = pinResolution(recipe, { resolution });
  const own = pinned.resolution?.own;
  const warnings =
    own !== undefined && own > step.target
      ? [
          `the unknown's resolution, ${own.toPrecision(3)} cm⁻¹${resolution.estimated ? ' (estimated from the point spacing)' : ''}, is coarser than the library's common ${step.target} cm⁻¹; it is compared as it is`,
        ]
      : [];
  return { recipe: pinned, warnings };
}

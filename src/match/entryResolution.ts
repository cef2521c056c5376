// An entry's own resolution, cm⁻¹, from what its revision recorded.
import { resolutionOf } from '../spectrum/resolutionOf.js';
import type { EntryOriginal } from './pipeline/types.js';

/**
 * The revision's recorded resolution (`extras.resolution`, stated or estimated), else the one its recipe's
 * resolution step was pinned with, else two point spacings of its original (resolutionOf's estimate). NaN when
 * none can be had (fewer than two distinct points).
 */
export function entryResolution(original: EntryOriginal): number {
  return original.resolution ?? original.recipe.resolution?.own ?? resolutionOf(original.original).value;
}

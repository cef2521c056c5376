// The peaks stored with a revision: band maxima of its processed grid vector. Searching the processed vector (not
// the raw file) puts every entry's heights on the same normalised scale and its positions on the same axis the
// matcher uses for unknowns; the parabolic fit gives sub-grid positions.
import type { Grid } from '../../schema/recipe.js';
import { findPeaks } from '../../spectrum/findPeaks.js';
import { gridAxis } from '../../spectrum/gridAxis.js';
import type { Peak } from '../../spectrum/types.js';

export interface ProcessedPeaksOptions {
  /** Smallest prominence as a fraction of the vector's finite range.
   * @default 0.01 */
  relativeProminence?: number;
}

export function processedPeaks(
  processed: Float64Array,
  grid: Grid,
  options: ProcessedPeaksOptions = {},
): Peak[] {
  return findPeaks(
    { wavenumber: gridAxis(grid), absorbance: processed },
    { relativeProminence: options.relativeProminence ?? 0.01 },
  );
}

// The grid points a query is scored over: covered by the query, inside the scoring ranges, outside exclusions.
import { BandshelfError } from '../error.js';
import type { Grid, WavenumberWindow } from '../schema/recipe.js';
import { gridAxis } from '../spectrum/gridAxis.js';
import { gridLength } from '../spectrum/gridLength.js';

export interface ScoringMaskOptions {
  /**
   * Windows to score over (inclusive, either order); empty means the whole grid.
   * @default []
   */
  ranges?: readonly WavenumberWindow[];
  /**
   * Windows that never take part in a score (inclusive), e.g. the recipe's atmospheric CO₂ window.
   * @default []
   */
  exclude?: readonly WavenumberWindow[];
}

/** Returns one byte per grid point: 1 where the query is finite, inside a range and outside every exclusion. */
export function scoringMask(
  query: ArrayLike<number>,
  grid: Grid,
  options: ScoringMaskOptions = {},
): Uint8Array {
  const n = gridLength(grid);
  if (query.length !== n) {
    throw new BandshelfError(
      'BAD_FORMAT',
      `the query has ${query.length} values but the library grid has ${n} points: process it onto the grid first`,
      { field: 'query' },
    );
  }
  const axis = gridAxis(grid);
  const ranges = (options.ranges ?? []).map((w) => [Math.min(w.min, w.max), Math.max(w.min, w.max)] as const);
  const exclude = (options.exclude ?? []).map(
    (w) => [Math.min(w.min, w.max), Math.max(w.min, w.max)] as const,
  );
  const mask = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(query[i]!)) continue;
    const w = axis[i]!;
    if (ranges.length > 0 && !ranges.some(([lo, hi]) => w >= lo && w <= hi)) continue;
    if (exclude.some(([lo, hi]) => w >= lo && w <= hi)) continue;
    mask[i] = 1;
  }
  return mask;
}

// The number of points on a library grid, counted from both ends inclusive.
import type { Grid } from '../schema/recipe.js';

export function gridLength(grid: Grid): number {
  return Math.round(Math.abs(grid.start - grid.stop) / grid.step) + 1;
}

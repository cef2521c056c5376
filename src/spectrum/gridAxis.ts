// The wavenumber axis of a library grid, ascending, so every processed vector indexes the same way.
import type { Grid } from '../schema/recipe.js';
import { gridLength } from './gridLength.js';

export function gridAxis(grid: Grid): Float64Array {
  const lo = Math.min(grid.start, grid.stop);
  const n = gridLength(grid);
  const axis = new Float64Array(n);
  // Multiply rather than accumulate so the last point is exact and not drifted by rounding.
  for (let i = 0; i < n; i++) axis[i] = lo + i * grid.step;
  return axis;
}

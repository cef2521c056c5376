// The grid axis, computed once per grid: commits and checks ask for it per revision.
import type { Grid } from '../../schema/recipe.js';
import { gridAxis } from '../../spectrum/gridAxis.js';

const memo = new Map<string, Float64Array>();

export function gridAxisMemo(grid: Grid): Float64Array {
  const key = `${grid.start}:${grid.stop}:${grid.step}`;
  let axis = memo.get(key);
  if (axis === undefined) {
    axis = gridAxis(grid);
    memo.set(key, axis);
  }
  return axis;
}

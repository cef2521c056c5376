// Last recipe step: scales a processed grid vector so spectra of different concentration or path compare.
import { BandshelfError } from '../error.js';
import type { Grid, NormaliseStep } from '../schema/recipe.js';
import { gridAxis } from './gridAxis.js';
import { gridLength } from './gridLength.js';

/**
 * Returns a new vector scaled by the recipe's normalisation; NaN (not covered) stays NaN and is left out of
 * every norm:
 * - `none`: an unchanged copy;
 * - `vector`: divided by the L2 norm of the finite values (unit length);
 * - `minmax`: (v − min) / (max − min) over the finite values, so they span 0 … 1;
 * - `area`: divided by |trapezoid area| over neighbouring finite grid points (grid step as width);
 * - `band`: divided by the largest finite value at grid points inside the step's window.
 * When the norm is zero, not finite or (for `band`) not positive, the vector is returned as an unchanged
 * copy: a flat or empty spectrum has no scale to remove, and dividing would only manufacture NaN or
 * Infinity that the matcher would then treat as data.
 */
export function normaliseVector(processed: Float64Array, step: NormaliseStep, grid: Grid): Float64Array {
  const n = processed.length;
  if (n !== gridLength(grid)) {
    throw new BandshelfError(
      'BAD_FORMAT',
      `the vector has ${n} values but the grid ${grid.start}:${grid.stop}:${grid.step} has ${gridLength(grid)}`,
    );
  }
  const out = processed.slice();
  switch (step.method) {
    case 'none':
      return out;
    case 'vector': {
      let sumSq = 0;
      for (let i = 0; i < n; i++) {
        const v = processed[i]!;
        if (Number.isFinite(v)) sumSq += v * v;
      }
      return scaled(out, Math.sqrt(sumSq), 0);
    }
    case 'minmax': {
      let min = Number.POSITIVE_INFINITY;
      let max = Number.NEGATIVE_INFINITY;
      for (let i = 0; i < n; i++) {
        const v = processed[i]!;
        if (!Number.isFinite(v)) continue;
        if (v < min) min = v;
        if (v > max) max = v;
      }
      return scaled(out, max - min, min);
    }
    case 'area': {
      let area = 0;
      for (let i = 1; i < n; i++) {
        const a = processed[i - 1]!;
        const b = processed[i]!;
        if (Number.isFinite(a) && Number.isFinite(b)) area += (a + b) / 2;
      }
      return scaled(out, Math.abs(area * grid.step), 0);
    }
    case 'band': {
      const axis = gridAxis(grid);
      const lo = Math.min(step.window.min, step.window.max);
      const hi = Math.max(step.window.min, step.window.max);
      let max = Number.NEGATIVE_INFINITY;
      for (let i = 0; i < n; i++) {
        const x = axis[i]!;
        const v = processed[i]!;
        if (x >= lo && x <= hi && Number.isFinite(v) && v > max) max = v;
      }
      return scaled(out, Math.max(max, 0), 0);
    }
  }
}

/** (v − offset) / norm in place on the copy; a norm of zero (or not finite) leaves the copy as it is. */
function scaled(out: Float64Array, norm: number, offset: number): Float64Array {
  if (!(norm > 0) || !Number.isFinite(norm)) return out;
  const n = out.length;
  for (let i = 0; i < n; i++) out[i] = (out[i]! - offset) / norm;
  return out;
}

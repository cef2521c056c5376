// Puts a spectrum onto the library grid by the mean of its piecewise-linear curve over each grid cell.

import type { Grid } from '../schema/recipe.js';
import { gridLength } from './gridLength.js';
import type { Spectrum } from './types.js';

export interface ResampleByAreaOptions {
  /**
   * Largest distance (cm⁻¹) between neighbouring source points across which a grid point may be filled;
   * a grid point strictly between neighbours further apart is left NaN.
   * @default 16
   */
  maxGap?: number;
}

/**
 * Each grid value is (1/|C|)∫_C y dν̃ over its cell C = [x − step/2, x + step/2] clipped to the source range,
 * with y the straight lines joining the source points. Because neighbouring cells tile the axis, the grid
 * vector's sum × step equals the source curve's area (trapezoid rule) at any source spacing, so a band keeps
 * its area, and its height no longer depends on whether the source was denser or sparser than the grid.
 * The source must be strictly ascending; grid points outside its range are NaN (never extrapolated).
 */
export function resampleByArea(
  spectrum: Spectrum,
  grid: Grid,
  options: ResampleByAreaOptions = {},
): Float64Array {
  const maxGap = options.maxGap ?? 16;
  const xs = spectrum.wavenumber;
  const ys = spectrum.absorbance;
  const m = xs.length;
  const n = gridLength(grid);
  const out = new Float64Array(n).fill(Number.NaN);
  if (m < 2) return out;
  const step = grid.step;
  const lo = Math.min(grid.start, grid.stop);
  const eps = 1e-6 * step;
  const first = xs[0]!;
  const last = xs[m - 1]!;
  let seg = 0; // segment [xs[seg], xs[seg + 1]] holding the current cell's lower edge
  for (let k = 0; k < n; k++) {
    const x = lo + k * step;
    if (x < first - eps) continue;
    if (x > last + eps) break;
    while (seg < m - 2 && xs[seg + 1]! <= x) seg++;
    if (xs[seg + 1]! - xs[seg]! > maxGap && x > xs[seg]! + eps && x < xs[seg + 1]! - eps) continue;
    const a = Math.max(x - step / 2, first);
    const b = Math.min(x + step / 2, last);
    let i = seg;
    while (i > 0 && xs[i]! > a) i--;
    let area = 0;
    for (; i < m - 1 && xs[i]! < b; i++) {
      const x0 = xs[i]!;
      const x1 = xs[i + 1]!;
      const u = Math.max(a, x0);
      const v = Math.min(b, x1);
      if (v <= u) continue;
      const slope = (ys[i + 1]! - ys[i]!) / (x1 - x0);
      const yu = ys[i]! + slope * (u - x0);
      const yv = ys[i]! + slope * (v - x0);
      area += 0.5 * (yu + yv) * (v - u);
    }
    out[k] =
      b > a
        ? area / (b - a)
        : ys[Math.min(seg + (x - xs[seg]! > 0.5 * (xs[seg + 1]! - xs[seg]!) ? 1 : 0), m - 1)]!;
  }
  return out;
}

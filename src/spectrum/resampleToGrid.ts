// Puts a spectrum onto the library grid: bin-average where the source is dense, interpolate where it is sparse.
import { BandshelfError } from '../error.js';
import type { Grid } from '../schema/recipe.js';
import { gridLength } from './gridLength.js';
import { resampleByArea } from './resampleByArea.js';
import type { Spectrum } from './types.js';

export interface ResampleToGridOptions {
  /**
   * Largest distance (cm⁻¹) between two neighbouring source points across which a grid point may still be
   * filled. A grid point between neighbours further apart is left NaN (not covered), so a scattered
   * tunable-laser spectrum never gains invented data in its holes. Keep it at least one grid step.
   * @default 16
   */
  maxGap?: number;
  /**
   * 'area': the cell mean of the source's piecewise-linear curve (resampleByArea; recipe version 2).
   * 'cell-or-interpolate': bin-average dense cells, interpolate sparse ones (recipe version 1).
   * @default 'cell-or-interpolate'
   */
  method?: 'area' | 'cell-or-interpolate';
}

/**
 * Returns gridLength(grid) values ascending in wavenumber (the gridAxis order). For each grid point x:
 * - NaN when x lies outside the source's wavenumber range (never extrapolated), or strictly between two
 *   neighbouring source points more than maxGap apart;
 * - the mean absorbance of the source points in its cell [x − step/2, x + step/2) when the cell holds two or
 *   more (the source is denser than the grid there, so averaging also lowers the noise). A point lying on a
 *   cell edge (within 1e-6 step) is shared by the two cells with weight ½ each: with the plain half-open
 *   cell, a source at exactly half the grid step (1 cm⁻¹ data on a 2 cm⁻¹ grid, very common) would average
 *   x − 1 and x in every cell and shift every band by a quarter step;
 * - otherwise the linear interpolation between the neighbouring source points (the source is sparser).
 * Deciding per cell handles spectra whose spacing changes along the axis. The source must be strictly
 * ascending (as sortAndMerge returns it). One forward pass over grid and source together.
 */
export function resampleToGrid(
  spectrum: Spectrum,
  grid: Grid,
  options: ResampleToGridOptions = {},
): Float64Array {
  const maxGap = options.maxGap ?? 16;
  if (!(maxGap > 0) || !Number.isFinite(maxGap)) {
    throw new BandshelfError(
      'BAD_RECIPE',
      `the maximum gap must be a positive number of cm⁻¹, not ${maxGap}`,
      {
        field: 'resample.maxGap',
      },
    );
  }
  const xs = spectrum.wavenumber;
  const ys = spectrum.absorbance;
  const m = xs.length;
  if (ys.length !== m) {
    throw new BandshelfError(
      'BAD_FORMAT',
      `wavenumber and absorbance differ in length (${m} and ${ys.length})`,
    );
  }
  for (let i = 1; i < m; i++) {
    if (!(xs[i]! > xs[i - 1]!)) {
      throw new BandshelfError(
        'NOT_MONOTONIC',
        `wavenumbers must be strictly ascending before resampling (point ${i + 1})`,
        {
          field: 'wavenumber',
        },
      );
    }
  }

  if (options.method === 'area') return resampleByArea(spectrum, grid, { maxGap });
  const n = gridLength(grid);
  const out = new Float64Array(n).fill(Number.NaN);
  if (m === 0) return out;
  const step = grid.step;
  const half = step / 2;
  const lo = Math.min(grid.start, grid.stop);
  // Grid and file axes are both computed in floating point; a grid point within this of the source's first or
  // last wavenumber counts as on it, so a spectrum recorded exactly over the grid's range covers its ends.
  const eps = 1e-6 * step;
  const first = xs[0]!;
  const last = xs[m - 1]!;

  let cell = 0; // first source index with xs ≥ current cell's lower edge
  let right = 0; // first source index with xs ≥ current grid point − eps
  for (let k = 0; k < n; k++) {
    const x = lo + k * step;
    if (x < first - eps) continue;
    if (x > last + eps) break;

    const cellLo = x - half;
    const cellHi = x + half;
    while (cell < m && xs[cell]! < cellLo - eps) cell++;
    let sum = 0;
    let weight = 0;
    let count = 0;
    for (let i = cell; i < m && xs[i]! < cellHi + eps; i++) {
      const xi = xs[i]!;
      const w = xi - cellLo <= eps || cellHi - xi <= eps ? 0.5 : 1;
      sum += w * ys[i]!;
      weight += w;
      count++;
    }

    while (right < m && xs[right]! < x - eps) right++;
    // right < m holds here because x ≤ last + eps.
    const xr = xs[right]!;
    if (Math.abs(xr - x) <= eps) {
      out[k] = count >= 2 ? sum / weight : ys[right]!;
      continue;
    }
    // right > 0 holds here because x ≥ first − eps and x is not within eps of xs[right].
    const left = right - 1;
    const xl = xs[left]!;
    if (xr - xl > maxGap) continue;
    if (count >= 2) {
      out[k] = sum / weight;
    } else {
      const yl = ys[left]!;
      out[k] = yl + ((ys[right]! - yl) * (x - xl)) / (xr - xl);
    }
  }
  return out;
}

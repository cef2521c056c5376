// Unexplained bands: residual maxima above k × the local noise over at least the instrument resolution.

import { findPeaks } from '../../spectrum/findPeaks.js';
import { savitzkyGolay } from '../../spectrum/savitzkyGolay.js';
import type { Spectrum } from '../../spectrum/types.js';
import type { ResidualBand } from '../types.js';
import { residualNoise } from './residualNoise.js';

export interface ResidualBandsOptions {
  /** Multiple of the local noise a band's height and prominence must exceed. @default 3 */
  k?: number;
  /** Instrument resolution, cm⁻¹: a band's FWHM must reach it (a one-point spike is not a band). @default 4 */
  resolution?: number;
  /** Half-width of the window the local noise is measured in around each band, cm⁻¹. @default 100 */
  noiseHalfWidth?: number;
  /** Savitzky–Golay window (points, quadratic) the residual is smoothed with before peaks are sought. @default 7 */
  smoothWindow?: number;
  /** A band this many points or fewer from the fit's edge (grid end, excluded window) is dropped. @default 4 */
  edgePoints?: number;
}

/**
 * `spectrum` is the residual on the grid (NaN outside the fit); `query` the unknown on the same grid, for each band's
 * share (residual height over the unknown's value there). Local noise: residualNoise over ±noiseHalfWidth, the band's
 * own ± 2 FWHM left out.
 */
export function residualBands(
  spectrum: Spectrum,
  query: ArrayLike<number>,
  options: ResidualBandsOptions = {},
): ResidualBand[] {
  const k = options.k ?? 3;
  const resolution = options.resolution ?? 4;
  const noiseHalfWidth = options.noiseHalfWidth ?? 100;
  const smoothWindow = options.smoothWindow ?? 7;
  const edgePoints = options.edgePoints ?? 4;
  // findPeaks reads widths and interpolated positions on an ascending axis; the library grid may run high to low.
  const descending = spectrum.wavenumber.length > 1 && spectrum.wavenumber[0]! > spectrum.wavenumber[1]!;
  const ascending = (v: ArrayLike<number>): Float64Array =>
    descending ? Float64Array.from(v).reverse() : Float64Array.from(v);
  const axis = ascending(spectrum.wavenumber);
  const residual = ascending(spectrum.absorbance);
  const unknown = ascending(query);
  const global = residualNoise(residual).sigma;
  if (!(global > 0)) return [];
  // Peaks are proposed against the noise of independent points (no correlation allowance): smooth misfit elsewhere
  // in the residual must not raise the bar a narrow band far from it has to clear. Each is then judged locally.
  const white = residualNoise(residual, { maxLag1: 0 }).sigma;
  const searched =
    smoothWindow >= 3 ? savitzkyGolay(residual, { window: smoothWindow, order: 2, derivative: 0 }) : residual;
  const step = axis.length > 1 ? Math.abs(axis[1]! - axis[0]!) : 1;
  const span = Math.max(3, Math.round(noiseHalfWidth / step));
  const bands: ResidualBand[] = [];
  for (const p of findPeaks(
    { wavenumber: axis, absorbance: searched },
    { minProminence: k * Math.min(global, white) * 0.5 },
  )) {
    const at = nearestIndex(axis, p.position);
    if (nearEdge(residual, at, edgePoints)) continue;
    if (!(p.fwhm >= resolution)) continue;
    // The band itself (± 2 FWHM) is left out of its noise window: its own slope would read as correlated noise.
    const window = Float64Array.from(
      residual.subarray(Math.max(0, at - span), Math.min(residual.length, at + span + 1)),
    );
    const own = Math.ceil((2 * p.fwhm) / step);
    const centre = at - Math.max(0, at - span);
    for (let d = -own; d <= own; d++)
      if (centre + d >= 0 && centre + d < window.length) window[centre + d] = Number.NaN;
    const local = residualNoise(window);
    // Never below the spectrum's white-noise level: a quiet stretch does not make a ripple a band.
    const sigma = Math.max(local.sigma > 0 ? local.sigma : global, white);
    if (!(p.height > k * sigma && p.prominence > k * sigma)) continue;
    const there = Math.abs(unknown[at]!);
    bands.push({
      position: p.position,
      height: p.height,
      prominence: p.prominence,
      fwhm: p.fwhm,
      width: p.fwhm,
      share: Number.isFinite(there) ? Math.min(1, p.height / Math.max(there, p.height)) : 1,
      localNoise: sigma,
    });
  }
  return bands;
}

function nearestIndex(axis: ArrayLike<number>, x: number): number {
  let best = 0;
  for (let i = 1; i < axis.length; i++) if (Math.abs(axis[i]! - x) < Math.abs(axis[best]! - x)) best = i;
  return best;
}

function nearEdge(residual: ArrayLike<number>, at: number, edge: number): boolean {
  for (let d = -edge; d <= edge; d++) {
    const i = at + d;
    if (i < 0 || i >= residual.length || !Number.isFinite(residual[i]!)) return true;
  }
  return false;
}

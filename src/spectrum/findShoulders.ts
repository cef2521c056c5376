// Bands hidden on the flank of a stronger one: minima of the negative Savitzky–Golay second derivative.
import { findPeaks } from './findPeaks.js';
import { peakProminenceThreshold } from './peakProminenceThreshold.js';
import { savitzkyGolay } from './savitzkyGolay.js';
import type { Peak, Spectrum } from './types.js';

/** FWHM of a Gaussian over the full width of its second derivative's trough at half depth (see below). */
const GAUSSIAN_FWHM_PER_HALF_DEPTH_WIDTH = 1.8812;

export interface FindShouldersOptions {
  /**
   * Savitzky–Golay window (points) for the second derivative; wide enough to tame noise, narrower than the
   * bands sought.
   * @default 9
   */
  window?: number;
  /**
   * Savitzky–Golay polynomial order for the second derivative.
   * @default 3
   */
  order?: number;
  /**
   * A second-derivative minimum within this distance (cm⁻¹) of a peak is that peak, not a shoulder.
   * @default 4
   */
  tolerance?: number;
  /**
   * The spectrum's peaks, when the caller has them already; otherwise findPeaks with its defaults.
   * @default findPeaks(spectrum)
   */
  peaks?: readonly Peak[];
  /**
   * Smallest estimated band amplitude (the shoulder's prominence, see below) to report.
   * @default peakProminenceThreshold(absorbance), the threshold findPeaks uses by default
   */
  minProminence?: number;
}

/**
 * Finds shoulders: local minima of the Savitzky–Golay second derivative that are negative (a band bends the
 * curve downwards at its centre even when it makes no maximum) and are not within `tolerance` of a peak.
 * Returned ordered by position as Peak objects:
 * - position: vertex of the parabola through the second-derivative minimum and its neighbours;
 * - height: the absorbance at that position, interpolated linearly;
 * - fwhm: estimated from the trough of the second derivative. For a Gaussian band of width σ the trough
 *   reaches half its depth at ±0.626σ, so FWHM (2.3548σ) ≈ 1.8812 × the trough's full width at half depth;
 *   the half depth is used rather than the zero crossings because next to a stronger band the second
 *   derivative often never returns to zero;
 * - prominence: the amplitude of a Gaussian with that width and curvature, A = −y''·σ² (a Gaussian's second
 *   derivative at its centre is −A/σ²).
 * Next to a stronger band, that band's positive curvature fills part of the trough, so width and amplitude
 * both come out low (a 0.35 shoulder 21 cm⁻¹ from a band of 1 reads about a quarter of its amplitude): treat
 * them as lower bounds; the position is the reliable figure. The axis spacing is taken as uniform (its mean
 * step), as the Savitzky–Golay derivative requires.
 */
export function findShoulders(spectrum: Spectrum, options: FindShouldersOptions = {}): Peak[] {
  const x = spectrum.wavenumber;
  const y = spectrum.absorbance;
  const n = Math.min(x.length, y.length);
  const window = options.window ?? 9;
  const tolerance = options.tolerance ?? 4;
  if (n < window || n < 3) return [];
  const delta = (x[n - 1]! - x[0]!) / (n - 1);
  const d2 = savitzkyGolay(y.subarray(0, n), { window, order: options.order ?? 3, derivative: 2, delta });
  const peaks = options.peaks ?? findPeaks(spectrum);
  const minProminence = options.minProminence ?? peakProminenceThreshold(y.subarray(0, n));

  const shoulders: Peak[] = [];
  for (let i = 1; i < n - 1; i++) {
    const v = d2[i]!;
    if (!(v < 0 && v < d2[i - 1]! && v <= d2[i + 1]!)) continue;
    // Vertex of the parabola through the three second-derivative values (positions on the real axis).
    const h0 = x[i - 1]! - x[i]!;
    const h2 = x[i + 1]! - x[i]!;
    const e0 = d2[i - 1]! - v;
    const e2 = d2[i + 1]! - v;
    const a = (e0 / h0 - e2 / h2) / (h0 - h2);
    const b = e0 / h0 - a * h0;
    const offset = a > 0 ? Math.min(h2, Math.max(h0, -b / (2 * a))) : 0;
    const position = x[i]! + offset;
    const depth = v + b * offset + a * offset * offset;
    if (peaks.some((p) => Math.abs(p.position - position) <= tolerance)) continue;

    const halfWidth = troughWidthAtHalfDepth(x, d2, i, depth / 2);
    if (!(halfWidth > 0)) continue;
    const fwhm = GAUSSIAN_FWHM_PER_HALF_DEPTH_WIDTH * halfWidth;
    const sigma = fwhm / 2.3548;
    const prominence = -depth * sigma * sigma;
    if (prominence < minProminence) continue;
    shoulders.push({ position, height: interpolate(x, y, n, i, position), prominence, fwhm });
  }
  return shoulders;
}

/** Full width where the second derivative climbs back above `level` (< 0) on each side of index i. */
function troughWidthAtHalfDepth(x: Float64Array, d2: Float64Array, i: number, level: number): number {
  const n = d2.length;
  let left = Number.NaN;
  for (let j = i - 1; j >= 0; j--) {
    const v = d2[j]!;
    if (!Number.isFinite(v)) break;
    if (v >= level) {
      const u = d2[j + 1]!;
      left = x[j]! + ((level - v) * (x[j + 1]! - x[j]!)) / (u - v);
      break;
    }
  }
  let right = Number.NaN;
  for (let j = i + 1; j < n; j++) {
    const v = d2[j]!;
    if (!Number.isFinite(v)) break;
    if (v >= level) {
      const u = d2[j - 1]!;
      right = x[j]! - ((level - v) * (x[j]! - x[j - 1]!)) / (u - v);
      break;
    }
  }
  return right - left;
}

/** Absorbance at `position`, which lies within one point of index i. */
function interpolate(x: Float64Array, y: Float64Array, n: number, i: number, position: number): number {
  const j = position >= x[i]! ? i : i - 1;
  if (j < 0 || j + 1 >= n) return y[i]!;
  const t = (position - x[j]!) / (x[j + 1]! - x[j]!);
  return y[j]! + t * (y[j + 1]! - y[j]!);
}

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
   * A second-derivative minimum within this distance (cm⁻¹) of a peak is that peak, not a shoulder (see also
   * `minSeparation`).
   * @default 4
   */
  tolerance?: number;
  /**
   * Smallest depth of the second-derivative minimum below zero, and smallest rise of the derivative on both
   * sides of it, in multiples of the noise standard deviation of the second derivative itself: noise alone puts
   * shallow minima all through the one broad trough of a wide band.
   * @default 5
   */
  minDepth?: number;
  /**
   * Smallest distance (cm⁻¹) between two shoulders, and between a shoulder and a peak; of minima closer than
   * this only the deepest is kept. The derivative window smears a minimum over its half width, so minima closer
   * than that are one feature seen through noise.
   * @default (window − 1) / 2 × the mean point spacing
   */
  minSeparation?: number;
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
 * curve downwards at its centre even when it makes no maximum) and pass four tests:
 * - deep: at least `minDepth` noise σ of the derivative below zero. Inside a broad band (the 3300 cm⁻¹ N–H/O–H
 *   envelope) the derivative's trough is shallow and noise puts many local minima into it;
 * - distinct: the derivative rises by at least `minDepth` σ on both sides before it falls below the minimum
 *   again, so a noise wiggle inside one trough (a deeper one, or a peak's) is not a band of its own;
 * - not a peak: farther from every peak than `tolerance`, `minSeparation` and a quarter of that peak's FWHM
 *   (noise moves the curvature minimum of a broad band around its flat bottom);
 * - apart: of shoulders closer than `minSeparation`, only the deepest is kept.
 * The noise σ of the derivative is estimated robustly from the derivative itself (derivativeNoise below). A
 * real shoulder merged into its neighbour's trough fails the distinct test: these rules err towards fewer,
 * surer shoulders.
 *
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
  const order = options.order ?? 3;
  const d2 = savitzkyGolay(y.subarray(0, n), { window, order, derivative: 2, delta });
  const peaks = options.peaks ?? findPeaks(spectrum);
  const minProminence = options.minProminence ?? peakProminenceThreshold(y.subarray(0, n));
  const minSeparation = options.minSeparation ?? ((window - 1) / 2) * Math.abs(delta);
  const maxDepth = -(options.minDepth ?? 5) * derivativeNoise(d2, window);

  const found: { peak: Peak; depth: number }[] = [];
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
    if (!(depth <= maxDepth) || !(troughProminence(d2, i) >= -maxDepth)) continue;

    const halfWidth = troughWidthAtHalfDepth(x, d2, i, depth / 2);
    if (!(halfWidth > 0)) continue;
    const fwhm = GAUSSIAN_FWHM_PER_HALF_DEPTH_WIDTH * halfWidth;
    if (
      peaks.some((p) => {
        const d = Math.abs(p.position - position);
        return d <= tolerance || d < minSeparation || d < (Number.isFinite(p.fwhm) ? p.fwhm / 4 : 0);
      })
    )
      continue;
    const sigma = fwhm / 2.3548;
    const prominence = -depth * sigma * sigma;
    if (prominence < minProminence) continue;
    found.push({ peak: { position, height: interpolate(x, y, n, i, position), prominence, fwhm }, depth });
  }
  const kept: Peak[] = [];
  for (const { peak } of found.sort((a, b) => a.depth - b.depth)) {
    if (kept.every((k) => Math.abs(k.position - peak.position) >= minSeparation)) kept.push(peak);
  }
  return kept.sort((a, b) => a.position - b.position);
}

/**
 * Robust σ of the noise in the second derivative: median |d2[i + lag] − d2[i]| / (0.6745·√2) with lag = the
 * window. The filter correlates noise over about one window, so values a window apart carry independent noise
 * (their difference has variance 2σ²). It is measured on the derivative itself because the usual estimate from
 * second differences of the data reads almost zero on a grid interpolated from coarser points (a µm-spaced file
 * at high wavenumber), where the derivative's noise is not small at all. Narrow bands change the derivative over
 * a window but cover a minority of the points; a broad band's trough changes slowly and barely counts.
 */
function derivativeNoise(d2: Float64Array, lag: number): number {
  const first = medianLagDifference(d2, lag, Number.POSITIVE_INFINITY) / (0.6745 * Math.SQRT2);
  // One pass without the pairs that touch a value beyond 4σ (the bands), which would otherwise inflate it.
  return first > 0 ? medianLagDifference(d2, lag, 4 * first) / (0.6745 * Math.SQRT2) : first;
}

/** Median of |d2[i + lag] − d2[i]| over the pairs whose both values are finite and below `clip` in size. */
function medianLagDifference(d2: Float64Array, lag: number, clip: number): number {
  const differences = new Float64Array(Math.max(0, d2.length - lag));
  let count = 0;
  for (let i = 0; i + lag < d2.length; i++) {
    const a = d2[i]!;
    const b = d2[i + lag]!;
    if (Number.isFinite(a) && Number.isFinite(b) && Math.abs(a) < clip && Math.abs(b) < clip) {
      differences[count++] = Math.abs(b - a);
    }
  }
  if (count === 0) return 0;
  return differences.subarray(0, count).sort()[count >> 1]!;
}

/**
 * How far the second derivative rises from its minimum at i, on the lower of the two sides, before it falls
 * below that minimum again (or the data or a not-covered point ends): a noise wiggle inside a deeper trough
 * rises little.
 */
function troughProminence(d2: Float64Array, i: number): number {
  const v = d2[i]!;
  let right = v;
  for (let j = i + 1; j < d2.length; j++) {
    const u = d2[j]!;
    if (!Number.isFinite(u) || u < v) break;
    if (u > right) right = u;
  }
  let left = v;
  for (let j = i - 1; j >= 0; j--) {
    const u = d2[j]!;
    if (!Number.isFinite(u) || u < v) break;
    if (u > left) left = u;
  }
  return Math.min(left, right) - v;
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

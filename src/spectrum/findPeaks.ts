// Band maxima of a spectrum: sub-point position and height, topographic prominence and width at half prominence.
import { type PeakProminenceThresholdOptions, peakProminenceThreshold } from './peakProminenceThreshold.js';
import type { Peak, Spectrum } from './types.js';

export interface FindPeaksOptions extends PeakProminenceThresholdOptions {
  /**
   * Smallest prominence (absorbance units) a maximum needs to count as a band.
   * @default peakProminenceThreshold(absorbance, options): 1 % of the range or 10 noise σ, whichever is larger
   */
  minProminence?: number;
  /**
   * Keep at most this many peaks, the most prominent ones.
   * @default Infinity
   */
  maxPeaks?: number;
}

/**
 * Finds local maxima of an ascending spectrum and returns them ordered by position.
 * - position and height: vertex of the parabola through the maximum and its two neighbours (any spacing);
 *   a flat top (several equal points) is placed at its middle with that height;
 * - prominence: height above the higher of the two lowest points reached walking left and right from the
 *   maximum until a higher point or the end of the data (the topographic definition);
 * - fwhm: distance between the points where the band falls to half its prominence, each crossing found by
 *   linear interpolation between neighbouring points.
 * NaN (not covered) ends a walk like the end of the data, so processed grid vectors can be searched too.
 */
export function findPeaks(spectrum: Spectrum, options: FindPeaksOptions = {}): Peak[] {
  const x = spectrum.wavenumber;
  const y = spectrum.absorbance;
  const n = Math.min(x.length, y.length);
  const maxPeaks = options.maxPeaks ?? Number.POSITIVE_INFINITY;
  const minProminence = options.minProminence ?? peakProminenceThreshold(y.subarray(0, n), options);

  const peaks: Peak[] = [];
  let i = 1;
  while (i < n - 1) {
    const yi = y[i]!;
    if (!(Number.isFinite(yi) && y[i - 1]! < yi)) {
      i++;
      continue;
    }
    let ahead = i + 1;
    while (ahead < n && y[ahead] === yi) ahead++;
    if (ahead >= n || !(y[ahead]! < yi)) {
      i = ahead;
      continue;
    }
    const peak = describePeak(x, y, n, i, ahead - 1);
    if (peak.prominence > 0 && peak.prominence >= minProminence) peaks.push(peak);
    i = ahead;
  }

  if (peaks.length > maxPeaks) {
    peaks.sort((a, b) => b.prominence - a.prominence || a.position - b.position);
    peaks.length = Math.max(0, Math.floor(maxPeaks));
    peaks.sort((a, b) => a.position - b.position);
  }
  return peaks;
}

/** Position, height, prominence and FWHM of the maximum whose top spans indices first … last. */
function describePeak(x: Float64Array, y: Float64Array, n: number, first: number, last: number): Peak {
  const top = y[first]!;
  let position: number;
  let height: number;
  if (first === last) {
    const h0 = x[first - 1]! - x[first]!;
    const h2 = x[first + 1]! - x[first]!;
    const d0 = y[first - 1]! - top;
    const d2 = y[first + 1]! - top;
    // p(x) = top + b·u + a·u², u = x − x[first], through both neighbours; a < 0 at a strict maximum.
    const a = (d0 / h0 - d2 / h2) / (h0 - h2);
    const b = d0 / h0 - a * h0;
    const offset = Math.min(h2, Math.max(h0, -b / (2 * a)));
    position = x[first]! + offset;
    height = top + b * offset + a * offset * offset;
  } else {
    position = (x[first]! + x[last]!) / 2;
    height = top;
  }

  // Walk outwards until a higher point, NaN or the end; remember where each side's minimum is.
  let leftMin = top;
  let leftMinAt = first;
  for (let j = first - 1; j >= 0; j--) {
    const v = y[j]!;
    if (!Number.isFinite(v) || v > top) break;
    if (v < leftMin) {
      leftMin = v;
      leftMinAt = j;
    }
  }
  let rightMin = top;
  let rightMinAt = last;
  for (let j = last + 1; j < n; j++) {
    const v = y[j]!;
    if (!Number.isFinite(v) || v > top) break;
    if (v < rightMin) {
      rightMin = v;
      rightMinAt = j;
    }
  }
  const base = Math.max(leftMin, rightMin);
  const prominence = height - base;
  const level = height - prominence / 2;

  // Half-prominence crossings; the band's own top (the parabola vertex) bounds the first interval.
  let left = position;
  let upperX = position;
  let upperY = height;
  for (let j = position < x[first]! ? first - 1 : first; j >= leftMinAt; j--) {
    const v = y[j]!;
    if (v <= level) {
      left = x[j]! + ((level - v) * (upperX - x[j]!)) / (upperY - v);
      break;
    }
    upperX = x[j]!;
    upperY = v;
  }
  let right = position;
  upperX = position;
  upperY = height;
  for (let j = position > x[last]! ? last + 1 : last; j <= rightMinAt; j++) {
    const v = y[j]!;
    if (v <= level) {
      right = x[j]! - ((level - v) * (x[j]! - upperX)) / (upperY - v);
      break;
    }
    upperX = x[j]!;
    upperY = v;
  }
  return { position, height, prominence, fwhm: right - left };
}

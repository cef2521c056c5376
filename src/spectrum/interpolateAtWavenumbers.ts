// Reads a spectrum at other wavenumbers by linear interpolation, never beyond its coverage or across gaps.
import type { Spectrum } from './types.js';

export interface InterpolateAtWavenumbersOptions {
  /**
   * Source points further apart than this (cm⁻¹) are not bridged: wavenumbers between them get NaN.
   * @default Infinity
   */
  maxGap?: number;
}

/**
 * The spectrum's absorbance at each of `wavenumbers` (ascending), NaN outside [first, last] wavenumber of the
 * spectrum or inside a gap wider than `maxGap`. One merged pass over both ascending axes.
 */
export function interpolateAtWavenumbers(
  spectrum: Spectrum,
  wavenumbers: Float64Array,
  options: InterpolateAtWavenumbersOptions = {},
): Float64Array {
  const maxGap = options.maxGap ?? Number.POSITIVE_INFINITY;
  const sx = spectrum.wavenumber;
  const sy = spectrum.absorbance;
  const m = sx.length;
  const out = new Float64Array(wavenumbers.length).fill(Number.NaN);
  if (m === 0) return out;
  let j = 0;
  for (let i = 0; i < wavenumbers.length; i++) {
    const x = wavenumbers[i]!;
    if (x < sx[0]! || x > sx[m - 1]!) continue;
    while (j + 1 < m && sx[j + 1]! < x) j++;
    if (sx[j] === x || m === 1) {
      out[i] = sy[j]!;
      continue;
    }
    const x0 = sx[j]!;
    const x1 = sx[j + 1]!;
    if (x1 === x) {
      out[i] = sy[j + 1]!;
      continue;
    }
    if (x1 - x0 > maxGap) continue;
    out[i] = sy[j]! + ((sy[j + 1]! - sy[j]!) * (x - x0)) / (x1 - x0);
  }
  return out;
}

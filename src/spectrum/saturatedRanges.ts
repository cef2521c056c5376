// Wavenumber ranges (cm⁻¹) covered by runs of saturated points, for marking grid cells as not covered.
import type { Spectrum } from './types.js';

export interface SaturatedRangesOptions {
  /** 1 per saturated point, same index as spectrum.wavenumber. @default undefined (none saturated) */
  saturated?: Uint8Array;
}

/**
 * Each run reaches halfway to its unsaturated neighbours, so a grid cell nearer a saturated point than a good one
 * is not covered. Returns [min, max] pairs in ascending order of the input's points.
 */
export function saturatedRanges(
  spectrum: Spectrum,
  options: SaturatedRangesOptions = {},
): [number, number][] {
  const { saturated } = options;
  const w = spectrum.wavenumber;
  const out: [number, number][] = [];
  if (!saturated) return out;
  let start = -1;
  for (let i = 0; i <= w.length; i++) {
    const hit = i < w.length && saturated[i] === 1;
    if (hit && start < 0) start = i;
    if (!hit && start >= 0) {
      const a = start > 0 ? (w[start - 1]! + w[start]!) / 2 : w[start]!;
      const b = i < w.length ? (w[i - 1]! + w[i]!) / 2 : w[i - 1]!;
      out.push([Math.min(a, b), Math.max(a, b)]);
      start = -1;
    }
  }
  return out;
}

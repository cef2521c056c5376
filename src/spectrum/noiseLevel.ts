// Noise of a spectrum: RMS of what is left after a straight-line fit inside a band-free window.
import type { WavenumberWindow } from '../schema/recipe.js';
import type { Spectrum } from './types.js';

export interface NoiseLevelOptions {
  /**
   * Fewest finite points the window must hold for an estimate; below it the result is NaN.
   * @default 5
   */
  minPoints?: number;
}

/**
 * RMS (√ mean of squares) of the residuals after a linear least-squares fit of absorbance against
 * wavenumber over the points with min ≤ wavenumber ≤ max. The detrend keeps a sloping baseline from counting
 * as noise. The default window 1900–2000 cm⁻¹ is free of bands in biological samples (common practice).
 * Non-finite points are skipped; a spectrum that does not reach the window (a tunable-laser spectrum over
 * 1750–1000 cm⁻¹, say) gives NaN, which callers report as "no noise estimate" rather than as zero noise.
 */
export function noiseLevel(
  spectrum: Spectrum,
  window: WavenumberWindow = { min: 1900, max: 2000 },
  options: NoiseLevelOptions = {},
): number {
  const minPoints = Math.max(3, options.minPoints ?? 5);
  const x = spectrum.wavenumber;
  const y = spectrum.absorbance;
  const n = Math.min(x.length, y.length);
  const lo = Math.min(window.min, window.max);
  const hi = Math.max(window.min, window.max);
  // Centre the axis on the window so the fit does not lose digits to wavenumbers in the thousands.
  const mid = (lo + hi) / 2;
  let count = 0;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    const xi = x[i]!;
    const yi = y[i]!;
    if (xi < lo || xi > hi || !Number.isFinite(yi)) continue;
    count++;
    sx += xi - mid;
    sy += yi;
  }
  if (count < minPoints) return Number.NaN;
  const mx = sx / count;
  const my = sy / count;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    const xi = x[i]!;
    const yi = y[i]!;
    if (xi < lo || xi > hi || !Number.isFinite(yi)) continue;
    const dx = xi - mid - mx;
    sxx += dx * dx;
    sxy += dx * (yi - my);
  }
  const slope = sxx > 0 ? sxy / sxx : 0;
  let ss = 0;
  for (let i = 0; i < n; i++) {
    const xi = x[i]!;
    const yi = y[i]!;
    if (xi < lo || xi > hi || !Number.isFinite(yi)) continue;
    const r = yi - my - slope * (xi - mid - mx);
    ss += r * r;
  }
  return Math.sqrt(ss / count);
}

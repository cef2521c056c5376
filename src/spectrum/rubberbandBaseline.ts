// The rubberband baseline: the lower convex hull of the spectrum, stretched under it like a band.
import { BandshelfError } from '../error.js';
import type { Spectrum } from './types.js';

export interface RubberbandBaselineOptions {
  /**
   * The file the spectrum came from, for error messages.
   * @default undefined
   */
  file?: string;
}

/**
 * The lower convex hull of (wavenumber, absorbance) by Andrew's monotone chain, linearly interpolated onto
 * every wavenumber. The hull always passes through both end points and never rises above the spectrum, so the
 * corrected spectrum is ≥ 0 everywhere. Needs ≥ 2 points with strictly ascending wavenumbers (sortAndMerge).
 */
export function rubberbandBaseline(
  spectrum: Spectrum,
  options: RubberbandBaselineOptions = {},
): Float64Array {
  const x = spectrum.wavenumber;
  const y = spectrum.absorbance;
  const n = x.length;
  checkSpectrum(spectrum, options.file);
  const hull = new Int32Array(n);
  let top = 0;
  for (let i = 0; i < n; i++) {
    // Pop while the last two hull points and point i do not turn counter-clockwise (collinear points go too).
    while (top >= 2) {
      const o = hull[top - 2]!;
      const a = hull[top - 1]!;
      const cross = (x[a]! - x[o]!) * (y[i]! - y[o]!) - (y[a]! - y[o]!) * (x[i]! - x[o]!);
      if (cross > 0) break;
      top--;
    }
    hull[top++] = i;
  }
  const baseline = new Float64Array(n);
  for (let k = 0; k + 1 < top; k++) {
    const i0 = hull[k]!;
    const i1 = hull[k + 1]!;
    const slope = (y[i1]! - y[i0]!) / (x[i1]! - x[i0]!);
    for (let i = i0; i < i1; i++) baseline[i] = y[i0]! + slope * (x[i]! - x[i0]!);
  }
  baseline[n - 1] = y[n - 1]!;
  return baseline;
}

function checkSpectrum(spectrum: Spectrum, file: string | undefined): void {
  const { wavenumber: x, absorbance: y } = spectrum;
  if (x.length !== y.length) {
    throw new BandshelfError('BAD_FORMAT', `${x.length} wavenumbers but ${y.length} absorbances`, { file });
  }
  if (x.length < 2)
    throw new BandshelfError('TOO_FEW_POINTS', 'a baseline needs at least 2 points', { file });
  for (let i = 0; i < x.length; i++) {
    if (!Number.isFinite(x[i]!) || !Number.isFinite(y[i]!)) {
      throw new BandshelfError('NOT_FINITE', `point ${i + 1} is not a finite number`, { file });
    }
    if (i > 0 && !(x[i]! > x[i - 1]!)) {
      throw new BandshelfError('NOT_MONOTONIC', `wavenumbers must ascend strictly (point ${i + 1})`, {
        file,
      });
    }
  }
}

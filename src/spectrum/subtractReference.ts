// Subtracts a water or buffer spectrum scaled to fit a window: the usual flattening of biofluid spectra.
import { BandshelfError } from '../error.js';
import type { WavenumberWindow } from '../schema/recipe.js';
import { interpolateAtWavenumbers } from './interpolateAtWavenumbers.js';
import type { Spectrum } from './types.js';

export interface SubtractReferenceOptions {
  /**
   * Fit `spectrum ≈ scale·reference + offset` rather than `scale·reference`, so a residual baseline offset in
   * the window does not bias the scale. The offset is only part of the fit; it is not subtracted (baselines
   * are the baseline step's job).
   * @default true
   */
  fitOffset?: boolean;
  /**
   * Fewest spectrum points inside the window (and inside the reference's coverage) for a fit.
   * @default 5
   */
  minPoints?: number;
  /**
   * Reference points further apart than this (cm⁻¹) are not interpolated across.
   * @default 16
   */
  maxGap?: number;
  /**
   * The file the spectrum came from, for error messages.
   * @default undefined
   */
  file?: string;
}

export interface SubtractReferenceResult {
  /** The spectrum minus scale × reference, only at wavenumbers the reference covers. */
  spectrum: Spectrum;
  scale: number;
  /** The fitted offset (0 when `fitOffset` is false); reported, not subtracted. */
  offset: number;
  /** Points used in the fit. */
  points: number;
}

/**
 * Interpolates the reference onto the spectrum's wavenumbers, fits the scale by least squares over the points
 * inside `window`, and subtracts scale × reference. Points the reference does not cover are dropped from the
 * result rather than left uncorrected, so the processed vector marks them not covered instead of mixing
 * corrected and raw data. Too few points in the window, or a reference flat inside it, → BAD_RECIPE.
 */
export function subtractReference(
  spectrum: Spectrum,
  reference: Spectrum,
  window: WavenumberWindow,
  options: SubtractReferenceOptions = {},
): SubtractReferenceResult {
  const fitOffset = options.fitOffset ?? true;
  const minPoints = Math.max(options.minPoints ?? 5, fitOffset ? 3 : 2);
  const file = options.file;
  const x = spectrum.wavenumber;
  const y = spectrum.absorbance;
  const r = interpolateAtWavenumbers(reference, x, { maxGap: options.maxGap ?? 16 });
  const lo = Math.min(window.min, window.max);
  const hi = Math.max(window.min, window.max);
  let count = 0;
  let sr = 0;
  let sy = 0;
  for (let i = 0; i < x.length; i++) {
    if (x[i]! < lo || x[i]! > hi || Number.isNaN(r[i]!)) continue;
    count++;
    sr += r[i]!;
    sy += y[i]!;
  }
  const windowText = `${lo}–${hi} cm⁻¹`;
  if (count < minPoints) {
    throw new BandshelfError(
      'BAD_RECIPE',
      `only ${count} point(s) inside the reference window ${windowText} where the reference also covers; need ${minPoints}`,
      { file, field: 'reference.window' },
    );
  }
  // Centre on the window means when an offset is fitted: the slope of the centred regression is the scale.
  const mr = fitOffset ? sr / count : 0;
  const my = fitOffset ? sy / count : 0;
  let srr = 0;
  let sry = 0;
  let syy = 0;
  for (let i = 0; i < x.length; i++) {
    if (x[i]! < lo || x[i]! > hi || Number.isNaN(r[i]!)) continue;
    const dr = r[i]! - mr;
    const dy = y[i]! - my;
    srr += dr * dr;
    sry += dr * dy;
    syy += dy * dy;
  }
  if (!(srr > 1e-24 * Math.max(1, syy)) || !Number.isFinite(srr)) {
    throw new BandshelfError('BAD_RECIPE', `the reference has no signal to fit inside ${windowText}`, {
      file,
      field: 'reference.window',
    });
  }
  const scale = sry / srr;
  const offset = fitOffset ? my - scale * mr : 0;
  let kept = 0;
  for (let i = 0; i < x.length; i++) if (!Number.isNaN(r[i]!)) kept++;
  const wavenumber = new Float64Array(kept);
  const absorbance = new Float64Array(kept);
  for (let i = 0, k = 0; i < x.length; i++) {
    if (Number.isNaN(r[i]!)) continue;
    wavenumber[k] = x[i]!;
    absorbance[k] = y[i]! - scale * r[i]!;
    k++;
  }
  return { spectrum: { wavenumber, absorbance }, scale, offset, points: count };
}

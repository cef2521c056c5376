// Fits several reference spectra (liquid water, water vapour, buffer) at once, with an offset and a slope, and
// subtracts the scaled references: the water handling of liquid biofluid spectra.
import { BandshelfError } from '../error.js';
import type { WavenumberWindow } from '../schema/recipe.js';
import { interpolateAtWavenumbers } from './interpolateAtWavenumbers.js';
import type { Spectrum } from './types.js';

export interface FitReferencesOptions {
  /** Fewest usable points inside the windows, beyond the fitted terms. @default 5 */
  minPoints?: number;
  /** Reference points further apart than this (cm⁻¹) are not interpolated across. @default 16 */
  maxGap?: number;
  /** The file the spectrum came from, for error messages. @default undefined */
  file?: string;
}

export interface FitReferencesResult {
  /** The spectrum minus Σ scale·reference, only where every reference covers. */
  spectrum: Spectrum;
  /** One scale per reference, in the order given. */
  scales: number[];
  /** Standard error of each scale: √(σ̂² (XᵀX)⁻¹ⱼⱼ), σ̂² = RSS/(n − p). */
  standardErrors: number[];
  /** Fitted offset and slope (absorbance per cm⁻¹); part of the fit only, not subtracted. */
  offset: number;
  slope: number;
  /** Points inside the windows used in the fit. */
  points: number;
}

/**
 * Ordinary least squares of `spectrum ≈ Σ sⱼ·referenceⱼ + a + b·(ν̃ − ν̃̄)` over the points inside `windows`, then
 * subtraction of Σ sⱼ·referenceⱼ everywhere the references cover (points they do not cover are dropped). The slope
 * term keeps a tilted baseline from biasing the scales. The standard errors assume independent residuals of equal
 * variance (Gauss–Markov); neighbouring points of a real spectrum are correlated, so they are lower bounds.
 * Too few points, or references indistinguishable from each other or from a line inside the windows → BAD_RECIPE.
 */
export function fitReferences(
  spectrum: Spectrum,
  references: readonly Spectrum[],
  windows: readonly WavenumberWindow[],
  options: FitReferencesOptions = {},
): FitReferencesResult {
  const x = spectrum.wavenumber;
  const y = spectrum.absorbance;
  const maxGap = options.maxGap ?? 16;
  const r = references.map((ref) => interpolateAtWavenumbers(ref, x, { maxGap }));
  const covered = (i: number) => r.every((ri) => !Number.isNaN(ri[i]!));
  const inside = (v: number) =>
    windows.some((w) => v >= Math.min(w.min, w.max) && v <= Math.max(w.min, w.max));
  const rows: number[] = [];
  for (let i = 0; i < x.length; i++) if (inside(x[i]!) && covered(i) && Number.isFinite(y[i]!)) rows.push(i);
  const p = references.length + 2;
  const field = 'subtract.windows';
  if (rows.length < p + (options.minPoints ?? 5)) {
    throw new BandshelfError(
      'BAD_RECIPE',
      `only ${rows.length} point(s) inside the subtraction windows where every reference covers; need ${p + (options.minPoints ?? 5)}`,
      { file: options.file, field },
    );
  }
  let centre = 0;
  for (const i of rows) centre += x[i]!;
  centre /= rows.length;
  // Column k of the design at row i: the references, then 1, then the centred wavenumber.
  const column = (k: number, i: number) =>
    k < references.length ? r[k]![i]! : k === references.length ? 1 : x[i]! - centre;
  const xtx = new Float64Array(p * p);
  const xty = new Float64Array(p);
  for (const i of rows) {
    for (let a = 0; a < p; a++) {
      const ca = column(a, i);
      xty[a]! += ca * y[i]!;
      for (let b = 0; b <= a; b++) xtx[a * p + b]! += ca * column(b, i);
    }
  }
  for (let a = 0; a < p; a++) for (let b = a + 1; b < p; b++) xtx[a * p + b] = xtx[b * p + a]!;
  const inverse = invertSymmetric(xtx, p);
  if (inverse === undefined) {
    throw new BandshelfError(
      'BAD_RECIPE',
      'the references cannot be told apart from each other or from an offset and slope inside the subtraction windows',
      { file: options.file, field },
    );
  }
  const beta = new Float64Array(p);
  for (let a = 0; a < p; a++) for (let b = 0; b < p; b++) beta[a]! += inverse[a * p + b]! * xty[b]!;
  let rss = 0;
  for (const i of rows) {
    let fit = 0;
    for (let k = 0; k < p; k++) fit += beta[k]! * column(k, i);
    rss += (y[i]! - fit) ** 2;
  }
  const variance = rss / (rows.length - p);
  const scales = references.map((_, k) => beta[k]!);
  const standardErrors = references.map((_, k) => Math.sqrt(variance * inverse[k * p + k]!));
  const keep: number[] = [];
  for (let i = 0; i < x.length; i++) if (covered(i)) keep.push(i);
  const wavenumber = Float64Array.from(keep, (i) => x[i]!);
  const absorbance = Float64Array.from(keep, (i) => {
    let v = y[i]!;
    for (let k = 0; k < references.length; k++) v -= scales[k]! * r[k]![i]!;
    return v;
  });
  return {
    spectrum: { wavenumber, absorbance },
    scales,
    standardErrors,
    offset: beta[references.length]!,
    slope: beta[references.length + 1]!,
    points: rows.length,
  };
}

/** Gauss–Jordan inverse with partial pivoting of a small p × p matrix; undefined when (near) singular. */
function invertSymmetric(matrix: Float64Array, p: number): Float64Array | undefined {
  const a = matrix.slice();
  const inv = new Float64Array(p * p);
  for (let k = 0; k < p; k++) inv[k * p + k] = 1;
  const scale = Math.max(...Array.from({ length: p }, (_, k) => Math.abs(a[k * p + k]!)));
  for (let c = 0; c < p; c++) {
    let pivot = c;
    for (let rIdx = c + 1; rIdx < p; rIdx++)
      if (Math.abs(a[rIdx * p + c]!) > Math.abs(a[pivot * p + c]!)) pivot = rIdx;
    if (!(Math.abs(a[pivot * p + c]!) > 1e-12 * scale)) return undefined;
    for (let k = 0; k < p; k++) {
      [a[c * p + k], a[pivot * p + k]] = [a[pivot * p + k]!, a[c * p + k]!];
      [inv[c * p + k], inv[pivot * p + k]] = [inv[pivot * p + k]!, inv[c * p + k]!];
    }
    const d = a[c * p + c]!;
    for (let k = 0; k < p; k++) {
      a[c * p + k]! /= d;
      inv[c * p + k]! /= d;
    }
    for (let rIdx = 0; rIdx < p; rIdx++) {
      if (rIdx === c) continue;
      const f = a[rIdx * p + c]!;
      if (f === 0) continue;
      for (let k = 0; k < p; k++) {
        a[rIdx * p + k]! -= f * a[c * p + k]!;
        inv[rIdx * p + k]! -= f * inv[c * p + k]!;
      }
    }
  }
  return inv;
}

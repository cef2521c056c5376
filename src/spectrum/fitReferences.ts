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
  /**
   * Subtract a reference only when its scale is at least this many standard errors above 0 (a one-sided z-test
   * that the sample holds some of it); the weakest failing reference is taken out and the rest refitted.
   * @default undefined (every reference subtracted at its fitted scale, whatever its sign)
   */
  minZ?: number;
}

export interface FitReferencesResult {
  /** The spectrum minus Σ scale·reference, only where every reference covers. */
  spectrum: Spectrum;
  /** One scale per reference, in the order given; 0 for a reference `minZ` took out (not subtracted). */
  scales: number[];
  /**
   * Standard error of each scale: √(σ̂² (XᵀX)⁻¹ⱼⱼ), σ̂² = RSS/(n − p); for a reference taken out, that of the fit
   * in which it failed the test.
   */
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
  const solve = (active: readonly number[]) => {
    const q = active.length + 2;
    // Column k of the design at row i: the active references, then 1, then the centred wavenumber.
    const column = (k: number, i: number) =>
      k < active.length ? r[active[k]!]![i]! : k === active.length ? 1 : x[i]! - centre;
    const xtx = new Float64Array(q * q);
    const xty = new Float64Array(q);
    for (const i of rows) {
      for (let a = 0; a < q; a++) {
        const ca = column(a, i);
        xty[a]! += ca * y[i]!;
        for (let b = 0; b <= a; b++) xtx[a * q + b]! += ca * column(b, i);
      }
    }
    for (let a = 0; a < q; a++) for (let b = a + 1; b < q; b++) xtx[a * q + b] = xtx[b * q + a]!;
    const inverse = invertSymmetric(xtx, q);
    if (inverse === undefined) {
      throw new BandshelfError(
        'BAD_RECIPE',
        'the references cannot be told apart from each other or from an offset and slope inside the subtraction windows',
        { file: options.file, field },
      );
    }
    const beta = new Float64Array(q);
    for (let a = 0; a < q; a++) for (let b = 0; b < q; b++) beta[a]! += inverse[a * q + b]! * xty[b]!;
    let rss = 0;
    for (const i of rows) {
      let fit = 0;
      for (let k = 0; k < q; k++) fit += beta[k]! * column(k, i);
      rss += (y[i]! - fit) ** 2;
    }
    const variance = rss / (rows.length - q);
    return {
      beta,
      errors: active.map((_, k) => Math.sqrt(variance * inverse[k * q + k]!)),
    };
  };
  let active = references.map((_, k) => k);
  let fit = solve(active);
  const scales = references.map(() => 0);
  const standardErrors = references.map(() => Number.NaN);
  const minZ = options.minZ;
  // One-sided z-tests, weakest first: a reference whose scale is not minZ standard errors above 0 is taken out and
  // the rest refitted, until every one left passes.
  while (minZ !== undefined && active.length > 0) {
    let worst = 0;
    for (let j = 1; j < active.length; j++)
      if (fit.beta[j]! / fit.errors[j]! < fit.beta[worst]! / fit.errors[worst]!) worst = j;
    if (fit.beta[worst]! / fit.errors[worst]! >= minZ) break;
    standardErrors[active[worst]!] = fit.errors[worst]!;
    active = active.filter((_, j) => j !== worst);
    fit = solve(active);
  }
  active.forEach((k, j) => {
    scales[k] = fit.beta[j]!;
    standardErrors[k] = fit.errors[j]!;
  });
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
    offset: fit.beta[active.length]!,
    slope: fit.beta[active.length + 1]!,
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

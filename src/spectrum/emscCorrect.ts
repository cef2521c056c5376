// Extended multiplicative scatter correction against a reference (Martens & Stark 1991; Kohler et al. 2005).
import { BandshelfError } from '../error.js';
import { interpolateAtWavenumbers } from './interpolateAtWavenumbers.js';
import { solveLeastSquares } from './solveLeastSquares.js';
import type { Spectrum } from './types.js';

export interface EmscCorrectOptions {
  /**
   * Degree of the Legendre polynomial scatter terms (0 is plain multiplicative scatter correction).
   * @default 2
   */
  degree?: number;
  /**
   * A multiplicative term b below this is refused: dividing by it would amplify noise without bound, and b ≤
   * 0 would flip the spectrum.
   * @default 1e-3
   */
  minMultiplicative?: number;
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

export interface EmscCorrectResult {
  /** The corrected spectrum, only at wavenumbers the reference covers. */
  spectrum: Spectrum;
  /** [a, b, d₁ … d_degree]: offset, multiplicative term, Legendre coefficients. */
  coefficients: number[];
}

/**
 * Fits s = a + b·ref + Σₖ dₖ·Pₖ(x̃) by least squares, where Pₖ are Legendre polynomials of the wavenumber
 * scaled to x̃ ∈ [−1, 1] over the fitted points, and returns (s − a − Σ dₖ Pₖ) / b. Points outside the
 * reference's coverage are dropped. A rank-deficient model (the reference itself a low polynomial) or b <
 * minMultiplicative → BAD_RECIPE.
 */
export function emscCorrect(
  spectrum: Spectrum,
  reference: Spectrum,
  options: EmscCorrectOptions = {},
): EmscCorrectResult {
  const degree = options.degree ?? 2;
  const minB = options.minMultiplicative ?? 1e-3;
  const file = options.file;
  if (!Number.isInteger(degree) || degree < 0) {
    throw new BandshelfError('BAD_RECIPE', `the EMSC degree must be a whole number ≥ 0 (got ${degree})`, {
      file,
      field: 'emsc.degree',
    });
  }
  const ref = interpolateAtWavenumbers(reference, spectrum.wavenumber, { maxGap: options.maxGap ?? 16 });
  let m = 0;
  for (let i = 0; i < ref.length; i++) if (!Number.isNaN(ref[i]!)) m++;
  const k = degree + 2;
  if (m < k + 1) {
    throw new BandshelfError(
      'BAD_RECIPE',
      `EMSC of degree ${degree} needs more than ${k} points covered by the reference (found ${m})`,
      { file, field: 'emsc' },
    );
  }
  const x = new Float64Array(m);
  const s = new Float64Array(m);
  const r = new Float64Array(m);
  for (let i = 0, j = 0; i < ref.length; i++) {
    if (Number.isNaN(ref[i]!)) continue;
    x[j] = spectrum.wavenumber[i]!;
    s[j] = spectrum.absorbance[i]!;
    r[j] = ref[i]!;
    j++;
  }
  const lo = x[0]!;
  const span = x[m - 1]! - lo;
  // Columns: 1, ref, P₁(x̃) … P_degree(x̃), by the three-term recurrence (k+1)P_{k+1} = (2k+1)x̃P_k −
  // kP_{k−1}.
  const design = new Float64Array(m * k);
  const poly = new Float64Array(m * (degree + 1));
  for (let i = 0; i < m; i++) {
    const t = span > 0 ? (2 * (x[i]! - lo)) / span - 1 : 0;
    poly[i] = 1;
    if (degree >= 1) poly[m + i] = t;
    for (let q = 1; q < degree; q++) {
      poly[(q + 1) * m + i] = ((2 * q + 1) * t * poly[q * m + i]! - q * poly[(q - 1) * m + i]!) / (q + 1);
    }
  }
  design.set(poly.subarray(0, m), 0);
  design.set(r, m);
  for (let q = 1; q <= degree; q++) design.set(poly.subarray(q * m, (q + 1) * m), (q + 1) * m);
  const c = solveLeastSquares({ matrix: design, rows: m, cols: k, b: s });
  if (!c) {
    throw new BandshelfError(
      'BAD_RECIPE',
      `the EMSC model is degenerate: the reference is indistinguishable from a polynomial of degree ${degree}`,
      { file, field: 'emsc' },
    );
  }
  const a = c[0]!;
  const b = c[1]!;
  if (!(b >= minB)) {
    throw new BandshelfError(
      'BAD_RECIPE',
      `the fitted multiplicative term b = ${b.toPrecision(3)} is below ${minB}: the spectrum does not contain the EMSC reference`,
      { file, field: 'emsc' },
    );
  }
  const corrected = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    let v = s[i]! - a;
    for (let q = 1; q <= degree; q++) v -= c[q + 1]! * poly[q * m + i]!;
    corrected[i] = v / b;
  }
  return { spectrum: { wavenumber: x, absorbance: corrected }, coefficients: Array.from(c) };
}

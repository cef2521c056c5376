// The asymmetric least squares baseline (Eilers & Boelens 2005): a smooth curve hugging the spectrum below.
import { BandshelfError } from '../error.js';
import { lambdaPerPoint } from './lambdaPerPoint.js';
import type { Spectrum } from './types.js';
import { whittakerSmooth } from './whittakerSmooth.js';

export interface AlsBaselineOptions {
  /**
   * Smoothness λ of the second-difference penalty, per point index (as published).
   * @default 1e5
   */
  lambda?: number;
  /**
   * Asymmetry: weight of points above the baseline (points below get 1 − p).
   * @default 0.01
   */
  p?: number;
  /**
   * Number of reweighting passes.
   * @default 10
   */
  iterations?: number;
  /**
   * Point spacing h in cm⁻¹. When given, λ is a physical stiffness in cm^(2d) (d the difference order) and
   * the per-point penalty is λ·h^(−2d), so the same λ gives the same baseline at any spacing; when absent, λ
   * is per point (as published).
   * @default undefined
   */
  spacing?: number;
  /**
   * The file the spectrum came from, for error messages.
   * @default undefined
   */
  file?: string;
}

/**
 * Eilers & Boelens (2005): repeat z = (W + λ DᵀD)⁻¹ W y with D the second-difference operator, then w = p
 * where y > z and 1 − p elsewhere. Stops early once no weight changes. Returns the baseline z on every point.
 */
export function alsBaseline(spectrum: Spectrum, options: AlsBaselineOptions = {}): Float64Array {
  const y = spectrum.absorbance;
  const n = y.length;
  const lambda = lambdaPerPoint(options.lambda ?? 1e5, { differences: 2, spacing: options.spacing });
  const p = options.p ?? 0.01;
  const iterations = options.iterations ?? 10;
  const file = options.file;
  if (n < 3) throw new BandshelfError('TOO_FEW_POINTS', 'an ALS baseline needs at least 3 points', { file });
  if (!(p > 0 && p < 1))
    throw new BandshelfError('BAD_RECIPE', `p must lie in (0, 1) (got ${p})`, { file, field: 'p' });
  if (!(Number.isInteger(iterations) && iterations >= 1)) {
    throw new BandshelfError('BAD_RECIPE', `iterations must be a whole number ≥ 1 (got ${iterations})`, {
      file,
      field: 'iterations',
    });
  }
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(y[i]!))
      throw new BandshelfError('NOT_FINITE', `point ${i + 1} is not finite`, { file });
  }
  const weights = new Float64Array(n).fill(1);
  let z: Float64Array = new Float64Array(n);
  for (let it = 0; it < iterations; it++) {
    z = whittakerSmooth({ y, weights }, { lambda, differences: 2 });
    let changed = false;
    for (let i = 0; i < n; i++) {
      const w = y[i]! > z[i]! ? p : 1 - p;
      if (w !== weights[i]) {
        weights[i] = w;
        changed = true;
      }
    }
    if (!changed) break;
  }
  return z;
}

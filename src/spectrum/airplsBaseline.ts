// The airPLS baseline (Zhang, Chen & Liang 2010): penalised least squares, adaptively reweighted.
import { BandshelfError } from '../error.js';
import { lambdaPerPoint } from './lambdaPerPoint.js';
import type { Spectrum } from './types.js';
import { whittakerSmooth } from './whittakerSmooth.js';

export interface AirplsBaselineOptions {
  /**
   * Smoothness λ of the difference penalty, per point index (as published).
   * @default 100
   */
  lambda?: number;
  /**
   * Maximum number of reweighting passes.
   * @default 20
   */
  iterations?: number;
  /**
   * Order of the differences penalised; 1 follows the published algorithm, 2 gives a stiffer, curved
   * baseline.
   * @default 1
   */
  differences?: 1 | 2;
  /**
   * Converged when the sum of |negative residuals| falls below this fraction of Σ|y|.
   * @default 0.001
   */
  tolerance?: number;
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
 * Zhang, Chen & Liang, Analyst 135 (2010): start with all weights 1; in pass t fit z = (W + λ DᵀD)⁻¹ W y,
 * take the residuals d = y − z, stop when Σ|d⁻| < tolerance·Σ|y|; otherwise give points above the fit weight
 * 0 (they are bands), points below weight exp(t·|dᵢ|/Σ|d⁻|), and both end points exp(t·max|d⁻|/Σ|d⁻|) so the
 * baseline stays anchored. Implemented here rather than through the ml-airpls package, whose weighting
 * departs from the paper (Gaussian weights on a noise estimate), so that the recipe's λ and passes mean what
 * the paper says.
 */
export function airplsBaseline(spectrum: Spectrum, options: AirplsBaselineOptions = {}): Float64Array {
  const y = spectrum.absorbance;
  const n = y.length;
  const iterations = options.iterations ?? 20;
  const differences = options.differences ?? 1;
  const lambda = lambdaPerPoint(options.lambda ?? 100, { differences, spacing: options.spacing });
  const tolerance = options.tolerance ?? 0.001;
  const file = options.file;
  if (n < 3)
    throw new BandshelfError('TOO_FEW_POINTS', 'an airPLS baseline needs at least 3 points', { file });
  if (!(Number.isInteger(iterations) && iterations >= 1)) {
    throw new BandshelfError('BAD_RECIPE', `iterations must be a whole number ≥ 1 (got ${iterations})`, {
      file,
      field: 'iterations',
    });
  }
  let absSum = 0;
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(y[i]!))
      throw new BandshelfError('NOT_FINITE', `point ${i + 1} is not finite`, { file });
    absSum += Math.abs(y[i]!);
  }
  const weights = new Float64Array(n).fill(1);
  let z: Float64Array = new Float64Array(n);
  for (let t = 1; t <= iterations; t++) {
    z = whittakerSmooth({ y, weights }, { lambda, differences });
    let negativeSum = 0;
    let negativeMax = 0;
    for (let i = 0; i < n; i++) {
      const d = y[i]! - z[i]!;
      if (d < 0) {
        negativeSum -= d;
        if (-d > negativeMax) negativeMax = -d;
      }
    }
    if (negativeSum < tolerance * absSum || t === iterations) break;
    for (let i = 0; i < n; i++) {
      const d = y[i]! - z[i]!;
      weights[i] = d >= 0 ? 0 : Math.exp((t * -d) / negativeSum);
    }
    const endWeight = Math.exp((t * negativeMax) / negativeSum);
    weights[0] = endWeight;
    weights[n - 1] = endWeight;
  }
  return z;
}

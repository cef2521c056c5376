// Resolution matching: degrades a spectrum to a coarser target resolution by convolution with a Gaussian line shape.
import type { Spectrum } from './types.js';

export interface MatchResolutionOptions {
  /**
   * The spectrum's own resolution, cm⁻¹ (FWHM of its instrument line shape).
   * @default 0 (taken as infinitely sharp: convolved with the full target width)
   */
  own?: number;
  /** The common resolution to reach, cm⁻¹ (FWHM). @default 4 */
  target?: number;
  /** Neighbouring points further apart than this (cm⁻¹) bound a gap: no line segment is drawn across it. @default Infinity */
  maxGap?: number;
}

/** FWHM = 2 √(2 ln 2) σ for a Gaussian (common practice). */
const FWHM_PER_SIGMA = 2 * Math.sqrt(2 * Math.LN2);
/** The kernel is cut where it has fallen to exp(−18) ≈ 1.5·10⁻⁸ of its peak. */
const REACH_SIGMAS = 6;

/**
 * Convolves the spectrum with a unit-area Gaussian of FWHM √(target² − own²), so that a spectrum whose instrument line
 * shape is Gaussian of FWHM `own` comes out with one of FWHM `target`: Gaussian widths add in quadrature under
 * convolution (the variances of independent normal variables add; common practice). The Gaussian is chosen because it
 * is the only common line shape closed under convolution; an instrument with a sinc² (triangular apodisation) or
 * Lorentzian-tailed line shape reaches the target width only approximately. The exact convolution of the points'
 * piecewise-linear curve with the Gaussian is evaluated at each original wavenumber (closed form per segment, so it is
 * exact even when the kernel is narrower than the point spacing), divided by the kernel area that falls on data:
 * at the ends and beside gaps wider than `maxGap` the kernel is renormalised rather than pulling the values towards
 * zero. On evenly spaced interior data the integral over the curve (band area) is unchanged. A spectrum already at or
 * coarser than the target is returned unchanged (as a copy); the caller notes that it stays coarser. The input is not
 * modified.
 */
export function matchResolution(spectrum: Spectrum, options: MatchResolutionOptions = {}): Spectrum {
  const own = options.own ?? 0;
  const target = options.target ?? 4;
  const maxGap = options.maxGap ?? Number.POSITIVE_INFINITY;
  const x = spectrum.wavenumber;
  const y = spectrum.absorbance;
  const n = x.length;
  if (!(target > own) || n < 2) return { wavenumber: x.slice(), absorbance: y.slice() };
  const sigma = Math.sqrt(target * target - own * own) / FWHM_PER_SIGMA;
  const reach = REACH_SIGMAS * sigma;
  const out = new Float64Array(n);
  const cdf = new Float64Array(n);
  const density = new Float64Array(n);
  let lo = 0;
  for (let i = 0; i < n; i++) {
    const c = x[i]!;
    while (lo < n - 1 && x[lo + 1]! < c - reach) lo++;
    let hi = lo;
    while (hi < n - 1 && x[hi]! <= c + reach) hi++;
    for (let j = lo; j <= hi; j++) {
      const z = (x[j]! - c) / sigma;
      cdf[j] = normalCdf(z);
      density[j] = Math.exp(-0.5 * z * z) / (sigma * Math.sqrt(2 * Math.PI));
    }
    let weight = 0;
    let sum = 0;
    for (let k = lo; k < hi; k++) {
      const a = x[k]!;
      const b = x[k + 1]!;
      const width = b - a;
      if (!(width > 0) || width > maxGap) continue;
      const ya = y[k]!;
      const yb = y[k + 1]!;
      if (!Number.isFinite(ya) || !Number.isFinite(yb)) continue;
      const slope = (yb - ya) / width;
      // y = α + s·u on the segment, u = x − c: ∫ (α + s u) g(u) du = α ΔΦ − s σ² Δg.
      const alpha = ya + slope * (c - a);
      const mass = cdf[k + 1]! - cdf[k]!;
      weight += mass;
      sum += alpha * mass - slope * sigma * sigma * (density[k + 1]! - density[k]!);
    }
    out[i] = weight > 0 ? sum / weight : y[i]!;
  }
  return { wavenumber: x.slice(), absorbance: out };
}

/** Φ(z) = erfc(−z/√2) / 2, with erfc from the Chebyshev fit of Press et al., Numerical Recipes (fractional error < 1.2·10⁻⁷). */
function normalCdf(z: number): number {
  return 0.5 * erfc(-z / Math.SQRT2);
}

function erfc(v: number): number {
  const z = Math.abs(v);
  const t = 1 / (1 + 0.5 * z);
  const r =
    t *
    Math.exp(
      -z * z -
        1.26551223 +
        t *
          (1.00002368 +
            t *
              (0.37409196 +
                t *
                  (0.09678418 +
                    t *
                      (-0.18628806 +
                        t *
                          (0.27886807 +
                            t * (-1.13520398 + t * (1.48851587 + t * (-0.82215223 + t * 0.17087277)))))))),
    );
  return v >= 0 ? r : 2 - r;
}

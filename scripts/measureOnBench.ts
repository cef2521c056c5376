// A synthetic "measurement" of an invented band set (or of a recorded spectrum) as one instrument would record it
// (for bench:cross-source).
//
// Every spectrum made here is synthetic: the true absorbance is the demo compound's pseudo-Voigt band set
// (src/demo/bandProfile.ts), or a real recorded spectrum taken as the truth (bench:cross-source's real part, its
// degraded queries: the bench's effects are then added on top of that recording's own); the instrument is modelled as (1) ATR weighting or transmission, (2) an added water
// background, (3) convolution with a Gaussian instrument line shape of the bench's resolution, (4) sampling at the
// bench's point spacing over its range, (5) a baseline (offset, slope, curvature and a scattering-like ν² term) and
// (6) white noise. Nothing here is a measurement, and nothing is fitted to a result.
import { type Band, bandProfile } from '../src/demo/bandProfile.js';
import { seededRandom } from '../src/demo/seededRandom.js';
import type { Spectrum } from '../src/spectrum/types.js';

export interface Bench {
  name: string;
  /** Resolution: FWHM of the Gaussian instrument line shape, cm⁻¹. */
  resolution: number;
  /** Point spacing, cm⁻¹. */
  spacing: number;
  /** Recorded range, cm⁻¹. */
  range: { min: number; max: number };
  technique: 'transmission' | 'atr';
  /** Largest baseline terms, absorbance units (each drawn uniformly in ±value, ν² term in 0…value). */
  baseline: { offset: number; slope: number; curvature: number; scattering: number };
  /** Liquid water added, × the analyte's strongest band (drawn uniformly in 0.5…1.5 × value). @default 0 */
  water?: number;
  /** White-noise standard deviation, absorbance units. */
  noise: number;
}

export interface MeasureOnBenchOptions {
  /** Seed of the baseline, water and noise draws. @default 1 */
  seed?: number;
  /** The water band set, needed when the bench adds water. @default [] */
  water?: readonly Band[];
}

/** Fine model axis, cm⁻¹: much finer than any bench's resolution, so the convolution is of the true shape. */
const FINE = 0.25;
const FWHM_PER_SIGMA = 2 * Math.sqrt(2 * Math.LN2);

/** Discrete Gaussian convolution on the fine evenly spaced axis (unit-sum kernel, truncated at ±4σ, ends renormalised). */
function convolve(y: Float64Array, fwhm: number): Float64Array {
  const sigma = fwhm / FWHM_PER_SIGMA / FINE;
  const half = Math.ceil(4 * sigma);
  const kernel = Float64Array.from({ length: 2 * half + 1 }, (_, k) =>
    Math.exp(-0.5 * ((k - half) / sigma) ** 2),
  );
  const out = new Float64Array(y.length);
  for (let i = 0; i < y.length; i++) {
    let s = 0;
    let w = 0;
    for (let k = -half; k <= half; k++) {
      const j = i + k;
      if (j < 0 || j >= y.length) continue;
      s += kernel[k + half]! * y[j]!;
      w += kernel[k + half]!;
    }
    out[i] = s / w;
  }
  return out;
}

/**
 * A recorded spectrum taken as the true absorbance: linearly interpolated onto `fine` (its end values held beyond
 * its range) and scaled so its largest |A| is 1, so a bench's baseline and water terms are in units of its
 * strongest band, as they are for a band set whose strongest band is about 1.
 */
function truthOfSpectrum(spectrum: Spectrum, fine: Float64Array): Float64Array {
  const order = Array.from(spectrum.wavenumber.keys()).sort(
    (a, b) => spectrum.wavenumber[a]! - spectrum.wavenumber[b]!,
  );
  const x = Float64Array.from(order, (i) => spectrum.wavenumber[i]!);
  const y = Float64Array.from(order, (i) => spectrum.absorbance[i]!);
  let peak = 0;
  for (const v of y) if (Number.isFinite(v)) peak = Math.max(peak, Math.abs(v));
  const out = new Float64Array(fine.length);
  let j = 0;
  for (let i = 0; i < fine.length; i++) {
    const g = fine[i]!;
    if (g <= x[0]!) out[i] = y[0]!;
    else if (g >= x[x.length - 1]!) out[i] = y[y.length - 1]!;
    else {
      while (j < x.length - 2 && x[j + 1]! < g) j++;
      const t = x[j + 1]! === x[j]! ? 0 : (g - x[j]!) / (x[j + 1]! - x[j]!);
      out[i] = y[j]! + t * (y[j + 1]! - y[j]!);
    }
    out[i] = peak > 0 ? out[i]! / peak : out[i]!;
  }
  return out;
}

/**
 * The band set (or a recorded spectrum taken as the truth: see truthOfSpectrum; the bench's range is then cut to
 * the spectrum's own) measured on `bench`: wavenumber descending (as many benches export), absorbance. ATR
 * weighting is the effective thickness ∝ penetration depth ∝ λ (Harrick's d_p, weak absorber; common practice),
 * normalised at 1000 cm⁻¹.
 */
export function measureOnBench(
  source: readonly Band[] | Spectrum,
  given: Bench,
  options: MeasureOnBenchOptions = {},
): Spectrum {
  const random = seededRandom(options.seed ?? 1);
  const recorded = 'wavenumber' in source ? source : null;
  let bench = given;
  if (recorded !== null) {
    let min = Number.POSITIVE_INFINITY;
    let max = Number.NEGATIVE_INFINITY;
    for (const v of recorded.wavenumber) {
      min = Math.min(min, v);
      max = Math.max(max, v);
    }
    bench = { ...given, range: { min: Math.max(given.range.min, min), max: Math.min(given.range.max, max) } };
  }
  const lo = bench.range.min - 4 * bench.resolution;
  const hi = bench.range.max + 4 * bench.resolution;
  const n = Math.round((hi - lo) / FINE) + 1;
  const fine = Float64Array.from({ length: n }, (_, i) => lo + i * FINE);
  const truth =
    recorded === null ? bandProfile(fine, source as readonly Band[]) : truthOfSpectrum(recorded, fine);
  if (bench.water !== undefined && bench.water > 0) {
    const water = bandProfile(fine, options.water ?? []);
    const share = bench.water * (0.5 + random.uniform());
    for (let i = 0; i < n; i++) truth[i] = truth[i]! + share * water[i]!;
  }
  if (bench.technique === 'atr') for (let i = 0; i < n; i++) truth[i] = (truth[i]! * 1000) / fine[i]!;
  const seen = convolve(truth, bench.resolution);
  const draw = (max: number) => max * (2 * random.uniform() - 1);
  const offset = draw(bench.baseline.offset);
  const slope = draw(bench.baseline.slope);
  const curvature = draw(bench.baseline.curvature);
  const scattering = bench.baseline.scattering * random.uniform();
  const count = Math.floor((bench.range.max - bench.range.min) / bench.spacing) + 1;
  const x = new Float64Array(count);
  const y = new Float64Array(count);
  for (let k = 0; k < count; k++) {
    const v = bench.range.max - k * bench.spacing;
    const at = (v - lo) / FINE;
    const j = Math.min(n - 2, Math.floor(at));
    const t = at - j;
    const u = (v - 2300) / 1700;
    x[k] = Math.round(v * 1e4) / 1e4;
    y[k] =
      seen[j]! * (1 - t) +
      seen[j + 1]! * t +
      offset +
      slope * u +
      curvature * u * u +
      scattering * (v / 4000) ** 2 +
      bench.noise * random.normal();
  }
  return { wavenumber: x, absorbance: y };
}

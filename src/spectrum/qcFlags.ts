// Quality checks run at ingest: each finding becomes a flag with a level, a readable sentence and its figure.
import { BandshelfError } from '../error.js';
import type { Grid, WavenumberWindow } from '../schema/recipe.js';
import { estimateSnr } from './estimateSnr.js';
import { gridAxis } from './gridAxis.js';
import { gridLength } from './gridLength.js';
import type { QcFlag, Spectrum } from './types.js';

export interface QcFlagsOptions {
  /**
   * A maximum absorbance above this is an error: the detector saw too little light for a trustworthy value.
   * @default 2.0
   */
  saturationLimit?: number;
  /**
   * The recipe's crop window: saturation is judged only inside it (a saturated band the recipe cuts away does no
   * harm). @default null (the whole spectrum)
   */
  crop?: { min: number; max: number } | null;
  /**
   * A flat top needs at least this many consecutive points within `flatTolerance` of the maximum …
   * @default 5
   */
  flatPoints?: number;
  /**
   * … spanning at least this many cm⁻¹, so the naturally rounded top of a broad band (even a 400 cm⁻¹ wide
   * water band at 1 AU) is not taken for clipping.
   * @default 8
   */
  flatWidth?: number;
  /**
   * Absorbance units within which points count as equal to the maximum.
   * @default 1e-4
   */
  flatTolerance?: number;
  /**
   * The spectrum after the baseline step, for the negative-absorbance check (skipped without it).
   * @default undefined
   */
  baselineCorrected?: Spectrum;
  /**
   * Negative absorbance is flagged below −negativeTolerance × the corrected spectrum's maximum.
   * @default 0.02
   */
  negativeTolerance?: number;
  /**
   * Band-free window for the noise estimate.
   * @default { min: 1900, max: 2000 }
   */
  noiseWindow?: WavenumberWindow;
  /**
   * An SNR ((max − min) / RMS noise) below this is a warning.
   * @default 100
   */
  minSnr?: number;
  /**
   * A point is a spike when it stands out from its local background by more than this many robust standard
   * deviations (1.4826 × MAD of all such excursions) while its neighbours do not.
   * @default 8
   */
  spikeThreshold?: number;
  /**
   * Source points further apart than this (cm⁻¹) leave a gap in coverage (the recipe's `resample.maxGap`).
   * @default 16
   */
  maxGap?: number;
  /**
   * Median point spacing above this multiple of the grid step is coarse.
   * @default 2
   */
  coarseFactor?: number;
  /**
   * Covered fraction of the grid (outside the exclusion windows) below which coverage is narrow.
   * @default 0.9
   */
  minCoverage?: number;
  /**
   * The recipe's exclusion windows: gaps inside them are expected, and grid points inside them are not
   * counted against coverage.
   * @default []
   */
  exclude?: WavenumberWindow[];
  /**
   * The reference's spectral dynamic range in orders of magnitude (field-resolved entries).
   * @default undefined
   */
  dynamicRangeOrders?: number;
  /**
   * The spectrum's resolution and the recipe's target (cm⁻¹), when the recipe matches resolutions: a spectrum
   * coarser than the target cannot be brought to it and is noted.
   * @default undefined (no resolution step)
   */
  resolution?: { value: number; estimated: boolean; target: number };
  /**
   * A dynamic range below this many orders is a warning.
   * @default 3
   */
  minDynamicRangeOrders?: number;
}

/**
 * Checks, in this order: saturation inside the crop window (a warning above the limit, and for a flat top: points
 * clipped at the absorbance ceiling are already kept out of the processed vector, and a spectrum with nothing usable
 * left is refused by the coverage check), negative absorbance
 * after the baseline, low SNR in the noise window (no flag when the window is not covered), single-point
 * spikes (narrower than any band: y(i) far from the line through its neighbours two and three points away
 * while y(i±1) stay within a third of that excursion; two adjacent bad points are missed, and bands narrower
 * than about 3 points, which are undersampled, can look like spikes), gaps in the source coverage, coarse
 * point spacing, narrow coverage of the grid (an error when nothing is covered), a resolution coarser than the
 * recipe's target, and low dynamic range.
 * `original` is the parsed spectrum (any order; sorted here), `processed` the grid vector (NaN not covered).
 * Near-duplicates are the library's check.
 */
export function qcFlags(
  original: Spectrum,
  processed: Float64Array,
  grid: Grid,
  options: QcFlagsOptions = {},
): QcFlag[] {
  const length = gridLength(grid);
  if (processed.length !== length) {
    throw new BandshelfError(
      'BAD_OPTION',
      `the processed vector has ${processed.length} values but the grid has ${length} points`,
      { field: 'processed' },
    );
  }
  const sorted = ascending(original);
  return [
    ...saturationFlags(sorted, options),
    ...negativeAbsorbanceFlags(options),
    ...snrFlags(sorted, options),
    ...spikeFlags(sorted, options),
    ...gapFlags(sorted, grid, options),
    ...spacingFlags(sorted, grid, options),
    ...coverageFlags(processed, grid, options),
    ...resolutionFlags(options),
    ...dynamicRangeFlags(options),
  ];
}

/** Saturation inside the crop window: above the limit, and a flat (clipped) band top. */
function saturationFlags(spectrum: Spectrum, options: QcFlagsOptions): QcFlag[] {
  const { wavenumber: x, absorbance: y } = spectrum;
  const n = x.length;
  const flags: QcFlag[] = [];
  const limit = options.saturationLimit ?? 2.0;
  const crop = options.crop ?? null;
  const lo = crop === null ? Number.NEGATIVE_INFINITY : Math.min(crop.min, crop.max);
  const hi = crop === null ? Number.POSITIVE_INFINITY : Math.max(crop.min, crop.max);
  let iMax = -1;
  for (let i = 0; i < n; i++) {
    if (x[i]! < lo || x[i]! > hi) continue;
    if (Number.isFinite(y[i]!) && (iMax < 0 || y[i]! > y[iMax]!)) iMax = i;
  }
  if (iMax < 0) return flags;
  const max = y[iMax]!;
  if (max > limit) {
    flags.push({
      code: 'saturation',
      level: 'warning',
      message: `The maximum absorbance ${num(max)} at ${wn(x[iMax]!)} exceeds the saturation limit of ${num(limit)}: band heights there are not linear in concentration.`,
      value: max,
    });
  }
  const flat = longestFlatTop(x, y, max, options.flatTolerance ?? 1e-4);
  if (flat.points >= (options.flatPoints ?? 5) && flat.width >= (options.flatWidth ?? 8)) {
    flags.push({
      code: 'saturation',
      level: 'warning',
      message: `The band top at ${wn(flat.from)}–${wn(flat.to)} is flat: ${flat.points} points within ${num(options.flatTolerance ?? 1e-4)} of the maximum ${num(max)}, as when the detector clips.`,
      value: flat.points,
    });
  }
  return flags;
}

/** Negative absorbance after the baseline step (skipped without the corrected spectrum). */
function negativeAbsorbanceFlags(options: QcFlagsOptions): QcFlag[] {
  const c = options.baselineCorrected;
  if (!c) return [];
  let lo = -1;
  let hiValue = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < c.absorbance.length; i++) {
    const v = c.absorbance[i]!;
    if (!Number.isFinite(v)) continue;
    if (lo < 0 || v < c.absorbance[lo]!) lo = i;
    if (v > hiValue) hiValue = v;
  }
  const tolerance = options.negativeTolerance ?? 0.02;
  if (lo < 0) return [];
  const min = c.absorbance[lo]!;
  const threshold = tolerance * Math.max(Math.abs(hiValue), Number.MIN_VALUE);
  if (min >= -threshold) return [];
  return [
    {
      code: 'negative-absorbance',
      level: 'warning',
      message: `After baseline correction the absorbance falls to ${num(min)} at ${wn(c.wavenumber[lo]!)}, more than ${num(tolerance * 100)} % of the maximum below zero.`,
      value: min,
    },
  ];
}

/** Low SNR in the band-free noise window (no flag when the window is not covered). */
function snrFlags(spectrum: Spectrum, options: QcFlagsOptions): QcFlag[] {
  const window = options.noiseWindow ?? { min: 1900, max: 2000 };
  const snrOptions = options.baselineCorrected ? { window, signal: options.baselineCorrected } : { window };
  const { noise, snr } = estimateSnr(spectrum, snrOptions);
  const minSnr = options.minSnr ?? 100;
  if (!(Number.isFinite(noise) && snr < minSnr)) return [];
  return [
    {
      code: 'low-snr',
      level: 'warning',
      message: `The signal-to-noise ratio is ${num(snr)} (noise ${num(noise)} RMS in ${wn(Math.min(window.min, window.max), false)}–${wn(Math.max(window.min, window.max))}), below ${num(minSnr)}.`,
      value: snr,
    },
  ];
}

function spikeFlags(spectrum: Spectrum, options: QcFlagsOptions): QcFlag[] {
  const spikes = findSpikes(spectrum.wavenumber, spectrum.absorbance, options.spikeThreshold ?? 8);
  if (spikes.count === 0) return [];
  return [
    {
      code: 'spikes',
      level: 'warning',
      message: `${spikes.count} single-point spike${spikes.count === 1 ? '' : 's'} found; the largest, ${num(spikes.largest)} absorbance units, at ${wn(spikes.at)}.`,
      value: spikes.count,
    },
  ];
}

/** Gaps in the source coverage, where they touch the grid and are not an excluded window. */
function gapFlags(spectrum: Spectrum, grid: Grid, options: QcFlagsOptions): QcFlag[] {
  const x = spectrum.wavenumber;
  const exclude = options.exclude ?? [];
  const gridLo = Math.min(grid.start, grid.stop);
  const gridHi = Math.max(grid.start, grid.stop);
  const maxGap = options.maxGap ?? 16;
  let gaps = 0;
  let widest = 0;
  let widestFrom = 0;
  for (let i = 1; i < x.length; i++) {
    const a = x[i - 1]!;
    const b = x[i]!;
    if (b - a <= maxGap || b < gridLo || a > gridHi) continue;
    if (exclude.some((w) => a >= Math.min(w.min, w.max) - maxGap && b <= Math.max(w.min, w.max) + maxGap)) {
      continue;
    }
    gaps++;
    if (b - a > widest) {
      widest = b - a;
      widestFrom = a;
    }
  }
  if (gaps === 0) return [];
  return [
    {
      code: 'coverage-gap',
      level: 'warning',
      message: `${gaps} gap${gaps === 1 ? '' : 's'} wider than ${num(maxGap)} cm⁻¹ between data points; the widest is ${num(widest)} cm⁻¹ (${wn(widestFrom, false)}–${wn(widestFrom + widest)}), left not covered.`,
      value: widest,
    },
  ];
}

/** Median point spacing coarser than `coarseFactor` × the grid step. */
function spacingFlags(spectrum: Spectrum, grid: Grid, options: QcFlagsOptions): QcFlag[] {
  const x = spectrum.wavenumber;
  const n = x.length;
  if (n < 2) return [];
  const spacing = new Float64Array(n - 1);
  for (let i = 1; i < n; i++) spacing[i - 1] = x[i]! - x[i - 1]!;
  const median = medianOf(spacing);
  const factor = options.coarseFactor ?? 2;
  if (median <= factor * grid.step) return [];
  return [
    {
      code: 'coarse-spacing',
      level: 'warning',
      message: `The median point spacing is ${num(median)} cm⁻¹, coarser than ${num(factor)} × the grid step of ${num(grid.step)} cm⁻¹.`,
      value: median,
    },
  ];
}

/** Narrow coverage of the grid outside the excluded windows: an error when nothing is covered. */
function coverageFlags(processed: Float64Array, grid: Grid, options: QcFlagsOptions): QcFlag[] {
  const exclude = options.exclude ?? [];
  const gridLo = Math.min(grid.start, grid.stop);
  const gridHi = Math.max(grid.start, grid.stop);
  const axis = gridAxis(grid);
  let counted = 0;
  let covered = 0;
  let first = -1;
  let last = -1;
  for (let i = 0; i < processed.length; i++) {
    const v = axis[i]!;
    if (exclude.some((w) => v >= Math.min(w.min, w.max) && v <= Math.max(w.min, w.max))) continue;
    counted++;
    if (Number.isFinite(processed[i]!)) {
      covered++;
      if (first < 0) first = i;
      last = i;
    }
  }
  const fraction = counted > 0 ? covered / counted : 0;
  const minCoverage = options.minCoverage ?? 0.9;
  if (covered === 0) {
    // Nothing on the grid means nothing to match or plot: an error, so such a file is not stored by mistake.
    return [
      {
        code: 'narrow-coverage',
        level: 'error',
        message: `The spectrum covers none of the library grid ${wn(gridLo, false)}–${wn(gridHi)} outside the excluded windows; it cannot be matched.`,
        value: 0,
      },
    ];
  }
  if (fraction >= minCoverage) return [];
  const span = first >= 0 ? ` (data over ${wn(axis[first]!, false)}–${wn(axis[last]!)})` : '';
  return [
    {
      code: 'narrow-coverage',
      level: 'warning',
      message: `The spectrum covers ${num(fraction * 100)} % of the library grid ${wn(gridLo, false)}–${wn(gridHi)}${span}, below ${num(minCoverage * 100)} %; matching uses the overlap only.`,
      value: fraction,
    },
  ];
}

/** A resolution coarser than the recipe's common target. */
function resolutionFlags(options: QcFlagsOptions): QcFlag[] {
  const resolution = options.resolution;
  if (resolution === undefined || resolution.value <= resolution.target) return [];
  return [
    {
      code: 'coarse-resolution',
      level: 'warning',
      message: `The resolution is ${num(resolution.value)} cm⁻¹${resolution.estimated ? ' (estimated from the point spacing)' : ''}, coarser than the recipe's common ${num(resolution.target)} cm⁻¹: kept as it is, so its bands are broader than those of entries brought to the target.`,
      value: resolution.value,
    },
  ];
}

/** Low spectral dynamic range of a field-resolved reference. */
function dynamicRangeFlags(options: QcFlagsOptions): QcFlag[] {
  if (options.dynamicRangeOrders === undefined) return [];
  const minOrders = options.minDynamicRangeOrders ?? 3;
  if (options.dynamicRangeOrders >= minOrders) return [];
  return [
    {
      code: 'low-dynamic-range',
      level: 'warning',
      message: `The reference's spectral dynamic range is ${num(options.dynamicRangeOrders)} orders of magnitude, below ${num(minOrders)}.`,
      value: options.dynamicRangeOrders,
    },
  ];
}

/** The spectrum in ascending wavenumber; a copy only when the input is not already ascending. */
function ascending(spectrum: Spectrum): Spectrum {
  const x = spectrum.wavenumber;
  const n = Math.min(x.length, spectrum.absorbance.length);
  let sorted = true;
  for (let i = 1; i < n; i++) {
    if (x[i]! < x[i - 1]!) {
      sorted = false;
      break;
    }
  }
  if (sorted && n === x.length && n === spectrum.absorbance.length) return spectrum;
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => x[a]! - x[b]!);
  const wavenumber = new Float64Array(n);
  const absorbance = new Float64Array(n);
  order.forEach((k, i) => {
    wavenumber[i] = x[k]!;
    absorbance[i] = spectrum.absorbance[k]!;
  });
  return { wavenumber, absorbance };
}

function longestFlatTop(
  x: Float64Array,
  y: Float64Array,
  max: number,
  tolerance: number,
): { points: number; width: number; from: number; to: number } {
  let best = { points: 0, width: 0, from: 0, to: 0 };
  let start = -1;
  for (let i = 0; i <= y.length; i++) {
    const inside = i < y.length && y[i]! >= max - tolerance;
    if (inside && start < 0) start = i;
    if (!inside && start >= 0) {
      const points = i - start;
      if (points > best.points)
        best = { points, width: x[i - 1]! - x[start]!, from: x[start]!, to: x[i - 1]! };
      start = -1;
    }
  }
  return best;
}

// Excursion of point i above its local background: the least-squares line through the points two and three
// away on each side, so a steep band flank does not count as an excursion of the neighbours.
function findSpikes(
  x: Float64Array,
  y: Float64Array,
  threshold: number,
): { count: number; largest: number; at: number } {
  const n = y.length;
  const result = { count: 0, largest: 0, at: 0 };
  if (n < 7) return result;
  const height = new Float64Array(n);
  const left = new Float64Array(n);
  const right = new Float64Array(n);
  for (let i = 3; i < n - 3; i++) {
    const mean = (y[i - 3]! + y[i - 2]! + y[i + 2]! + y[i + 3]!) / 4;
    // Offsets −3, −2, 2, 3 have zero mean and Σo² = 26.
    const slope = (3 * (y[i + 3]! - y[i - 3]!) + 2 * (y[i + 2]! - y[i - 2]!)) / 26;
    height[i] = y[i]! - mean;
    left[i] = y[i - 1]! - (mean - slope);
    right[i] = y[i + 1]! - (mean + slope);
  }
  const inner = height.slice(3, n - 3);
  const centre = medianOf(inner);
  for (let i = 0; i < inner.length; i++) inner[i] = Math.abs(inner[i]! - centre);
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < n; i++) {
    if (y[i]! < min) min = y[i]!;
    if (y[i]! > max) max = y[i]!;
  }
  // A floor keeps noise-free synthetic data, whose MAD is zero, from calling rounding errors spikes.
  const sigma = Math.max(1.4826 * medianOf(inner), 1e-9 * (max - min), Number.MIN_VALUE);
  for (let i = 3; i < n - 3; i++) {
    const h = height[i]! - centre;
    if (!(Math.abs(h) > threshold * sigma)) continue;
    // A band lifts its neighbours with it; a spike stands alone.
    if (Math.abs(left[i]! - centre) >= Math.abs(h) / 3 || Math.abs(right[i]! - centre) >= Math.abs(h) / 3)
      continue;
    result.count++;
    if (Math.abs(h) > Math.abs(result.largest)) {
      result.largest = h;
      result.at = x[i]!;
    }
  }
  return result;
}

function medianOf(values: Float64Array): number {
  if (values.length === 0) return Number.NaN;
  const sorted = values.slice().sort();
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

function num(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  if (v !== 0 && (Math.abs(v) >= 1e6 || Math.abs(v) < 1e-3)) return v.toExponential(2);
  return String(Number(v.toPrecision(3)));
}

function wn(v: number, unit = true): string {
  return `${v.toFixed(1)}${unit ? ' cm⁻¹' : ''}`;
}

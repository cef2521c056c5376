// The whole processing recipe, from a parsed original spectrum to the library's processed grid vector.
import { BandshelfError } from '../error.js';
import type { Grid, Recipe } from '../schema/recipe.js';
import { atrCorrect } from './atrCorrect.js';
import { cropToWindow } from './cropToWindow.js';
import { emscCorrect } from './emscCorrect.js';
import { excludeWindows } from './excludeWindows.js';
import { fitReferences } from './fitReferences.js';
import { gridAxis } from './gridAxis.js';
import { matchResolution } from './matchResolution.js';
import { normaliseVector } from './normaliseVector.js';
import { resampleToGrid } from './resampleToGrid.js';
import { resolutionOf } from './resolutionOf.js';
import { saturatedRanges } from './saturatedRanges.js';
import { savitzkyGolay } from './savitzkyGolay.js';
import { sortAndMerge } from './sortAndMerge.js';
import { subtractBaseline } from './subtractBaseline.js';
import { subtractReference } from './subtractReference.js';
import type { Spectrum } from './types.js';

export interface ProcessSpectrumOptions {
  /**
   * Original spectra of the library entries the recipe names (reference subtraction, EMSC), by entry id;
   * the caller resolves the pinned revision.
   * @default an empty map
   */
  references?: ReadonlyMap<string, Spectrum>;
  /**
   * The file the spectrum came from, named in any error.
   * @default undefined
   */
  file?: string;
  /**
   * 1 per saturated point of `original` (clipped at the absorbance ceiling): grid cells nearer those points
   * are set NaN (not covered), like exclusion windows. @default undefined (none)
   */
  saturated?: Uint8Array;
}

export interface ProcessedSpectrum {
  /** gridLength(grid) values ascending in wavenumber; NaN where not covered. */
  processed: Float64Array;
  /** The fitted scale of the subtracted reference, when the recipe has one. */
  referenceScale?: number;
  /** Each reference of the `subtract` step with its fitted scale and standard error, in recipe order. */
  subtracted?: { id: string; scale: number; standardError: number }[];
  /** The EMSC model coefficients, when the recipe has the step. */
  emscCoefficients?: number[];
}

/**
 * Applies the recipe in its fixed order: sortAndMerge → crop → exclude → ATR correction (sample only, when the
 * recipe has an explicit step; 'auto' is resolved at ingest) → resolution matching (Gaussian convolution to the
 * recipe's target, when it has the step) → multi-reference subtraction (scale, offset
 * and slope; references sorted, cropped and excluded but not baseline-corrected) → baseline → reference subtraction →
 * EMSC → Savitzky–Golay smoothing → resample onto the grid → exclusion windows set NaN on the grid →
 * normalise. Pure and deterministic: the same inputs always give the same bytes, which is what lets the
 * library re-check every stored vector. The input spectrum is not modified.
 *
 * A reference or EMSC spectrum first goes through the same sort, crop, exclusion and baseline steps as the
 * sample, so the fit compares like with like. Smoothing runs separately on each stretch between gaps wider
 * than `resample.maxGap` (the excluded CO₂ window, the holes of a scattered tunable-laser spectrum), so no
 * window mixes data across a gap; a stretch shorter than the window is left unsmoothed. Time-domain
 * entries arrive here already converted to absorbance; `recipe.timeDomain` is applied before, not here, and only
 * widens the gap limit to 1.5 × the spectrum's frequency-bin spacing.
 */
export function processSpectrum(
  original: Spectrum,
  recipe: Recipe,
  grid: Grid,
  options: ProcessSpectrumOptions = {},
): ProcessedSpectrum {
  const file = options.file;
  const where = file === undefined ? {} : { file };
  const references = options.references ?? new Map<string, Spectrum>();
  // A spectrum computed by FFT from time-domain traces is sampled at its frequency-bin spacing: those bins are
  // its data, not holes, so the gap limit must not be tighter than that spacing (short traces give coarse bins).
  const maxGap =
    recipe.timeDomain === null
      ? recipe.resample.maxGap
      : Math.max(recipe.resample.maxGap, 1.5 * medianSpacing(original.wavenumber));
  const raw = (spectrum: Spectrum, label: string | undefined, sample = false): Spectrum => {
    const at = label === undefined ? {} : { file: label };
    let s = sortAndMerge(spectrum, at);
    s = cropToWindow(s, recipe.crop, at);
    s = excludeWindows(s, recipe.exclude, at);
    // Only the sample is ATR-corrected: a reference entry was measured its own way.
    const atr = recipe.atr;
    if (sample && atr !== undefined && atr !== null && atr !== 'auto') {
      s = atrCorrect(s, {
        crystal: atr.crystal,
        ...(atr.crystalIndex === undefined ? {} : { crystalIndex: atr.crystalIndex }),
        sampleIndex: atr.sampleIndex,
        angle: atr.angle,
        referenceWavenumber: atr.referenceWavenumber,
      });
    }
    // The sample's own resolution is pinned in the recipe; a reference's is estimated from its spacing.
    const resolution = recipe.resolution;
    if (resolution !== undefined && resolution !== null) {
      const own = (sample ? resolution.own : undefined) ?? resolutionOf(s).value;
      s = matchResolution(s, { own: Number.isFinite(own) ? own : 0, target: resolution.target, maxGap });
    }
    return s;
  };
  const baseline = (s: Spectrum, label: string | undefined): Spectrum => {
    const at = label === undefined ? {} : { file: label };
    // Version 2 reads λ in wavenumber units, so each file's own spacing sets the per-point penalty.
    const spacing = recipe.version === 1 ? undefined : medianSpacing(s.wavenumber);
    return subtractBaseline(
      s,
      recipe.baseline,
      spacing === undefined || !(spacing > 0) ? at : { ...at, spacing },
    );
  };
  const prepare = (spectrum: Spectrum, label: string | undefined): Spectrum =>
    baseline(raw(spectrum, label), label);
  const found = (id: string, field: string): Spectrum => {
    const spectrum = references.get(id);
    if (spectrum === undefined) {
      throw new BandshelfError(
        'NOT_FOUND',
        `the recipe names library entry "${id}", which was not supplied`,
        { ...where, field },
      );
    }
    return spectrum;
  };
  const lookUp = (id: string, field: string): Spectrum => prepare(found(id, field), `reference ${id}`);

  let spectrum = raw(original, file, true);
  const result: ProcessedSpectrum = { processed: new Float64Array(0) };
  if (recipe.subtract !== undefined) {
    const subtract = recipe.subtract;
    const refs = subtract.references.map((r, k) =>
      raw(found(r.id, `subtract.references.${k}.id`), `reference ${r.id}`),
    );
    const fitted = fitReferences(spectrum, refs, subtract.windows, {
      maxGap,
      ...where,
      ...(subtract.minZ === undefined ? {} : { minZ: subtract.minZ }),
    });
    spectrum = fitted.spectrum;
    result.subtracted = subtract.references.map((r, k) => ({
      id: r.id,
      scale: fitted.scales[k]!,
      standardError: fitted.standardErrors[k]!,
    }));
  }
  spectrum = baseline(spectrum, file);

  if (recipe.reference !== null) {
    const reference = lookUp(recipe.reference.id, 'reference.id');
    const subtracted = subtractReference(spectrum, reference, recipe.reference.window, { maxGap, ...where });
    spectrum = subtracted.spectrum;
    result.referenceScale = subtracted.scale;
  }
  if (recipe.emsc !== null) {
    const reference = lookUp(recipe.emsc.id, 'emsc.id');
    const corrected = emscCorrect(spectrum, reference, { degree: recipe.emsc.degree, maxGap, ...where });
    spectrum = corrected.spectrum;
    result.emscCoefficients = Array.from(corrected.coefficients);
  }
  if (recipe.smooth !== null) {
    const window = smoothingWindowPoints(recipe, spectrum.wavenumber);
    spectrum = smoothBetweenGaps(spectrum, window, recipe.smooth.order, maxGap);
  }

  const method = recipe.resample.method ?? (recipe.version === 1 ? 'cell-or-interpolate' : 'area');
  const vector = resampleToGrid(spectrum, grid, { maxGap, method });
  const masked = [
    ...recipe.exclude,
    ...saturatedRanges(original, { saturated: options.saturated }).map(([min, max]) => ({ min, max })),
  ];
  if (masked.length > 0) {
    const axis = gridAxis(grid);
    for (const w of masked) {
      const lo = Math.min(w.min, w.max);
      const hi = Math.max(w.min, w.max);
      for (let i = 0; i < axis.length; i++) {
        const x = axis[i]!;
        if (x >= lo && x <= hi) vector[i] = Number.NaN;
      }
    }
  }
  result.processed = normaliseVector(vector, recipe.normalise, grid);
  return result;
}

/** Savitzky–Golay smoothing of each run of points whose neighbours are at most maxGap apart. */
function smoothBetweenGaps(spectrum: Spectrum, window: number, order: number, maxGap: number): Spectrum {
  const x = spectrum.wavenumber;
  const y = spectrum.absorbance;
  const n = x.length;
  const out = y.slice();
  let start = 0;
  while (start < n) {
    let end = start;
    while (end + 1 < n && x[end + 1]! - x[end]! <= maxGap) end++;
    if (end - start + 1 >= window) {
      out.set(savitzkyGolay(y.subarray(start, end + 1), { window, order }), start);
    }
    start = end + 1;
  }
  return { wavenumber: x.slice(), absorbance: out };
}

/**
 * The Savitzky–Golay window in points: version 1 takes it as given (default 9 points); version 2 turns the
 * width in cm⁻¹ (default 9 cm⁻¹) into the nearest odd count at the file's median spacing, at least order + 2
 * points (and 3) so the local fit stays a smoother.
 */
function smoothingWindowPoints(recipe: Recipe, wavenumber: Float64Array): number {
  const smooth = recipe.smooth!;
  if (recipe.version === 1) return smooth.window ?? 9;
  const spacing = medianSpacing(wavenumber);
  const points = spacing > 0 ? (smooth.width ?? 9) / spacing : 1;
  let odd = 2 * Math.round((points - 1) / 2) + 1;
  const least = Math.max(3, smooth.order + 2 + ((smooth.order + 1) % 2));
  if (odd < least) odd = least % 2 === 1 ? least : least + 1;
  return Math.min(odd, 101);
}

function medianSpacing(x: Float64Array): number {
  if (x.length < 2) return 0;
  const steps = new Float64Array(x.length - 1);
  for (let i = 1; i < x.length; i++) steps[i - 1] = Math.abs(x[i]! - x[i - 1]!);
  steps.sort();
  return steps[steps.length >> 1]!;
}

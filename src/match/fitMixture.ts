// Mixture fit: the unknown as a non-negative sum of library spectra plus a free-sign polynomial baseline.
import jStatModule from 'jstat';
import { BandshelfError } from '../error.js';
import type { Grid, WavenumberWindow } from '../schema/recipe.js';
import { gridAxis } from '../spectrum/gridAxis.js';
import { gridLength } from '../spectrum/gridLength.js';
import { detectionLimit } from './mixture/detectionLimit.js';
import { forwardSelection } from './mixture/forwardSelection.js';
import { lineShapeTerms } from './mixture/lineShapeTerms.js';
import { polynomialBasis } from './mixture/polynomialBasis.js';
import { residualBands } from './mixture/residualBands.js';
import { residualNoise } from './mixture/residualNoise.js';
import { shareInterval } from './mixture/shareInterval.js';
import type {
  MisfitBand,
  MixtureCandidate,
  MixtureComponent,
  MixtureResult,
  ResidualBand,
  UnselectedCandidate,
} from './types.js';

/**
 * The fit's baseline degree when the caller states none: a quadratic absorbs the offset, slope and bow that differ
 * between benches (a constant offset alone left cross-bench fits picking spurious broad components to mimic a
 * slope), while a higher degree starts to mimic broad bands (liquid water's OH stretch spans ~600 cm⁻¹).
 */
export const DEFAULT_BASELINE_DEGREE = 2;

export interface FitMixtureOptions {
  /**
   * The library grid the query and candidate vectors live on.
   * @default { start: 4000, stop: 600, step: 2 }
   */
  grid?: Grid;
  /**
   * Ids of candidates forced into the fit (the lab's base set: serum proteins, water …); each must be among
   * the candidates.
   * @default []
   */
  with?: readonly string[];
  /**
   * Most library components in the fit, forced ones included (forced ones are kept even beyond it).
   * @default 6
   */
  maxComponents?: number;
  /**
   * Degree of the free-sign polynomial baseline, or null for none (when the recipe already removed the
   * baseline).
   * @default DEFAULT_BASELINE_DEGREE (2)
   */
  baselineDegree?: number | null;
  /**
   * Significance level of the partial F-test each further component must pass.
   * @default 0.01
   */
  alpha?: number;
  /**
   * An extra floor on the fractional drop of the residual sum of squares a further component must give (the F-test
   * decides; this only adds a practical minimum).
   * @default 0
   */
  minImprovement?: number;
  /**
   * Least share of what the fit without a candidate leaves at the candidate's own bands, beyond the noise, that it
   * must explain to be taken in (and to stay in).
   * @default 0.5
   */
  minOwnShare?: number;
  /**
   * Width (cm⁻¹) over which residuals are taken as correlated: the Bartlett bandwidth of the HAC standard error in
   * each selection step.
   * @default DEFAULT_CORRELATION_WIDTH (30)
   */
  correlationWidth?: number;
  /**
   * Let each selected component shift and broaden a little between benches: its first and second derivatives join
   * the fit as free-sign terms (they leave its area, and so its share, unchanged), so a band whose shape differs
   * from the reference's leaves no structured residual for another candidate to fill.
   * @default true
   */
  lineShapeTerms?: boolean;
  /**
   * Fit only inside these windows (cm⁻¹); null fits every point the query covers.
   * @default null
   */
  ranges?: readonly WavenumberWindow[] | null;
  /**
   * A residual peak is an unexplained band when its height and its prominence both exceed k × the local noise.
   * @default 3
   */
  k?: number;
  /**
   * Instrument resolution, cm⁻¹: an unexplained band's FWHM must reach it.
   * @default 4
   */
  resolution?: number;
  /**
   * Savitzky–Golay window (points, quadratic) the residual is smoothed with before its peaks are sought, or 0
   * for none.
   * @default 7
   */
  smoothWindow?: number;
  /**
   * A candidate takes part only if it covers at least this fraction of the query's fit points; the fit then runs
   * over the points every taking part candidate covers.
   * @default 0.95
   */
  minCoverage?: number;
}

/**
 * Residual correlation the selection test allows for, cm⁻¹: wider than a condensed-phase band, so that the misfit
 * a band leaves when unknown and reference come from different benches (shifted, broadened) counts as one
 * correlated stretch rather than as many independent points.
 */
export const DEFAULT_CORRELATION_WIDTH = 30;

/** A residual peak is a fitted component's misfit when that component gives at least this multiple of it there. */
const MISFIT_RATIO = 2;
/** …and has a band maximum of its own within this many FWHM of the residual peak. */
const MISFIT_REACH = 2;

const { jStat } = jStatModule;

const DEFAULT_GRID: Grid = { start: 4000, stop: 600, step: 2 };

function project(v: Float64Array, q: readonly Float64Array[]): Float64Array {
  const out = Float64Array.from(v);
  for (const qi of q) {
    let dot = 0;
    for (let t = 0; t < out.length; t++) dot += qi[t]! * out[t]!;
    for (let t = 0; t < out.length; t++) out[t] = out[t]! - dot * qi[t]!;
  }
  return out;
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let t = 0; t < a.length; t++) s += a[t]! * b[t]!;
  return s;
}

/**
 * Forward selection over `candidates` (the caller passes its top correlation hits plus the forced ids), each
 * step adding the candidate whose non-negative least-squares fit leaves the smallest residual, kept only if a
 * nested-model partial F-test at level `alpha` says it lowers the residual more than noise would (see `rule`).
 *
 * The polynomial baseline has free sign and is projected out (variable projection): the query and every candidate
 * are made orthogonal to the polynomial basis over the fit points, NNLS runs on the projected vectors, and the
 * baseline is the least-squares polynomial of what the components leave — exactly the joint minimum.
 *
 * Candidate vectors must be finite wherever the fit runs: the fit points are those where the query and every
 * forced candidate are covered (inside `ranges`), less the few points some candidate covering at least
 * `minCoverage` of them lacks; candidates covering less are skipped and listed.
 */
export function fitMixture(
  query: ArrayLike<number>,
  candidates: readonly MixtureCandidate[],
  options: FitMixtureOptions = {},
): MixtureResult {
  const grid = options.grid ?? DEFAULT_GRID;
  const forcedIds = [...new Set(options.with ?? [])];
  const maxComponents = options.maxComponents ?? 6;
  const degree = options.baselineDegree === undefined ? DEFAULT_BASELINE_DEGREE : options.baselineDegree;
  const alpha = options.alpha ?? 0.01;
  const minImprovement = options.minImprovement ?? 0;
  const ranges = options.ranges ?? null;
  const k = options.k ?? 3;
  const resolution = options.resolution ?? 4;
  const smoothWindow = options.smoothWindow ?? 7;
  const minCoverage = options.minCoverage ?? 0.95;
  const correlationWidth = options.correlationWidth ?? DEFAULT_CORRELATION_WIDTH;
  const minOwnShare = options.minOwnShare ?? 0.5;
  const withShapes = options.lineShapeTerms ?? true;
  const cols = gridLength(grid);
  checkFitOptions(query.length, cols, maxComponents, alpha, degree);
  const pool = candidatePool(candidates, forcedIds, cols);

  const axis = gridAxis(grid);
  const { at, skipped, taking } = fitPoints(query, pool, forcedIds, { axis, ranges, minCoverage });
  const n = at.length;
  const columnsNeeded = Math.min(maxComponents, pool.length) + (degree === null ? 0 : degree + 1) + 2;
  if (n < columnsNeeded) {
    throw new BandshelfError(
      'SMALL_OVERLAP',
      `the mixture fit has ${n} usable grid points; it needs at least ${columnsNeeded}`,
      { field: 'query' },
    );
  }
  const b = Float64Array.from(at, (i) => query[i]!);
  const usable = taking.map((c) => ({
    candidate: c,
    raw: Float64Array.from(at, (i) => c.vector[i]!),
    forced: forcedIds.includes(c.id),
  }));

  const lo = axis[at[0]!]!;
  const hi = axis[at[n - 1]!]!;
  const centre = (lo + hi) / 2;
  const halfWidth = Math.max((hi - lo) / 2, grid.step);
  const basis =
    degree === null
      ? null
      : polynomialBasis(
          Float64Array.from(at, (i) => (axis[i]! - centre) / halfWidth),
          degree,
        );
  const q = basis?.q ?? [];
  const bp = project(b, q);
  const projected = usable.map((u) => project(u.raw, q));
  // Line-shape terms on the whole grid (so a gap in the fit points is not differentiated across), then taken at them.
  const shapesRaw = usable.map((u) =>
    withShapes
      ? lineShapeTerms(u.candidate.vector, { step: grid.step }).map((v) =>
          Float64Array.from(at, (i) => v[i]!),
        )
      : [],
  );
  const c = usable.length;
  const selection = forwardSelection(
    {
      columns: projected,
      query: bp,
      forced: usable.flatMap((u, i) => (u.forced ? [i] : [])),
      shapes: shapesRaw.map((list) => list.map((v) => project(v, q))),
    },
    {
      alpha,
      maxComponents,
      minImprovement,
      minOwnShare,
      bandwidth: Math.round(correlationWidth / grid.step),
    },
  );
  const { selected } = selection;
  const current = { x: selection.weights, rss: selection.rss };
  const baselineShiftOf =
    basis !== null && degree !== null && degree < 6 && selected.length > 0
      ? baselineShifts({
          u: Float64Array.from(at, (i) => (axis[i]! - centre) / halfWidth),
          degree: degree + 1,
          query: b,
          columns: selected.map((s) => usable[s]!.raw),
          shapes: selected.map((s) => shapesRaw[s]!),
          weights: current.x,
          selected,
          settings: { alpha, bandwidth: Math.round(correlationWidth / grid.step) },
        })
      : new Map<number, number>();
  const modelVariance = (s: number): number => {
    const shift = selection.modelShiftOf.get(s) ?? 0;
    const base = baselineShiftOf.get(s) ?? 0;
    return (shift * shift + base * base) / 3;
  };
  const stopReason =
    selection.rejected === null
      ? selection.stopReason
      : selection.stopReason.replace(
          'candidate',
          `candidate ('${usable[selection.rejected]!.candidate.id}')`,
        );

  const { baseline, fitted, residual, rss, tss } = assembleFit({
    b,
    at,
    cols,
    columns: selected.map((s) => usable[s]!.raw),
    weights: current.x,
    shapes: selection.shapeTerms.map((term) => ({
      raw: shapesRaw[term.column]![term.term]!,
      weight: term.weight,
    })),
    basis: basis === null || degree === null ? null : { ...basis, q, degree, centre, halfWidth },
  });

  const noiseFigures = residualNoise(Float64Array.from(at, (i) => residual[i]!));
  const { components, notSelected } = componentReports({
    usable,
    selected,
    weights: current.x,
    selection,
    modelVariance,
  });

  const peaks = residualBands({ wavenumber: axis, absorbance: residual }, query, {
    k,
    resolution,
    smoothWindow,
  });
  const { bands, misfitBands } = separateMisfits(peaks, components, usable, selected, current.x, at, axis);
  const rule = ruleText({
    candidates: c,
    degree,
    defaultDegree: options.baselineDegree === undefined,
    minOwnShare,
    correlationWidth,
    alpha,
    maxComponents,
    withShapes,
    k,
    resolution,
  });

  return {
    components,
    r2: tss > 0 ? 1 - rss / tss : Number.NaN,
    rss,
    baseline,
    fitted,
    residual,
    noise: noiseFigures.sigma,
    noiseSource: 'residual-differences',
    noiseLag1: noiseFigures.lag1,
    effectivePoints: n / noiseFigures.inflation,
    alpha,
    rule,
    notSelected,
    k,
    residualBands: bands,
    misfitBands,
    points: n,
    span: { min: lo, max: hi },
    criterion: rule,
    stopReason,
    skipped,
  };
}

/** Splits residual peaks into unexplained bands and misfits of the fitted components' own bands. */
function separateMisfits(
  peaks: readonly ResidualBand[],
  components: readonly MixtureComponent[],
  usable: readonly { candidate: MixtureCandidate; raw: Float64Array }[],
  selected: readonly number[],
  weights: Float64Array,
  at: readonly number[],
  axis: ArrayLike<number>,
): { bands: ResidualBand[]; misfitBands: MisfitBand[] } {
  const kept = new Set(components.map((c) => c.id));
  const bands: ResidualBand[] = [];
  const misfitBands: MisfitBand[] = [];
  for (const peak of peaks) {
    let t = 0;
    for (let j = 1; j < at.length; j++) {
      if (Math.abs(axis[at[j]!]! - peak.position) < Math.abs(axis[at[t]!]! - peak.position)) t = j;
    }
    let owner: { id: string; contribution: number } | null = null;
    // Within MISFIT_REACH × the peak's FWHM the component must have a band maximum of its own: a narrow residual
    // band on the wing of a broad one (a drug's band on water's combination band) is not that band's misfit.
    const reach = Math.max(
      2,
      Math.ceil(
        (MISFIT_REACH * peak.fwhm) / Math.max(1e-9, Math.abs(axis[at[1] ?? at[0]!]! - axis[at[0]!]!)),
      ),
    );
    selected.forEach((s, j) => {
      const id = usable[s]!.candidate.id;
      const raw = usable[s]!.raw;
      const contribution = weights[j]! * raw[t]!;
      if (!kept.has(id) || !(contribution >= MISFIT_RATIO * Math.abs(peak.height))) return;
      if (!hasMaximumNear(raw, t, reach)) return;
      if (owner === null || contribution > owner.contribution) owner = { id, contribution };
    });
    const found = owner as { id: string; contribution: number } | null;
    if (found === null) bands.push(peak);
    else {
      misfitBands.push({
        position: peak.position,
        height: peak.height,
        component: found.id,
        contribution: found.contribution,
      });
    }
  }
  return { bands, misfitBands };
}

/** A local maximum of `v` within ±`reach` points of `t` (the ends of the fit do not count). */
function hasMaximumNear(v: Float64Array, t: number, reach: number): boolean {
  for (let i = Math.max(1, t - reach); i <= Math.min(v.length - 2, t + reach); i++) {
    if (v[i]! >= v[i - 1]! && v[i]! > v[i + 1]!) return true;
  }
  return false;
}

/** Refuses a query off the grid and options outside their ranges (BAD_OPTION naming the option). */
function checkFitOptions(
  queryLength: number,
  cols: number,
  maxComponents: number,
  alpha: number,
  degree: number | null,
): void {
  if (queryLength !== cols) {
    throw new BandshelfError('BAD_OPTION', `the query has ${queryLength} points; the grid has ${cols}`, {
      field: 'query',
    });
  }
  if (!(Number.isInteger(maxComponents) && maxComponents >= 1)) {
    throw new BandshelfError(
      'BAD_OPTION',
      `max components must be a whole number ≥ 1, not ${maxComponents}`,
      {
        field: 'maxComponents',
      },
    );
  }
  if (!(alpha > 0 && alpha < 1)) {
    throw new BandshelfError('BAD_OPTION', `the significance level must lie between 0 and 1, not ${alpha}`, {
      field: 'alpha',
    });
  }
  if (degree !== null && !(Number.isInteger(degree) && degree >= 0 && degree <= 6)) {
    throw new BandshelfError('BAD_OPTION', `the baseline degree must be 0–6 or none, not ${degree}`, {
      field: 'baselineDegree',
    });
  }
}

/** One candidate per id (the first occurrence wins), each on the grid; every forced id must be among them. */
function candidatePool(
  candidates: readonly MixtureCandidate[],
  forcedIds: readonly string[],
  cols: number,
): MixtureCandidate[] {
  // One entry per id; the first occurrence wins.
  const pool: MixtureCandidate[] = [];
  const seen = new Set<string>();
  for (const c of candidates) {
    if (c.vector.length !== cols) {
      throw new BandshelfError(
        'BAD_OPTION',
        `candidate '${c.id}' has ${c.vector.length} points; the grid has ${cols}`,
        {
          field: 'candidates',
        },
      );
    }
    if (!seen.has(c.id)) {
      seen.add(c.id);
      pool.push(c);
    }
  }
  for (const id of forcedIds) {
    if (!seen.has(id)) {
      throw new BandshelfError('NOT_FOUND', `no library entry '${id}' to force into the mixture`, {
        field: 'with',
      });
    }
  }
  return pool;
}

/**
 * The fit points: covered by the query (inside the ranges) and by every forced candidate; then narrowed to what
 * every candidate that covers nearly all of them covers too, so a reference missing a few edge points still takes
 * part while one covering only part of the range (a tunable-laser entry) is left out.
 */
function fitPoints(
  query: ArrayLike<number>,
  pool: readonly MixtureCandidate[],
  forcedIds: readonly string[],
  settings: { axis: ArrayLike<number>; ranges: readonly WavenumberWindow[] | null; minCoverage: number },
): { at: number[]; skipped: string[]; taking: MixtureCandidate[] } {
  const { axis, ranges, minCoverage } = settings;
  const cols = query.length;
  const forced = pool.filter((c) => forcedIds.includes(c.id));
  const inRanges = (x: number): boolean => ranges === null || ranges.some((w) => x >= w.min && x <= w.max);
  let at: number[] = [];
  for (let i = 0; i < cols; i++) {
    if (!Number.isFinite(query[i]!) || !inRanges(axis[i]!)) continue;
    if (forced.some((c) => !Number.isFinite(c.vector[i]!))) continue;
    at.push(i);
  }
  const skipped: string[] = [];
  const taking: MixtureCandidate[] = [];
  for (const c of pool) {
    let covered = 0;
    for (const i of at) if (Number.isFinite(c.vector[i]!)) covered++;
    if (forcedIds.includes(c.id) || covered >= minCoverage * at.length) taking.push(c);
    else skipped.push(c.id);
  }
  at = at.filter((i) => taking.every((c) => Number.isFinite(c.vector[i]!)));
  return { at, skipped, taking };
}

/** The selection, uncertainty, detection-limit and residual-band rules in words, for reports. */
function ruleText(settings: {
  candidates: number;
  degree: number | null;
  defaultDegree: boolean;
  minOwnShare: number;
  correlationWidth: number;
  alpha: number;
  maxComponents: number;
  withShapes: boolean;
  k: number;
  resolution: number;
}): string {
  const {
    candidates: c,
    degree,
    minOwnShare,
    correlationWidth,
    alpha,
    maxComponents,
    withShapes,
    k,
    resolution,
  } = settings;
  const baselineText =
    degree === null
      ? 'no baseline'
      : `a free-sign polynomial baseline of degree ${degree}${settings.defaultDegree ? ' (the default: it absorbs offset, slope and bow between benches without mimicking broad bands)' : ''}`;
  return (
    `stepwise selection from ${c} candidate(s) with ${baselineText}: at each step every remaining candidate is ` +
    `tried; one is taken in only if (1) it explains at least ${(100 * minOwnShare).toFixed(0)} % of what the fit without it leaves at its own ` +
    `bands beyond the noise (a compound present accounts for its bands; one that only trims another component's ` +
    `misfit does not), and (2) a one-sided z-test of its weight, with a Newey–West (HAC, Bartlett, ` +
    `${correlationWidth} cm⁻¹) standard error robust to correlated and unequal residuals, rejects 0 at α = ${alpha} ` +
    `after a Bonferroni correction for the number of candidates tried; a component a later one makes fail (1) is ` +
    `left out again` +
    `${maxComponents < c ? `; at most ${maxComponents} components` : ''}. ` +
    `${withShapes ? "Each selected component's first and second derivatives join the fit as free-sign terms, so its bands may shift and broaden a little between benches without leaving a residual for another candidate (they leave its area unchanged). " : ''}` +
    `Each weight's standard error combines a Newey–West (HAC, Bartlett, ${correlationWidth} cm⁻¹) error from the final ` +
    `residual (structure the model leaves widens it) with the model's parts: the weight's change ${[withShapes ? 'when the line-shape terms are left out' : '', degree !== null && degree < 6 ? 'when the baseline is one degree higher' : ''].filter((t) => t !== '').join(' and ') || '(none)'}, each taken as the half-width of a rectangular distribution (÷√3, GUM); ` +
    `the 95 % interval is ± 1.96 of it (normal reference); a component whose interval reaches 0 is not ` +
    `significant. The share's 95 % interval propagates the weights' HAC covariance (model parts independent) to ` +
    `area × weight / Σ area × weight to first order (delta method); the share is of the processed signal over the fit ` +
    `points (each reference as the recipe leaves it), not of the raw absorbance before the recipe's baseline step. Detection limit 3.3 σ/S (ICH Q2(R1)) with σ/S that standard error, S the ` +
    `component's sensitivity net of the others, their line-shape terms and the baseline. Unexplained bands: residual maxima above ` +
    `${k} × the local noise (±100 cm⁻¹, robust σ of first differences) with FWHM ≥ ${resolution} cm⁻¹, ` +
    `none at the fit's edges; a residual peak where a fitted component gives at least ${MISFIT_RATIO} × the residual ` +
    `and that has a band maximum within ${MISFIT_REACH} × the peak's FWHM is that component's band differing in shape or position ` +
    `between benches, listed apart, not as unexplained.`
  );
}

/**
 * The final model on the fit points from the original (unprojected) columns, so the reported residual is exact: the
 * weighted components and line-shape terms, then the least-squares polynomial of what they leave (in the orthonormal
 * basis, back-substituted to the plain powers of u). Fitted and residual are on the whole grid, NaN off the fit points.
 */
function assembleFit(input: {
  b: Float64Array;
  at: readonly number[];
  cols: number;
  columns: readonly Float64Array[];
  weights: ArrayLike<number>;
  shapes: readonly { raw: Float64Array; weight: number }[];
  basis: {
    q: readonly Float64Array[];
    r: ArrayLike<number>;
    degree: number;
    centre: number;
    halfWidth: number;
  } | null;
}): {
  baseline: MixtureResult['baseline'];
  fitted: Float64Array;
  residual: Float64Array;
  rss: number;
  tss: number;
} {
  const { b, at, cols, columns, weights, shapes, basis } = input;
  const n = at.length;
  const model = new Float64Array(n);
  for (let s = 0; s < columns.length; s++) {
    const w = weights[s]!;
    if (w === 0) continue;
    const raw = columns[s]!;
    for (let t = 0; t < n; t++) model[t] = model[t]! + w * raw[t]!;
  }
  for (const shape of shapes) {
    for (let t = 0; t < n; t++) model[t] = model[t]! + shape.weight * shape.raw[t]!;
  }
  let baseline: MixtureResult['baseline'] = null;
  if (basis !== null) {
    const { q, degree, centre, halfWidth } = basis;
    const left = Float64Array.from(b, (v, t) => v - model[t]!);
    const m = degree + 1;
    const coefQ = q.map((qi) => dot(qi, left));
    for (let j = 0; j < m; j++) {
      const qj = q[j]!;
      for (let t = 0; t < n; t++) model[t] = model[t]! + coefQ[j]! * qj[t]!;
    }
    // P·(R⁻¹ c) = Q·c: back-substitute for the coefficients of the plain powers of u.
    const power = new Float64Array(m);
    for (let i = m - 1; i >= 0; i--) {
      let sum = coefQ[i]!;
      for (let j = i + 1; j < m; j++) sum -= basis.r[i * m + j]! * power[j]!;
      power[i] = sum / basis.r[i * m + i]!;
    }
    baseline = { degree, coefficients: Array.from(power), centre, halfWidth };
  }
  const fitted = new Float64Array(cols).fill(Number.NaN);
  const residual = new Float64Array(cols).fill(Number.NaN);
  let rss = 0;
  let mean = 0;
  for (let t = 0; t < n; t++) mean += b[t]!;
  mean /= n;
  let tss = 0;
  for (let t = 0; t < n; t++) {
    const i = at[t]!;
    fitted[i] = model[t]!;
    const r = b[t]! - model[t]!;
    residual[i] = r;
    rss += r * r;
    tss += (b[t]! - mean) ** 2;
  }

  return { baseline, fitted, residual, rss, tss };
}

/**
 * The kept components, each with its share, standard error, intervals, significance, detection limit and "not told
 * apart" alternatives, and the offered candidates not kept, each with the detection limit it would have had.
 */
function componentReports(input: {
  usable: readonly { candidate: MixtureCandidate; raw: Float64Array; forced: boolean }[];
  selected: readonly number[];
  weights: Float64Array;
  selection: ReturnType<typeof forwardSelection>;
  modelVariance: (s: number) => number;
}): { components: MixtureComponent[]; notSelected: UnselectedCandidate[] } {
  const { usable, selected, selection, modelVariance } = input;
  const current = { x: input.weights };
  const absArea = (v: Float64Array): number => v.reduce((sum, x) => sum + Math.abs(x), 0);
  const area = selected.map((s, j) => current.x[j]! * absArea(usable[s]!.raw));
  const signal = area.reduce((sum, a) => sum + a, 0);
  // Weight ± z₀.₉₇₅ × its HAC standard error (normal reference, many points); ICH's σ/S of a weight is that error.
  const z975 = jStat.normal.inv(0.975, 0, 1);
  const uncertaintyOf = (s: number, weight: number) => {
    const noiseError = selection.standardErrorOf.get(s) ?? Number.POSITIVE_INFINITY;
    // The model parts (line shape, baseline) each as a rectangular distribution of half-width |shift|
    // (u = shift/√3, GUM JCGM 100:2008 §4.3.7).
    const standardError = Math.sqrt(noiseError * noiseError + modelVariance(s));
    const sensitivity = selection.sensitivityOf.get(s) ?? 0;
    const low = weight - z975 * standardError;
    return {
      standardError,
      interval: [Math.max(0, low), weight + z975 * standardError] as [number, number],
      significant: Number.isFinite(low) && low > 0,
      sensitivity,
      sigma: noiseError * sensitivity,
    };
  };
  // The share's interval: the weights' HAC covariance with each one's model part added to its own variance (the
  // line-shape parts of different components are taken as independent), propagated to area·w / Σ area·w.
  const p = selected.length;
  const covariance = Float64Array.from(selection.covariance);
  selected.forEach((s, j) => {
    covariance[j * p + j] = covariance[j * p + j]! + modelVariance(s);
  });
  const shares = shareInterval({
    weights: current.x,
    areas: selected.map((s) => absArea(usable[s]!.raw)),
    covariance,
  });
  const components: MixtureComponent[] = [];
  selected.forEach((s, j) => {
    const u = usable[s]!;
    const weight = current.x[j]!;
    // A non-forced component a later one made redundant (weight 0) explains nothing: leave it out.
    if (weight === 0 && !u.forced) return;
    const w = uncertaintyOf(s, weight);
    const component: MixtureComponent = {
      id: u.candidate.id,
      revision: u.candidate.revision,
      weight,
      share: signal > 0 ? area[j]! / signal : 0,
      shareInterval95: shares[j]!.interval,
      forced: u.forced,
      improvement: selection.improvementOf.get(s) ?? null,
      pValue: selection.pValueOf.get(s) ?? null,
      standardError: w.standardError,
      interval95: w.interval,
      significant: w.significant,
      detectionLimit: detectionLimit({
        sigma: w.sigma,
        sensitivity: w.sensitivity,
        area: absArea(u.raw),
        signal,
      }),
    };
    if (u.candidate.name !== undefined) component.name = u.candidate.name;
    if (u.candidate.class !== undefined) component.class = u.candidate.class;
    const alternatives = selection.alternativesOf.get(s);
    if (alternatives !== undefined) component.alternatives = alternatives.map((i) => usable[i]!.candidate.id);
    components.push(component);
  });
  const notSelected: UnselectedCandidate[] = [];
  const listed = new Set(selected.map((s) => usable[s]!.candidate.id));
  usable.forEach((u, i) => {
    if (listed.has(u.candidate.id)) return;
    listed.add(u.candidate.id);
    // Its detection limit were it added to the final fit: what the others, their line-shape terms and the baseline
    // cannot mimic, against the final residual.
    const w = uncertaintyOf(i, 0);
    const entry: UnselectedCandidate = {
      id: u.candidate.id,
      revision: u.candidate.revision,
      detectionLimit: detectionLimit({
        sigma: w.sigma,
        sensitivity: w.sensitivity,
        area: absArea(u.raw),
        signal,
      }),
    };
    if (u.candidate.name !== undefined) entry.name = u.candidate.name;
    if (u.candidate.class !== undefined) entry.class = u.candidate.class;
    notSelected.push(entry);
  });

  return { components, notSelected };
}

/**
 * The baseline's part of each weight's uncertainty: how far it moves when the same components (with their line-shape
 * terms) are fitted again with a baseline one degree higher — a bench's baseline is no polynomial of any stated degree.
 * Keyed by the selected column.
 */
function baselineShifts(input: {
  u: Float64Array;
  degree: number;
  query: Float64Array;
  columns: readonly Float64Array[];
  shapes: readonly (readonly Float64Array[])[];
  weights: ArrayLike<number>;
  selected: readonly number[];
  settings: { alpha: number; bandwidth: number };
}): Map<number, number> {
  const higher = polynomialBasis(input.u, input.degree).q;
  const refit = forwardSelection(
    {
      columns: input.columns.map((v) => project(v, higher)),
      query: project(input.query, higher),
      forced: input.columns.map((_, j) => j),
      shapes: input.shapes.map((list) => list.map((v) => project(v, higher))),
    },
    { ...input.settings, maxComponents: input.columns.length },
  );
  const shifts = new Map<number, number>();
  input.selected.forEach((s, j) => {
    shifts.set(s, Math.abs(refit.weights[j]! - input.weights[j]!));
  });
  return shifts;
}

// Mixture fit: the unknown as a non-negative sum of library spectra plus a free-sign polynomial baseline.
import { BandshelfError } from '../error.js';
import type { Grid, WavenumberWindow } from '../schema/recipe.js';
import { findPeaks } from '../spectrum/findPeaks.js';
import { gridAxis } from '../spectrum/gridAxis.js';
import { gridLength } from '../spectrum/gridLength.js';
import { noiseLevel } from '../spectrum/noiseLevel.js';
import { savitzkyGolay } from '../spectrum/savitzkyGolay.js';
import { nnlsNormal } from './nnlsNormal.js';
import type { MixtureCandidate, MixtureComponent, MixtureResult, ResidualBand } from './types.js';

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
   * @default 1
   */
  baselineDegree?: number | null;
  /**
   * A further component is kept only if it lowers the residual sum of squares by at least this fraction of
   * the current one.
   * @default 0.01
   */
  minImprovement?: number;
  /**
   * Fit only inside these windows (cm⁻¹); null fits every point the query covers.
   * @default null
   */
  ranges?: readonly WavenumberWindow[] | null;
  /**
   * The band-free window the noise level is measured in.
   * @default { min: 1900, max: 2000 }
   */
  noiseWindow?: WavenumberWindow;
  /**
   * A residual peak is an unexplained band when its height and its prominence both exceed k × noise.
   * @default 3
   */
  k?: number;
  /**
   * Narrowest residual peak (FWHM, cm⁻¹) that counts as a band: white noise makes one- or two-point maxima above
   * 3σ every few hundred points, while an absorption band spans several grid points.
   * @default 2 × grid step
   */
  minBandWidth?: number;
  /**
   * Savitzky–Golay window (points, quadratic) the residual is smoothed with before its peaks are sought, or 0
   * for none. A light smooth suppresses single-point noise maxima far more than bands several points wide, so a
   * k × noise threshold (noise of the unsmoothed data) then rarely fires on noise alone.
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

const DEFAULT_GRID: Grid = { start: 4000, stop: 600, step: 2 };

/** Orthonormal basis (modified Gram–Schmidt) of 1, u, …, u^d over the fit points, and R with P = Q·R. */
function polynomialBasis(u: Float64Array, degree: number): { q: Float64Array[]; r: Float64Array } {
  const m = degree + 1;
  const q: Float64Array[] = [];
  const r = new Float64Array(m * m);
  for (let j = 0; j < m; j++) {
    const v = Float64Array.from(u, (x) => x ** j);
    for (let i = 0; i < j; i++) {
      const qi = q[i]!;
      let dot = 0;
      for (let t = 0; t < v.length; t++) dot += qi[t]! * v[t]!;
      r[i * m + j] = dot;
      for (let t = 0; t < v.length; t++) v[t] = v[t]! - dot * qi[t]!;
    }
    let norm = 0;
    for (let t = 0; t < v.length; t++) norm += v[t]! * v[t]!;
    norm = Math.sqrt(norm);
    r[j * m + j] = norm;
    for (let t = 0; t < v.length; t++) v[t] = v[t]! / norm;
    q.push(v);
  }
  return { q, r };
}

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
 * step adding the candidate whose non-negative least-squares fit leaves the smallest residual.
 *
 * Stop criterion: a candidate is kept only if its weight is > 0 and it lowers the residual sum of squares by at
 * least `minImprovement` (1 %) of the previous value; selection also stops at `maxComponents`.
 *
 * The polynomial baseline has free sign. It is not split into ± columns; it is projected out instead (variable
 * projection): the query and every candidate are made orthogonal to the polynomial basis over the fit points,
 * NNLS runs on the projected vectors, and the baseline is then the least-squares polynomial of what the
 * components leave. This gives exactly the minimum of the joint problem (a free-sign block separates), with
 * fewer unknowns for NNLS.
 *
 * Candidate vectors must be finite wherever the fit runs: the fit points are those where the query and every
 * forced candidate are covered (inside `ranges`), less the few points some candidate covering at least
 * `minCoverage` of them lacks; candidates covering less are skipped and listed.
 * Unexplained bands: maxima of the lightly smoothed residual (`smoothWindow`) whose height and prominence exceed
 * k × noise and whose FWHM is at least `minBandWidth`. Noise: RMS after linear detrend of the residual inside `noiseWindow` (H1's noiseLevel); when the fit does not
 * reach that window, the robust σ of the residual's second differences (median |Δ²r| / (0.6745 √6)) instead.
 */
export function fitMixture(
  query: ArrayLike<number>,
  candidates: readonly MixtureCandidate[],
  options: FitMixtureOptions = {},
): MixtureResult {
  const grid = options.grid ?? DEFAULT_GRID;
  const forcedIds = [...new Set(options.with ?? [])];
  const maxComponents = options.maxComponents ?? 6;
  const degree = options.baselineDegree === undefined ? 1 : options.baselineDegree;
  const minImprovement = options.minImprovement ?? 0.01;
  const ranges = options.ranges ?? null;
  const noiseWindow = options.noiseWindow ?? { min: 1900, max: 2000 };
  const k = options.k ?? 3;
  const minBandWidth = options.minBandWidth ?? 2 * grid.step;
  const smoothWindow = options.smoothWindow ?? 7;
  const minCoverage = options.minCoverage ?? 0.95;
  const cols = gridLength(grid);
  if (query.length !== cols) {
    throw new BandshelfError('BAD_OPTION', `the query has ${query.length} points; the grid has ${cols}`, {
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
  if (degree !== null && !(Number.isInteger(degree) && degree >= 0 && degree <= 6)) {
    throw new BandshelfError('BAD_OPTION', `the baseline degree must be 0–6 or none, not ${degree}`, {
      field: 'baselineDegree',
    });
  }
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
  const forced = pool.filter((c) => forcedIds.includes(c.id));

  // The fit points: covered by the query (inside the ranges) and by every forced candidate; then narrowed to
  // what every candidate that covers nearly all of them covers too, so a reference missing a few edge points
  // still takes part while one covering only part of the range (a tunable-laser entry) is left out.
  const axis = gridAxis(grid);
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
  const c = usable.length;
  const gram = new Float64Array(c * c);
  const atb = new Float64Array(c);
  for (let i = 0; i < c; i++) {
    atb[i] = dot(projected[i]!, bp);
    for (let j = 0; j <= i; j++) {
      const g = dot(projected[i]!, projected[j]!);
      gram[i * c + j] = g;
      gram[j * c + i] = g;
    }
  }
  const btb = dot(bp, bp);

  /** NNLS over a subset of the usable candidates; RSS from the normal equations (cheap, for selection). */
  const solve = (subset: readonly number[]): { x: Float64Array; rss: number } => {
    const p = subset.length;
    if (p === 0) return { x: new Float64Array(0), rss: btb };
    const g = new Float64Array(p * p);
    const r = new Float64Array(p);
    for (let i = 0; i < p; i++) {
      r[i] = atb[subset[i]!]!;
      for (let j = 0; j < p; j++) g[i * p + j] = gram[subset[i]! * c + subset[j]!]!;
    }
    const { x } = nnlsNormal({ gram: g, atb: r });
    let rss = btb;
    for (let i = 0; i < p; i++) {
      rss -= 2 * x[i]! * r[i]!;
      for (let j = 0; j < p; j++) rss += x[i]! * g[i * p + j]! * x[j]!;
    }
    return { x, rss: Math.max(0, rss) };
  };

  const selected: number[] = [];
  const improvementOf = new Map<number, number>();
  for (let i = 0; i < c; i++) if (usable[i]!.forced) selected.push(i);
  let current = solve(selected);
  let stopReason = '';
  while (true) {
    if (selected.length >= maxComponents) {
      stopReason = `reached the maximum of ${maxComponents} components`;
      break;
    }
    if (current.rss <= 1e-24 * Math.max(btb, 1e-300)) {
      stopReason = 'the fit is exact';
      break;
    }
    let best = -1;
    let bestFit: { x: Float64Array; rss: number } | null = null;
    for (let i = 0; i < c; i++) {
      if (selected.includes(i)) continue;
      const trial = solve([...selected, i]);
      if (!(trial.x[selected.length]! > 0)) continue;
      if (bestFit === null || trial.rss < bestFit.rss) {
        best = i;
        bestFit = trial;
      }
    }
    if (bestFit === null) {
      stopReason =
        c === selected.length ? 'no candidates left' : 'no further candidate gets a positive weight';
      break;
    }
    const improvement = (current.rss - bestFit.rss) / current.rss;
    if (improvement < minImprovement) {
      stopReason = `the best further candidate ('${usable[best]!.candidate.id}') lowers the residual sum of squares by only ${(100 * improvement).toFixed(2)} % (< ${(100 * minImprovement).toFixed(2)} %)`;
      break;
    }
    selected.push(best);
    improvementOf.set(best, improvement);
    current = bestFit;
  }

  // Final vectors on the fit points from the original (unprojected) columns, so the reported residual is exact.
  const model = new Float64Array(n);
  for (let s = 0; s < selected.length; s++) {
    const w = current.x[s]!;
    if (w === 0) continue;
    const raw = usable[selected[s]!]!.raw;
    for (let t = 0; t < n; t++) model[t] = model[t]! + w * raw[t]!;
  }
  let baseline: MixtureResult['baseline'] = null;
  if (basis !== null && degree !== null) {
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

  const components: MixtureComponent[] = [];
  let signal = 0;
  const area = selected.map((s, j) => {
    const raw = usable[s]!.raw;
    let sum = 0;
    for (let t = 0; t < n; t++) sum += Math.abs(raw[t]!);
    const a = current.x[j]! * sum;
    signal += a;
    return a;
  });
  selected.forEach((s, j) => {
    const u = usable[s]!;
    const weight = current.x[j]!;
    // A non-forced component a later one made redundant (weight 0) explains nothing: leave it out.
    if (weight === 0 && !u.forced) return;
    const component: MixtureComponent = {
      id: u.candidate.id,
      revision: u.candidate.revision,
      weight,
      share: signal > 0 ? area[j]! / signal : 0,
      forced: u.forced,
      improvement: improvementOf.get(s) ?? null,
    };
    if (u.candidate.name !== undefined) component.name = u.candidate.name;
    if (u.candidate.class !== undefined) component.class = u.candidate.class;
    components.push(component);
  });

  const residualSpectrum = { wavenumber: axis, absorbance: residual };
  let noise = noiseLevel(residualSpectrum, noiseWindow);
  let noiseSource: MixtureResult['noiseSource'] = 'band-free-window';
  if (!(noise > 0)) {
    noiseSource = 'residual-differences';
    const d2: number[] = [];
    for (let i = 1; i < cols - 1; i++) {
      const v = residual[i - 1]! - 2 * residual[i]! + residual[i + 1]!;
      if (Number.isFinite(v)) d2.push(Math.abs(v));
    }
    d2.sort((x, y) => x - y);
    const median = d2.length === 0 ? 0 : d2[d2.length >> 1]!;
    noise = median / (0.6745 * Math.sqrt(6));
  }
  const threshold = k * noise;
  const searched =
    smoothWindow >= 3 ? savitzkyGolay(residual, { window: smoothWindow, order: 2, derivative: 0 }) : residual;
  const residualBands: ResidualBand[] =
    threshold > 0
      ? findPeaks({ wavenumber: axis, absorbance: searched }, { minProminence: threshold })
          .filter((p) => p.height > threshold && p.fwhm >= minBandWidth)
          .map((p) => ({ position: p.position, height: p.height, prominence: p.prominence, fwhm: p.fwhm }))
      : [];

  return {
    components,
    r2: tss > 0 ? 1 - rss / tss : Number.NaN,
    rss,
    baseline,
    fitted,
    residual,
    noise,
    noiseSource,
    k,
    residualBands,
    points: n,
    span: { min: lo, max: hi },
    criterion:
      `forward selection from ${c} candidate(s): a component is kept only if its weight is > 0 and it lowers the ` +
      `residual sum of squares by at least ${(100 * minImprovement).toFixed(2)} % of the previous value; ` +
      `at most ${maxComponents} components; baseline ${degree === null ? 'none' : `polynomial of degree ${degree}, free sign`}`,
    stopReason,
    skipped,
  };
}

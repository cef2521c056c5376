// Forward selection of mixture components by a nested-model partial F-test against the fit's own residual.
import { nnlsNormal } from '../nnlsNormal.js';
import { hacScoreTest } from './hacScoreTest.js';
import { invertSymmetric } from './invertSymmetric.js';
import { ownBandShare } from './ownBandShare.js';
import { residualNoise } from './residualNoise.js';

export interface ForwardSelectionInput {
  /** Baseline-projected candidate columns over the fit points. */
  columns: readonly Float64Array[];
  /** Baseline-projected query over the fit points. */
  query: Float64Array;
  /** Indices of columns forced in. */
  forced: readonly number[];
}

export interface ForwardSelectionOptions {
  /** Significance level of each step's partial F-test. @default 0.01 */
  alpha?: number;
  /** Most components, forced ones included. @default 6 */
  maxComponents?: number;
  /** A further floor on the fractional drop of the residual sum of squares. @default 0 */
  minImprovement?: number;
  /** Bartlett bandwidth (points) of the HAC standard error each step's test uses. @default 0 */
  bandwidth?: number;
  /**
   * Least share of the residual at a column's own bands, beyond the noise, that the column must explain to be taken
   * in (and to stay in when later ones join). @default 0.5
   */
  minOwnShare?: number;
}

export interface ForwardSelection {
  selected: number[];
  /** NNLS weights in the order of `selected`. */
  weights: Float64Array;
  rss: number;
  /** Gram matrix and AᵀB of all columns (row-major), for the uncertainty of the final fit. */
  gram: Float64Array;
  /** Bonferroni-adjusted one-sided p-value of each selected column's step. */
  pValueOf: Map<number, number>;
  improvementOf: Map<number, number>;
  /** Own-band share of each selected column in the final fit (see ownBandShare). */
  shareOf: Map<number, number>;
  /** Columns taken in and later left out because a newcomer explained their bands, with their last share. */
  dropped: { index: number; share: number }[];
  stopReason: string;
  /** The column the last test turned down, or null. */
  rejected: number | null;
}

const dot = (a: Float64Array, b: Float64Array): number => {
  let s = 0;
  for (let t = 0; t < a.length; t++) s += a[t]! * b[t]!;
  return s;
};

/**
 * Each step tries every remaining column with the selected ones (NNLS) and takes the lowest residual with a positive
 * weight; it is kept only if the partial F-test of "its weight is 0" rejects at `alpha`, with the residual's AR(1)
 * inflation measured on the larger model's residual (so unmodelled structure makes the test stricter, not looser).
 */
export function forwardSelection(
  input: ForwardSelectionInput,
  options: ForwardSelectionOptions = {},
): ForwardSelection {
  const alpha = options.alpha ?? 0.01;
  const maxComponents = options.maxComponents ?? 6;
  const minImprovement = options.minImprovement ?? 0;
  const bandwidth = options.bandwidth ?? 0;
  const minOwnShare = options.minOwnShare ?? 0.5;
  const { columns, query } = input;
  const c = columns.length;
  const n = query.length;
  const gram = new Float64Array(c * c);
  const atb = new Float64Array(c);
  for (let i = 0; i < c; i++) {
    atb[i] = dot(columns[i]!, query);
    for (let j = 0; j <= i; j++) {
      const g = dot(columns[i]!, columns[j]!);
      gram[i * c + j] = g;
      gram[j * c + i] = g;
    }
  }
  const btb = dot(query, query);
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
  const residualOf = (subset: readonly number[], x: Float64Array): Float64Array => {
    const r = Float64Array.from(query);
    subset.forEach((s, j) => {
      const col = columns[s]!;
      for (let t = 0; t < n; t++) r[t] = r[t]! - x[j]! * col[t]!;
    });
    return r;
  };

  // The part of column i that the columns of `subset` cannot mimic (least squares over the fit points).
  const unmimicked = (i: number, subset: readonly number[]): Float64Array => {
    const d = Float64Array.from(columns[i]!);
    const p = subset.length;
    if (p === 0) return d;
    const g = new Float64Array(p * p);
    for (let a = 0; a < p; a++) for (let z = 0; z < p; z++) g[a * p + z] = gram[subset[a]! * c + subset[z]!]!;
    const inverse = invertSymmetric(g, p);
    if (inverse === null) return new Float64Array(n);
    for (let a = 0; a < p; a++) {
      let coef = 0;
      for (let z = 0; z < p; z++) coef += inverse[a * p + z]! * gram[subset[z]! * c + i]!;
      const col = columns[subset[a]!]!;
      for (let t = 0; t < n; t++) d[t] = d[t]! - coef * col[t]!;
    }
    return d;
  };

  interface Trial {
    index: number;
    fit: { x: Float64Array; rss: number };
    z: number;
    pValue: number;
    share: number;
  }
  // Column i added to `base` (whose fit is `baseFit`): its NNLS fit, HAC z and own-band share; null without a
  // positive weight.
  const evaluate = (i: number, base: readonly number[], baseFit: { x: Float64Array }): Trial | null => {
    const set = [...base, i];
    const fit = solve(set);
    if (!(fit.x[base.length]! > 0)) return null;
    const active = base.filter((_, j) => fit.x[j]! > 0);
    const after = residualOf(set, fit.x);
    const test = hacScoreTest({ direction: unmimicked(i, active), query, residual: after }, { bandwidth });
    if (!(test.estimate > 0)) return null;
    const share = ownBandShare({
      column: columns[i]!,
      without: residualOf(base, baseFit.x),
      with: after,
      noiseSigma: residualNoise(after).sigma,
    });
    return { index: i, fit, z: test.z, pValue: test.pValue, share };
  };

  const forcedSet = new Set(input.forced);
  const selected = [...input.forced];
  const excluded = new Set<number>();
  const pValueOf = new Map<number, number>();
  const improvementOf = new Map<number, number>();
  const shareOf = new Map<number, number>();
  const dropped: { index: number; share: number }[] = [];
  let current = solve(selected);
  let stopReason = '';
  let rejected: number | null = null;
  while (true) {
    if (selected.length >= maxComponents) {
      stopReason = `reached the maximum of ${maxComponents} components`;
      break;
    }
    if (current.rss <= 1e-24 * Math.max(btb, 1e-300)) {
      stopReason = 'the fit is exact';
      break;
    }
    const trials: Trial[] = [];
    for (let i = 0; i < c; i++) {
      if (selected.includes(i) || excluded.has(i)) continue;
      const trial = evaluate(i, selected, current);
      if (trial !== null) trials.push(trial);
    }
    if (trials.length === 0) {
      stopReason =
        c === selected.length ? 'no candidates left' : 'no further candidate gets a positive weight';
      break;
    }
    // Bonferroni over the candidates tried at this step: the step keeps the best of them, not a chosen one.
    const tried = trials.length;
    const eligible = trials.filter((t) => t.share >= minOwnShare);
    const strongest = trials.reduce((a, t) => (t.z > a.z ? t : a));
    const best = eligible.length > 0 ? eligible.reduce((a, t) => (t.z > a.z ? t : a)) : null;
    const adjusted = best === null ? 1 : Math.min(1, best.pValue * tried);
    const improvement = best === null || current.rss <= 0 ? 0 : (current.rss - best.fit.rss) / current.rss;
    if (best === null || !(adjusted < alpha) || improvement < minImprovement) {
      const shown = best ?? strongest;
      rejected = shown.index;
      const shownAdjusted = Math.min(1, shown.pValue * tried);
      stopReason =
        best === null
          ? `the best further candidate explains only ${(100 * strongest.share).toFixed(0)} % of what the fit ` +
            `leaves at its own bands beyond the noise (< ${(100 * minOwnShare).toFixed(0)} %; z = ` +
            `${strongest.z.toPrecision(3)}): it would trim another component's misfit, not add a compound`
          : `the best further candidate is not significant: z = ${shown.z.toPrecision(3)} (HAC standard ` +
            `error), p = ${shown.pValue.toPrecision(2)}, × ${tried} candidates tried = ` +
            `${shownAdjusted.toPrecision(2)} ≥ α = ${alpha}`;
      break;
    }
    selected.push(best.index);
    pValueOf.set(best.index, adjusted);
    improvementOf.set(best.index, improvement);
    shareOf.set(best.index, best.share);
    current = best.fit;
    // Backward check: an earlier component the newcomer makes a misfit-trimmer (a protein standing in for another
    // protein) leaves, and does not come back.
    while (true) {
      let worst: { index: number; share: number } | null = null;
      for (const j of selected) {
        if (forcedSet.has(j) || j === best.index) continue;
        const base = selected.filter((s) => s !== j);
        const trial = evaluate(j, base, solve(base));
        const share = trial === null ? 0 : trial.share;
        shareOf.set(j, share);
        if (share < minOwnShare && (worst === null || share < worst.share)) worst = { index: j, share };
      }
      if (worst === null) break;
      const w = worst.index;
      selected.splice(selected.indexOf(w), 1);
      excluded.add(w);
      pValueOf.delete(w);
      improvementOf.delete(w);
      shareOf.delete(w);
      dropped.push(worst);
      current = solve(selected);
    }
  }
  return {
    selected,
    weights: current.x,
    rss: current.rss,
    gram,
    pValueOf,
    improvementOf,
    shareOf,
    dropped,
    stopReason,
    rejected,
  };
}

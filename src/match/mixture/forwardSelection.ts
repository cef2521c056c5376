// Forward selection of mixture components by a nested-model partial F-test against the fit's own residual.
import { nnlsNormal } from '../nnlsNormal.js';
import { partialFTest } from './partialFTest.js';
import { residualNoise } from './residualNoise.js';

export interface ForwardSelectionInput {
  /** Baseline-projected candidate columns over the fit points. */
  columns: readonly Float64Array[];
  /** Baseline-projected query over the fit points. */
  query: Float64Array;
  /** Indices of columns forced in. */
  forced: readonly number[];
  /** Baseline terms already projected out (they count as fitted parameters). */
  baselineTerms: number;
}

export interface ForwardSelectionOptions {
  /** Significance level of each step's partial F-test. @default 0.01 */
  alpha?: number;
  /** Most components, forced ones included. @default 6 */
  maxComponents?: number;
  /** A further floor on the fractional drop of the residual sum of squares. @default 0 */
  minImprovement?: number;
}

export interface ForwardSelection {
  selected: number[];
  /** NNLS weights in the order of `selected`. */
  weights: Float64Array;
  rss: number;
  /** Gram matrix and AᵀB of all columns (row-major), for the uncertainty of the final fit. */
  gram: Float64Array;
  pValueOf: Map<number, number>;
  improvementOf: Map<number, number>;
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
  const { columns, query, baselineTerms } = input;
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

  const selected = [...input.forced];
  const pValueOf = new Map<number, number>();
  const improvementOf = new Map<number, number>();
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
    const trialSet = [...selected, best];
    const { inflation } = residualNoise(residualOf(trialSet, bestFit.x));
    const test = partialFTest(
      {
        rssReduced: current.rss,
        rssFull: bestFit.rss,
        points: n,
        parametersFull: trialSet.length + baselineTerms,
      },
      { inflation },
    );
    const improvement = current.rss > 0 ? (current.rss - bestFit.rss) / current.rss : 0;
    if (!(test.pValue < alpha) || improvement < minImprovement) {
      rejected = best;
      stopReason =
        `the best further candidate is not significant: partial F = ${test.f.toPrecision(3)} on ` +
        `(${test.dof1}, ${test.dof2.toFixed(1)}) effective degrees of freedom, p = ${test.pValue.toPrecision(2)} ≥ α = ${alpha}`;
      break;
    }
    selected.push(best);
    pValueOf.set(best, test.pValue);
    improvementOf.set(best, improvement);
    current = bestFit;
  }
  return {
    selected,
    weights: current.x,
    rss: current.rss,
    gram,
    pValueOf,
    improvementOf,
    stopReason,
    rejected,
  };
}

// Forward selection of mixture components by a nested-model partial F-test against the fit's own residual.
import jStatModule from 'jstat';
import { nnlsNormal } from '../nnlsNormal.js';
import { hacCovariance } from './hacCovariance.js';
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
  /**
   * Per column, free-sign nuisance columns (baseline-projected, over the same points) that join the fit once the
   * column is in it: its line-shape terms (see lineShapeTerms). Absent: none.
   */
  shapes?: readonly (readonly Float64Array[])[];
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
  /**
   * Per column, the HAC (Newey–West, Bartlett, `bandwidth`) standard error of its weight in the final model (with it
   * added, for a column not selected), from the final residual: robust to correlated and unequal residuals, so
   * structure the model leaves (a band shape differing between benches) widens it.
   */
  standardErrorOf: Map<number, number>;
  /**
   * HAC (Newey–West, Bartlett, `bandwidth`) covariance matrix of the selected weights in the order of `selected`,
   * row-major, from the final residual; its diagonal is the square of `standardErrorOf`.
   */
  covariance: Float64Array;
  /** Per selected column, the columns that fit as well in its place (see the swap test above the return). */
  alternativesOf: Map<number, number[]>;
  /** Per selected column, |its weight with − without the line-shape terms| (0 without them). */
  modelShiftOf: Map<number, number>;
  /** Per column, the norm of its part that the rest of the final model (components, line-shape terms) cannot mimic. */
  sensitivityOf: Map<number, number>;
  /** The selected columns' nuisance columns in the final fit, as [column, term] pairs, and their free-sign weights. */
  shapeTerms: { column: number; term: number; weight: number }[];
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

const { jStat } = jStatModule;

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
  // Every column the fit can use: the candidates, then each candidate's nuisance (line-shape) columns.
  const all: Float64Array[] = [...columns];
  const shapeIndex: number[][] = columns.map((_, i) =>
    (input.shapes?.[i] ?? []).map((v) => {
      all.push(Float64Array.from(v));
      return all.length - 1;
    }),
  );
  const m = all.length;
  const gram = new Float64Array(m * m);
  const atb = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    atb[i] = dot(all[i]!, query);
    for (let j = 0; j <= i; j++) {
      const g = dot(all[i]!, all[j]!);
      gram[i * m + j] = g;
      gram[j * m + i] = g;
    }
  }
  const btb = dot(query, query);
  const freeOf = (mains: readonly number[]): number[] => mains.flatMap((i) => shapeIndex[i] ?? []);

  interface SubsetFit {
    mains: number[];
    free: number[];
    /** Non-negative weights of `mains`. */
    x: Float64Array;
    /** Free-sign weights of `free`. */
    z: Float64Array;
    rss: number;
  }
  // (Gram net of `free`, A'b net of `free`, b'b net of `free`, (G_FF)⁻¹) — the Schur complement: least squares over
  // the free columns first, then NNLS of what they leave (the joint minimum, as for the baseline).
  const netOf = (mains: readonly number[], free: readonly number[]) => {
    const p = mains.length;
    const f = free.length;
    const g = new Float64Array(p * p);
    const r = new Float64Array(p);
    for (let a = 0; a < p; a++) {
      r[a] = atb[mains[a]!]!;
      for (let z = 0; z < p; z++) g[a * p + z] = gram[mains[a]! * m + mains[z]!]!;
    }
    let bb = btb;
    if (f === 0) return { g, r, bb, inverse: null as Float64Array | null };
    const gff = new Float64Array(f * f);
    for (let u = 0; u < f; u++) for (let v = 0; v < f; v++) gff[u * f + v] = gram[free[u]! * m + free[v]!]!;
    let inverse = invertSymmetric(gff, f);
    if (inverse === null) {
      // Nearly collinear nuisance columns (two references' derivatives alike): a vanishing ridge keeps them usable.
      let trace = 0;
      for (let u = 0; u < f; u++) trace += gff[u * f + u]!;
      for (let u = 0; u < f; u++) gff[u * f + u] = gff[u * f + u]! + 1e-9 * (trace / f);
      inverse = invertSymmetric(gff, f);
    }
    if (inverse === null) return { g, r, bb, inverse: null };
    // K·G_F· for each main and for b.
    const kfb = new Float64Array(f);
    for (let u = 0; u < f; u++) {
      for (let v = 0; v < f; v++) kfb[u] = kfb[u]! + inverse[u * f + v]! * atb[free[v]!]!;
    }
    for (let u = 0; u < f; u++) bb -= atb[free[u]!]! * kfb[u]!;
    const kfa = mains.map((ma) => {
      const k = new Float64Array(f);
      for (let u = 0; u < f; u++) {
        for (let v = 0; v < f; v++) k[u] = k[u]! + inverse[u * f + v]! * gram[free[v]! * m + ma]!;
      }
      return k;
    });
    for (let a = 0; a < p; a++) {
      for (let u = 0; u < f; u++) r[a] = r[a]! - gram[mains[a]! * m + free[u]!]! * kfb[u]!;
      for (let z = 0; z < p; z++) {
        let s = 0;
        for (let u = 0; u < f; u++) s += gram[mains[a]! * m + free[u]!]! * kfa[z]![u]!;
        g[a * p + z] = g[a * p + z]! - s;
      }
    }
    return { g, r, bb, inverse };
  };
  const fitSubset = (mains: readonly number[], freeWanted: readonly number[]): SubsetFit => {
    const p = mains.length;
    let net = netOf(mains, freeWanted);
    // Collinear nuisance columns (a flat reference has none to speak of): fit without them.
    const free = net.inverse === null && freeWanted.length > 0 ? [] : [...freeWanted];
    if (free.length === 0 && freeWanted.length > 0) net = netOf(mains, []);
    const x = p === 0 ? new Float64Array(0) : nnlsNormal({ gram: net.g, atb: net.r }).x;
    let rss = net.bb;
    for (let a = 0; a < p; a++) {
      rss -= 2 * x[a]! * net.r[a]!;
      for (let z = 0; z < p; z++) rss += x[a]! * net.g[a * p + z]! * x[z]!;
    }
    const f = free.length;
    const z = new Float64Array(f);
    if (f > 0 && net.inverse !== null) {
      const left = new Float64Array(f);
      for (let u = 0; u < f; u++) {
        let s = atb[free[u]!]!;
        for (let a = 0; a < p; a++) s -= gram[free[u]! * m + mains[a]!]! * x[a]!;
        left[u] = s;
      }
      for (let u = 0; u < f; u++)
        for (let v = 0; v < f; v++) z[u] = z[u]! + net.inverse[u * f + v]! * left[v]!;
    }
    return { mains: [...mains], free, x, z, rss: Math.max(0, rss) };
  };
  const residualOf = (fit: SubsetFit): Float64Array => {
    const r = Float64Array.from(query);
    const take = (col: Float64Array, w: number): void => {
      if (w === 0) return;
      for (let t = 0; t < n; t++) r[t] = r[t]! - w * col[t]!;
    };
    fit.mains.forEach((s, j) => {
      take(all[s]!, fit.x[j]!);
    });
    fit.free.forEach((s, j) => {
      take(all[s]!, fit.z[j]!);
    });
    return r;
  };

  // The part of column i that the columns of `subset` (indices into all columns) cannot mimic: modified Gram–Schmidt,
  // skipping a column whose own unmimicked part is lost to rounding (it adds nothing the others do not span).
  const unmimicked = (i: number, subset: readonly number[]): Float64Array => {
    const basis: Float64Array[] = [];
    for (const s of subset) {
      const v = Float64Array.from(all[s]!);
      const before = Math.sqrt(dot(v, v));
      for (const q of basis) {
        const k = dot(q, v);
        for (let t = 0; t < n; t++) v[t] = v[t]! - k * q[t]!;
      }
      const after = Math.sqrt(dot(v, v));
      if (!(after > 1e-8 * before)) continue;
      for (let t = 0; t < n; t++) v[t] = v[t]! / after;
      basis.push(v);
    }
    const d = Float64Array.from(all[i]!);
    for (const q of basis) {
      const k = dot(q, d);
      for (let t = 0; t < n; t++) d[t] = d[t]! - k * q[t]!;
    }
    return d;
  };

  interface Trial {
    index: number;
    fit: SubsetFit;
    z: number;
    pValue: number;
    share: number;
  }
  // Column i added to `base` (whose fit, with base's line-shape terms, is `baseFit`): its NNLS fit, HAC z and own-band
  // share; null without a positive weight. The newcomer's own line-shape terms join only once it is taken in.
  const evaluate = (i: number, base: readonly number[], baseFit: SubsetFit): Trial | null => {
    const fit = fitSubset([...base, i], baseFit.free);
    if (!(fit.x[base.length]! > 0)) return null;
    const active = base.filter((_, j) => fit.x[j]! > 0);
    const after = residualOf(fit);
    const test = hacScoreTest(
      { direction: unmimicked(i, [...active, ...fit.free]), query, residual: after },
      { bandwidth },
    );
    if (!(test.estimate > 0)) return null;
    const share = ownBandShare({
      column: columns[i]!,
      without: residualOf(baseFit),
      with: after,
      noiseSigma: residualNoise(after).sigma,
    });
    return { index: i, fit, z: test.z, pValue: test.pValue, share };
  };
  const fitWithShapes = (mains: readonly number[]): SubsetFit => fitSubset(mains, freeOf(mains));

  const forcedSet = new Set(input.forced);
  const selected = [...input.forced];
  const excluded = new Set<number>();
  const pValueOf = new Map<number, number>();
  const improvementOf = new Map<number, number>();
  const shareOf = new Map<number, number>();
  const dropped: { index: number; share: number }[] = [];
  let current = fitWithShapes(selected);
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
    current = fitWithShapes(selected);
    // Backward check: an earlier component the newcomer makes a misfit-trimmer (a protein standing in for another
    // protein) leaves, and does not come back.
    while (true) {
      let worst: { index: number; share: number } | null = null;
      for (const j of selected) {
        if (forcedSet.has(j) || j === best.index) continue;
        const base = selected.filter((s) => s !== j);
        const trial = evaluate(j, base, fitWithShapes(base));
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
      current = fitWithShapes(selected);
    }
  }
  const finalFree = current.free;
  // The final fit's figures per column: the HAC standard error of each selected weight and the sensitivity (norm of
  // the part the rest of the final model cannot mimic) of every column, selected or not.
  const finalResidual = residualOf(current);
  // How far each weight moves when the line-shape terms are left out: the part of its uncertainty that comes from
  // the model (how the bench changed the band shapes), not from the noise.
  const plain = finalFree.length > 0 ? fitSubset(selected, []) : current;
  const modelShiftOf = new Map<number, number>(
    selected.map((s, j) => [s, Math.abs(current.x[j]! - plain.x[j]!)]),
  );
  const standardErrorOf = new Map<number, number>();
  const sensitivityOf = new Map<number, number>();
  const directionOf = new Map<number, Float64Array>();
  for (let i = 0; i < c; i++) {
    const others = selected.filter((s) => s !== i);
    const d = unmimicked(i, [...others, ...finalFree]);
    if (selected.includes(i)) directionOf.set(i, d);
    sensitivityOf.set(i, Math.sqrt(dot(d, d)));
    const test = hacScoreTest({ direction: d, query, residual: finalResidual }, { bandwidth });
    standardErrorOf.set(i, test.standardError);
  }
  const covariance = hacCovariance(
    { directions: selected.map((s) => directionOf.get(s)!), residual: finalResidual },
    { bandwidth },
  );
  const termOf = new Map<number, { column: number; term: number }>();
  shapeIndex.forEach((list, column) => {
    list.forEach((at, term) => {
      termOf.set(at, { column, term });
    });
  });
  // Indistinguishable swaps: a candidate that, in place of a selected one, leaves a residual sum of squares within the
  // χ²₁(1 − α) bound of the final one, in units of the residual variance per effective independent point.
  const alternativesOf = new Map<number, number[]>();
  const residualPoints = n - selected.length - finalFree.length;
  const perPoint = residualPoints > 0 ? current.rss / residualPoints : Number.POSITIVE_INFINITY;
  const noiseVariance = perPoint * residualNoise(finalResidual).inflation;
  const bound = jStat.chisquare.inv(1 - alpha, 1) * noiseVariance;
  for (const j of selected) {
    if (forcedSet.has(j)) continue;
    const list: number[] = [];
    for (let i = 0; i < c; i++) {
      if (selected.includes(i)) continue;
      const swapped = selected.map((s) => (s === j ? i : s));
      const fit = fitWithShapes(swapped);
      if (fit.x[swapped.indexOf(i)]! > 0 && fit.rss - current.rss < bound) list.push(i);
    }
    if (list.length > 0) alternativesOf.set(j, list);
  }
  return {
    selected,
    alternativesOf,
    weights: current.x,
    rss: current.rss,
    standardErrorOf,
    covariance,
    sensitivityOf,
    modelShiftOf,
    shapeTerms: finalFree.map((at, j) => ({ ...termOf.get(at)!, weight: current.z[j]! })),
    pValueOf,
    improvementOf,
    shareOf,
    dropped,
    stopReason,
    rejected,
  };
}

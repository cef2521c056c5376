// Assembles and validates the match report of one unknown from the search, mixture and identification results.

import {
  MATCH_CAUTION,
  MATCH_REPORT_VERSION,
  type MatchHit,
  type MatchReport,
  matchReportSchema,
} from '../schema/matchReport.js';
import type { Grid, Recipe, WavenumberWindow } from '../schema/recipe.js';
import { gridAxis } from '../spectrum/gridAxis.js';
import { coveredSpan } from './coveredSpan.js';
import { scoringMask } from './scoringMask.js';
import type { Hit, Metric } from './searchTypes.js';
import type { IdentifiedBand, MixtureResult } from './types.js';

export interface MatchReportInput {
  query: {
    file: string;
    block?: number;
    /** SHA-256 of the file's bytes, lowercase hex. */
    hash: string;
    title?: string;
    recipe: Recipe;
    recipeSource: 'library' | 'file';
    grid: Grid;
    ranges: readonly WavenumberWindow[];
    /** The processed unknown on the grid, NaN where not covered. */
    processed: ArrayLike<number>;
    warnings: readonly string[];
  };
  library: {
    name: string;
    release: string | null;
    stateKey: string;
    entries: readonly { id: string; revision: number }[];
  };
  settings: {
    top: number;
    minOverlap: number;
    tolerance: number;
    maxComponents: number;
    with: readonly string[];
  };
  metrics: readonly Metric[];
  hitsByMetric: Partial<Record<Metric, readonly Hit[]>>;
  /** The mixture fit and how many candidates it chose from, or null without `--mixture`. */
  mixture: (MixtureResult & { candidates: number }) | null;
  bands: readonly IdentifiedBand[];
}

export interface BuildMatchReportOptions {
  /**
   * Largest library whose full revision set is written into the report; larger ones are pinned by the state
   * key alone, so a batch over a big library does not write megabytes per unknown.
   * @default 5000
   */
  maxRevisions?: number;
}

const finiteOrNull = (v: number): number | null => (Number.isFinite(v) ? v : null);

function gridVector(values: ArrayLike<number>): (number | null)[] {
  return Array.from(values, (v) => finiteOrNull(v));
}

/**
 * Our own reading of how far the best hit stands out (correlation metrics; euclidean distances are read through
 * cos = 1 − d²/2): weak when the best score is below 0.90, or when it is neither 1.5 SD above the library's mean nor
 * 0.02 ahead of the next hit; distinct when it leads the next hit by at least 0.02 and either stands 3 SD or more above
 * the mean or scores 0.98 or more with a lead of 0.05 (a library full of one family, such as proteins, keeps the SD of
 * the scores small and the z of a near-perfect hit low); ambiguous otherwise. The SD tests apply from 20 entries on: in
 * a smaller library even a perfect hit cannot stand 3 SD out.
 */
function standingOf(metric: Metric, hits: readonly Hit[], entries: number): MatchReport['standing'] {
  const best = hits[0];
  if (best === undefined) return { metric, verdict: 'none', text: 'no library entry could be scored' };
  const similarity = (h: Hit): number =>
    metric === 'euclidean' ? 1 - (h.rawScore * h.rawScore) / 2 : h.rawScore;
  const s = similarity(best);
  const next = hits[1];
  const gap = next === undefined ? Number.NaN : s - similarity(next);
  const z = entries >= 20 ? best.z : null;
  const zText =
    best.z === null ? 'no spread to compare with' : `${best.z.toFixed(1)} SD above the library mean`;
  const gapText = Number.isFinite(gap) ? `leads the next by ${gap.toFixed(3)}` : 'has no runner-up';
  const head = `best hit '${best.id}' (${metric} ${best.score.toFixed(3)}) ${gapText}, ${zText}`;
  const clearGap = !Number.isFinite(gap) || gap >= 0.02;
  if (s < 0.9 || (z !== null && z < 1.5 && !clearGap)) {
    return { metric, verdict: 'weak', text: `${head}: a weak match; treat every hit as a guess` };
  }
  if (clearGap && (z === null || z >= 3 || (s >= 0.98 && gap >= 0.05))) {
    return { metric, verdict: 'distinct', text: `${head}: stands out from the rest` };
  }
  return {
    metric,
    verdict: 'ambiguous',
    text: clearGap
      ? `${head}: ahead of the next hit but not far out of the library's spread`
      : `${head}: several entries fit about as well`,
  };
}

function hitRows(hits: readonly Hit[]): MatchHit[] {
  return hits.map((h, i) => ({
    rank: i + 1,
    id: h.id,
    revision: h.revision,
    name: h.name,
    class: h.class,
    score: h.score,
    rawScore: h.rawScore,
    overlap: h.overlap,
    gapToNext: h.gapToNext === null ? null : finiteOrNull(h.gapToNext),
    z: h.z === null ? null : finiteOrNull(h.z),
  }));
}

/** Turns typed arrays into JSON-safe values (NaN → null) and validates the result with `matchReportSchema`. */
export function buildMatchReport(
  input: MatchReportInput,
  options: BuildMatchReportOptions = {},
): MatchReport {
  const maxRevisions = options.maxRevisions ?? 5000;
  const { query, library, mixture } = input;
  const mask = scoringMask(query.processed, query.grid, {
    ranges: query.ranges,
    exclude: query.recipe.exclude,
  });
  const axis = gridAxis(query.grid);
  let first = -1;
  let last = -1;
  let points = 0;
  for (let i = 0; i < mask.length; i++) {
    if (mask[i] === 0) continue;
    if (first < 0) first = i;
    last = i;
    points++;
  }
  const hitsByMetric: MatchReport['hitsByMetric'] = {};
  for (const metric of input.metrics) hitsByMetric[metric] = hitRows(input.hitsByMetric[metric] ?? []);
  const primary = input.metrics[0]!;
  const report = {
    kind: 'bandshelf-match-report' as const,
    version: MATCH_REPORT_VERSION,
    caution: MATCH_CAUTION,
    query: {
      file: query.file,
      ...(query.block === undefined ? {} : { block: query.block }),
      hash: query.hash,
      ...(query.title === undefined ? {} : { title: query.title }),
      recipe: query.recipe,
      recipeSource: query.recipeSource,
      grid: query.grid,
      ranges: [...query.ranges],
      coverage:
        first < 0
          ? null
          : { min: axis[first]!, max: axis[last]!, points, overlap: coveredSpan(mask, query.grid.step) },
      processed: gridVector(query.processed),
      warnings: [...query.warnings],
    },
    library: {
      name: library.name,
      release: library.release,
      stateKey: library.stateKey,
      entries: library.entries.length,
      ...(library.entries.length <= maxRevisions
        ? { revisions: library.entries.map((e) => ({ id: e.id, revision: e.revision })) }
        : {}),
    },
    settings: { ...input.settings, with: [...input.settings.with] },
    metrics: [...input.metrics],
    hits: hitsByMetric[primary] ?? [],
    hitsByMetric,
    standing: standingOf(primary, input.hitsByMetric[primary] ?? [], library.entries.length),
    mixture:
      mixture === null
        ? null
        : {
            components: mixture.components.map((c) => ({
              ...c,
              standardError: finiteOrNull(c.standardError),
              interval95: [c.interval95[0], finiteOrNull(c.interval95[1])] as [number, number | null],
              detectionLimit: {
                weight: finiteOrNull(c.detectionLimit.weight),
                share: c.detectionLimit.share,
              },
            })),
            r2: finiteOrNull(mixture.r2),
            rss: mixture.rss,
            baseline: mixture.baseline,
            fitted: gridVector(mixture.fitted),
            residual: gridVector(mixture.residual),
            noise: Number.isFinite(mixture.noise) ? mixture.noise : 0,
            noiseSource: mixture.noiseSource,
            k: mixture.k,
            noiseLag1: mixture.noiseLag1,
            effectivePoints: mixture.effectivePoints,
            alpha: mixture.alpha,
            rule: mixture.rule,
            notSelected: mixture.notSelected.map((c) => ({
              ...c,
              detectionLimit: {
                weight: finiteOrNull(c.detectionLimit.weight),
                share: c.detectionLimit.share,
              },
            })),
            residualBands: mixture.residualBands.map((b) => ({
              ...b,
              fwhm: finiteOrNull(b.fwhm),
              width: finiteOrNull(b.width),
            })),
            points: mixture.points,
            span: mixture.span,
            candidates: mixture.candidates,
            criterion: mixture.criterion,
            stopReason: mixture.stopReason,
            skipped: [...mixture.skipped],
          },
    bands: input.bands.map((b) => ({
      position: b.position,
      height: b.height,
      fwhm: finiteOrNull(b.fwhm),
      kind: b.kind,
      assignments: b.assignments.map((a) => ({ ...a, class: [...a.class] })),
      candidates: b.candidates.map((c) => ({ ...c })),
      explained: b.explained,
    })),
  };
  return matchReportSchema.parse(report);
}

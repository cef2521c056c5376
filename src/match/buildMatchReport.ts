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
import { empiricalPValue } from './empiricalPValue.js';
import { hitStanding } from './hitStanding.js';
import { type ContributionRegion, scoreContributions } from './scoreContributions.js';
import { scoringMask } from './scoringMask.js';
import type { Hit, Metric } from './searchTypes.js';
import type { IdentifiedBand, MixtureResult } from './types.js';
import type { WrongHitNull } from './wrongHitNull.js';

export interface MatchReportInput {
  query: {
    file: string;
    block?: number;
    column?: string;
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
  mixture:
    | (MixtureResult & {
        candidates: number;
        /** The common resolution of the fit (see fitAtCommonResolution), null or absent when none was needed. */
        resolution?: { common: number; unknown: number; degraded: string[]; unknownDegraded: boolean } | null;
      })
    | null;
  bands: readonly IdentifiedBand[];
  /** The library's best-wrong-hit null (pearson) for per-hit p-values; absent or null gives pValue null. */
  wrongHitNull?: WrongHitNull | null;
  /** A hit's processed reference vector on the grid by its search-set row, for the per-region contributions. */
  referenceOf?: ((row: number) => ArrayLike<number>) | null;
  /** Regions the contributions are split over. @default DEFAULT_CONTRIBUTION_REGIONS */
  contributionRegions?: readonly ContributionRegion[];
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

type Explain = ((h: Hit) => MatchHit['contributions']) | null;

function hitRows(hits: readonly Hit[], nullScores: ArrayLike<number> | null, explain: Explain): MatchHit[] {
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
    pValue: nullScores === null ? null : empiricalPValue({ score: h.rawScore, nullScores }),
    contributions: explain === null ? null : explain(h),
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
  const wrong = input.wrongHitNull ?? null;
  const referenceOf = input.referenceOf ?? null;
  for (const metric of input.metrics) {
    const nullScores = wrong !== null && wrong.metric === metric ? wrong.scores : null;
    // Contributions split Pearson r; the other metrics' scores are not sums of those products.
    const explain: Explain =
      referenceOf === null || metric !== 'pearson'
        ? null
        : (h) =>
            scoreContributions(
              { wavenumber: axis, unknown: query.processed, reference: referenceOf(h.row) },
              { mask, ...(input.contributionRegions ? { regions: input.contributionRegions } : {}) },
            ).map((c) => ({ ...c, min: finiteOrNull(c.min), max: finiteOrNull(c.max) }));
    hitsByMetric[metric] = hitRows(input.hitsByMetric[metric] ?? [], nullScores, explain);
  }
  const primary = input.metrics[0]!;
  const report = {
    kind: 'bandshelf-match-report' as const,
    version: MATCH_REPORT_VERSION,
    caution: MATCH_CAUTION,
    query: {
      file: query.file,
      ...(query.block === undefined ? {} : { block: query.block }),
      ...(query.column === undefined ? {} : { column: query.column }),
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
    standing: hitStanding(
      { metric: primary, hits: hitsByMetric[primary] ?? [] },
      { floor: wrong === null ? 0 : 1 / (1 + wrong.sampled) },
    ),
    confidence:
      wrong === null
        ? null
        : {
            metric: wrong.metric,
            nullSize: wrong.sampled,
            entries: wrong.entries,
            text:
              `pValue: the share of the library's own best wrong hits scoring at least as high, (1 + count) / ` +
              `(1 + ${wrong.sampled}); the null matches ${wrong.sampled === wrong.entries ? `all ${wrong.entries} entries` : `${wrong.sampled} evenly spaced of the ${wrong.entries} entries (of one coverage)`} ` +
              `against the rest (its own id and name left out) by Pearson r over ` +
              `the points both cover (outside the recipe's exclusion windows, as a match scores). A per-hit score calibration, not the probability that the identification is right.`,
          },
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
            misfitBands: mixture.misfitBands.map((b) => ({ ...b })),
            points: mixture.points,
            span: mixture.span,
            candidates: mixture.candidates,
            criterion: mixture.criterion,
            stopReason: mixture.stopReason,
            skipped: [...mixture.skipped],
            ...(mixture.resolution === undefined || mixture.resolution === null
              ? {}
              : { resolution: { ...mixture.resolution, degraded: [...mixture.resolution.degraded] } }),
          },
    bands: input.bands.map((b) => ({
      position: b.position,
      height: b.height,
      fwhm: finiteOrNull(b.fwhm),
      kind: b.kind,
      assignments: b.assignments.map((a) => ({ ...a, class: [...a.class] })),
      assignedTo: b.assignedTo === null ? null : { ...b.assignedTo },
      flags: b.flags.map((f) => ({ ...f })),
      candidates: b.candidates.map((c) => ({ ...c })),
      explained: b.explained,
    })),
  };
  return matchReportSchema.parse(report);
}

// The one match pipeline (browser-safe): process the unknown, score it, fit the mixture, identify bands, report.
import { BandshelfError } from '../../error.js';
import type { MatchReport } from '../../schema/matchReport.js';
import type { Recipe, WavenumberWindow } from '../../schema/recipe.js';
import { gridAxis } from '../../spectrum/gridAxis.js';
import { pinAtr } from '../../spectrum/pinAtr.js';
import { processSpectrum } from '../../spectrum/processSpectrum.js';
import { resolutionOf } from '../../spectrum/resolutionOf.js';
import type { Spectrum } from '../../spectrum/types.js';
import { buildBandIndex } from '../buildBandIndex.js';
import { buildMatchReport } from '../buildMatchReport.js';
import { compareAtCoarserResolution } from '../compareAtCoarserResolution.js';
import { coveredSpan } from '../coveredSpan.js';
import { fitMixture } from '../fitMixture.js';
import { identifyBands } from '../identifyBands.js';
import { processedRow } from '../processedRow.js';
import { resolutionForUnknown } from '../resolutionForUnknown.js';
import type { ContributionRegion } from '../scoreContributions.js';
import { scoringMask } from '../scoringMask.js';
import { type Hit, type Metric, MIN_OVERLAP_DEFAULT } from '../searchTypes.js';
import { BAND_TOLERANCE_CM1, type BandIndex, type MixtureCandidate, type MixtureResult } from '../types.js';
import { checkMatchSource } from './checkMatchSource.js';
import { fitAtCommonResolution } from './fitAtCommonResolution.js';
import { offerMixtureCandidates } from './offerMixtureCandidates.js';
import type { MatchPipelineInput } from './types.js';

/** The match pipeline's defaults, owned here: the CLI and the site pass only what the user set. */
export const MATCH_DEFAULTS = {
  metrics: ['pearson'] as readonly Metric[],
  top: 10,
  maxComponents: 6,
  candidates: 30,
  tolerance: BAND_TOLERANCE_CM1,
} as const;

export interface RunMatchPipelineOptions {
  /** A recipe overriding the source's default (e.g. `--recipe FILE`). @default source.recipe */
  recipe?: Recipe;
  /** Where `recipe` came from, as the report records it. @default 'library' */
  recipeSource?: 'library' | 'file';
  /** The reference spectra `recipe` names when it is not the source's own. @default source.references */
  references?: ReadonlyMap<string, Spectrum>;
  /** Scoring windows, cm⁻¹. @default [] (whole grid) */
  ranges?: readonly WavenumberWindow[];
  /** @default ['pearson'] */
  metrics?: readonly Metric[];
  /** Hits reported per metric. @default 10 */
  top?: number;
  /** Least shared coverage, cm⁻¹. @default MIN_OVERLAP_DEFAULT (200) */
  minOverlap?: number;
  /** Run the mixture fit. @default false */
  mixture?: boolean;
  /** Entry ids forced into the mixture. @default [] */
  with?: readonly string[];
  /** @default 6 */
  maxComponents?: number;
  /** Top pearson hits offered to forward selection. @default 30 */
  candidates?: number;
  /** Baseline polynomial degree of the fit (null: no baseline). @default fitMixture's DEFAULT_BASELINE_DEGREE (2) */
  baselineDegree?: number | null;
  /** Band tolerance for identification, cm⁻¹. @default BAND_TOLERANCE_CM1 (4) */
  tolerance?: number;
  /** Classes left out of the hit lists and the fit. @default [] */
  excludeClass?: readonly string[];
  /** Entry ids left out of the hit lists and the fit. @default [] */
  exclude?: readonly string[];
  /** Only entries of these classes in the hit lists and the fit. @default [] (every class) */
  onlyClass?: readonly string[];
  /**
   * Classes the mixture fit never draws on unless forced with `with`: composites are not components.
   * @default COMPOSITE_CLASSES (['biofluid', 'mixture'])
   */
  fitExcludeClass?: readonly string[];
  /** The source's band index, when the caller keeps one across unknowns. @default built from the source's peaks */
  index?: BandIndex;
  /**
   * Like with like across resolutions: the mixture fit brings the unknown and its references to a common resolution
   * (fitAtCommonResolution), and Pearson hits of another resolution are scored again at the coarser of the two
   * (compareAtCoarserResolution). False: the fit and the hits as the stored vectors give them. @default true
   */
  likeWithLike?: boolean;
  /** Regions each hit's score is split into ("why this hit"). @default DEFAULT_CONTRIBUTION_REGIONS */
  contributionRegions?: readonly ContributionRegion[];
}

/** What fitAtCommonResolution reports of the fit's common resolution. */
type CommonResolution = Awaited<ReturnType<typeof fitAtCommonResolution>>['resolution'];

/** Classes of composite references (a serum film, a calibration mixture) that are not pure-substance components. */
export const COMPOSITE_CLASSES: readonly string[] = ['biofluid', 'mixture'];

/** Whether an entry may appear in the hit lists and the fit under the class and id options. */
function admits(options: RunMatchPipelineOptions): (e: { id: string; class: string }) => boolean {
  const excludeClass = new Set(options.excludeClass ?? []);
  const exclude = new Set(options.exclude ?? []);
  const only = new Set(options.onlyClass ?? []);
  return (e) => !exclude.has(e.id) && !excludeClass.has(e.class) && (only.size === 0 || only.has(e.class));
}

/** The unknown processed with the recipe, after checking that it covers enough of the grid to be scored. */
function processUnknown(
  input: MatchPipelineInput,
  recipe: Recipe,
  options: RunMatchPipelineOptions,
): Float64Array {
  const { unknown, source } = input;
  const references = options.references ?? source.references;
  const { processed } = processSpectrum(unknown.spectrum, recipe, source.grid, {
    references: new Map(references),
    file: unknown.file,
    ...(unknown.saturated === undefined ? {} : { saturated: unknown.saturated }),
  });
  const minOverlap = options.minOverlap ?? MIN_OVERLAP_DEFAULT;
  const mask = scoringMask(processed, source.grid, { ranges: options.ranges ?? [], exclude: recipe.exclude });
  const overlap = coveredSpan(mask, source.grid.step);
  if (overlap < minOverlap || overlap === 0) {
    const clipped = unknown.saturated?.reduce((n, v) => n + v, 0) ?? 0;
    const why =
      clipped === 0
        ? '(lower minOverlap or widen the ranges)'
        : `(${clipped} of its points are saturated, at or beyond the absorbance ceiling, and kept out)`;
    throw new BandshelfError(
      'SMALL_OVERLAP',
      `the unknown covers only ${overlap} cm⁻¹ of the library grid inside the scoring ranges; at least ` +
        `${minOverlap} cm⁻¹ are needed ${why}`,
      { file: unknown.file, field: 'minOverlap' },
    );
  }
  return processed;
}

/** The mixture fit over the forced ids and the best pearson hits, with how many candidates it chose from. */
async function fitOffered(
  input: MatchPipelineInput,
  processed: Float64Array,
  poolHits: readonly Hit[],
  recipe: Recipe,
  options: RunMatchPipelineOptions & { resolution: number },
): Promise<{
  mixture: MixtureResult & { candidates: number; resolution: CommonResolution };
  offered: MixtureCandidate[];
  processed: Float64Array;
}> {
  const { source } = input;
  const forced = [...new Set(options.with ?? [])];
  const rowOf = new Map(source.entries.map((e, i) => [e.id, i]));
  const composite = new Set(options.fitExcludeClass ?? COMPOSITE_CLASSES);
  const leftOut = [...new Set(poolHits.filter((h) => composite.has(h.class)).map((h) => h.class))].sort();
  const rows = [
    ...forced.map((id) => rowOf.get(id)!),
    ...poolHits.filter((h) => !composite.has(h.class)).map((h) => h.row),
  ];
  const offered = await offerMixtureCandidates({ source, rows, unknown: input.unknown.spectrum }, { recipe });
  const ranges = options.ranges ?? [];
  const fitWith = (vector: Float64Array, candidates: MixtureCandidate[]) =>
    fitMixture(vector, candidates, {
      grid: source.grid,
      with: forced,
      maxComponents: options.maxComponents ?? MATCH_DEFAULTS.maxComponents,
      ...(options.baselineDegree === undefined ? {} : { baselineDegree: options.baselineDegree }),
      ranges: ranges.length === 0 ? null : ranges,
    });
  const alike =
    options.likeWithLike === false
      ? {
          mixture: fitWith(processed, offered.candidates),
          candidates: offered.candidates,
          processed,
          resolution: null,
        }
      : await fitAtCommonResolution({
          source,
          unknown: {
            spectrum: input.unknown.spectrum,
            resolution: options.resolution,
            ...(input.unknown.saturated === undefined ? {} : { saturated: input.unknown.saturated }),
          },
          processed,
          recipe,
          references: options.references ?? source.references,
          candidates: offered.candidates.map((c, i) => ({ ...c, row: rows[i]! })),
          window: offered.window,
          fitWith,
        });
  const fit = alike.mixture;
  const common = alike.resolution;
  const resolutionNote =
    common === null
      ? ''
      : `; compared like with like at a common resolution of ${Number(common.common.toPrecision(3))} cm⁻¹ ` +
        `(Gaussian line shape; ${[common.unknownDegraded ? 'the unknown' : '', common.degraded.length > 0 ? `${common.degraded.length} sharper reference(s)` : ''].filter((t) => t !== '').join(' and ')} degraded to it)`;
  const window = offered.window;
  const classNote =
    leftOut.length === 0
      ? ''
      : `; references of class ${leftOut.join(', ')} were left out (composites, not components)`;
  const criterion =
    window === null || offered.reprocessed.length === 0
      ? `${fit.criterion}${classNote}${resolutionNote}`
      : `${fit.criterion}${classNote}${resolutionNote}; the unknown covers only ${window.max.toFixed(0)}–${window.min.toFixed(0)} cm⁻¹, so ` +
        `${offered.reprocessed.length} reference(s) reaching beyond it were processed again over that span ` +
        `with their own recipes (baseline and normalisation over the same span as the unknown's)`;
  return {
    mixture: {
      ...fit,
      criterion,
      candidates: new Set(offered.candidates.map((c) => c.id)).size,
      resolution: common,
    },
    offered: alike.candidates,
    processed: alike.processed,
  };
}

/**
 * One unknown → one validated `MatchReport`: hits per metric, standing, mixture (with `mixture`), residual and
 * identified bands. Node and the browser differ only in the source and scorer they pass.
 */
export async function runMatchPipeline(
  input: MatchPipelineInput,
  options: RunMatchPipelineOptions = {},
): Promise<MatchReport> {
  const { unknown, source, scorer } = input;
  checkMatchSource(source, options.with === undefined ? {} : { with: options.with });
  const forced = [...new Set(options.with ?? [])];
  // The unknown gets the entries' treatment: its technique's ATR default and its resolution pinned into the recipe.
  const given = options.recipe ?? source.recipe;
  const withAtr = unknown.technique === undefined ? given : pinAtr(given, { technique: unknown.technique });
  const pinned = resolutionForUnknown(unknown.spectrum, withAtr, { stated: unknown.resolution });
  const recipe = pinned.recipe;
  const ownResolution = resolutionOf(unknown.spectrum, { stated: unknown.resolution }).value;
  const metrics = options.metrics ?? MATCH_DEFAULTS.metrics;
  const top = options.top ?? MATCH_DEFAULTS.top;
  const minOverlap = options.minOverlap ?? MIN_OVERLAP_DEFAULT;
  const ranges = options.ranges ?? [];
  const poolSize = options.candidates ?? MATCH_DEFAULTS.candidates;
  const tolerance = options.tolerance ?? MATCH_DEFAULTS.tolerance;
  const maxComponents = options.maxComponents ?? MATCH_DEFAULTS.maxComponents;
  const processed = processUnknown(input, recipe, options);

  const withMixture = options.mixture === true;
  const searchMetrics: Metric[] = [...metrics];
  if (withMixture && !searchMetrics.includes('pearson')) searchMetrics.push('pearson');
  const hitsByMetric = new Map<Metric, Hit[]>();
  const admitted = admits(options);
  // The scorer ranks every row; ask for as many more hits as rows are left out, then drop those.
  const leftOut = source.entries.filter((e) => !admitted(e)).length;
  for (const metric of searchMetrics) {
    const wanted = metric === 'pearson' && withMixture ? Math.max(top, poolSize) : top;
    const k = Math.min(source.entries.length, wanted + leftOut);
    const [hits] = await scorer(source, [processed], { metric, ranges, k, minOverlap });
    hitsByMetric.set(metric, (hits ?? []).filter((h) => admitted(h)).slice(0, wanted));
  }
  const fitted = withMixture
    ? await fitOffered(input, processed, hitsByMetric.get('pearson')!.slice(0, poolSize), recipe, {
        ...options,
        resolution: ownResolution,
      })
    : null;
  // Bands are identified on the unknown as the fit saw it (at the common resolution when it had to be degraded).
  const fittedUnknown = fitted === null ? processed : fitted.processed;
  const mixture = fitted === null ? null : fitted.mixture;
  const bands = identifyBands(
    { wavenumber: gridAxis(source.grid), absorbance: fittedUnknown },
    {
      assignments: input.assignments,
      index: options.index ?? buildBandIndex(source),
      mixture,
      tolerance,
      componentVectors: fitted === null ? [] : fitted.offered,
    },
  );
  const byMetric: Partial<Record<Metric, Hit[]>> = {};
  for (const metric of metrics) byMetric[metric] = hitsByMetric.get(metric)!.slice(0, top);
  const report = buildMatchReport({
    query: {
      file: unknown.file,
      ...(unknown.block === undefined ? {} : { block: unknown.block }),
      ...(unknown.column === undefined ? {} : { column: unknown.column }),
      hash: unknown.hash,
      ...(unknown.title === undefined ? {} : { title: unknown.title }),
      recipe,
      recipeSource: options.recipeSource ?? 'library',
      grid: source.grid,
      ranges,
      processed,
      warnings: [...unknown.warnings, ...pinned.warnings],
    },
    library: { name: source.name, release: source.at, stateKey: source.stateKey, entries: source.entries },
    settings: { top, minOverlap, tolerance, maxComponents, with: forced },
    metrics,
    hitsByMetric: byMetric,
    mixture,
    bands,
    wrongHitNull: source.wrongHitNull ?? null,
    referenceOf: (row) => processedRow(source, row),
    ...(options.contributionRegions === undefined
      ? {}
      : { contributionRegions: options.contributionRegions }),
  });
  if (options.likeWithLike === false) return report;
  // Like with like: hits of another resolution are scored again at the coarser of the two.
  const alike = await compareAtCoarserResolution(
    { report, unknown: unknown.spectrum, resolution: ownResolution, source },
    options.references === undefined ? {} : { references: options.references },
  );
  return alike.report;
}

// Like with like across resolutions: a hit whose entry and unknown differ in resolution is scored again with the
// sharper of the two degraded to the coarser, and marked.
import type { MatchHit, MatchReport } from '../schema/matchReport.js';
import type { WavenumberWindow } from '../schema/recipe.js';
import { processSpectrum } from '../spectrum/processSpectrum.js';
import type { Spectrum } from '../spectrum/types.js';
import { comparedResolution, LIKE_RESOLUTION_TOLERANCE } from './comparedResolution.js';
import { empiricalPValue } from './empiricalPValue.js';
import { entryResolution } from './entryResolution.js';
import { hitStanding } from './hitStanding.js';
import { maskedRowScore } from './maskedRowScore.js';
import type { EntryOriginal, MatchSource } from './pipeline/types.js';
import { recipeAtResolution } from './recipeAtResolution.js';
import { scoringMask } from './scoringMask.js';

export interface CompareAtCoarserResolutionInput {
  /** The pipeline's report for the unknown. */
  report: MatchReport;
  /** The unknown as read (before processing). */
  unknown: Spectrum;
  /** The unknown's own resolution, cm⁻¹ (stated, else estimated; see resolutionOf). */
  resolution: number;
  source: MatchSource;
}

export interface CompareAtCoarserResolutionOptions {
  /** Resolutions within this fraction of each other count as equal. @default LIKE_RESOLUTION_TOLERANCE (0.25) */
  tolerance?: number;
  /** The reference spectra the unknown's recipe names. @default source.references */
  references?: ReadonlyMap<string, Spectrum>;
  /** Scoring windows, cm⁻¹ (as the pipeline was given). @default the report's ranges */
  ranges?: readonly WavenumberWindow[];
  /** Least shared coverage, cm⁻¹. @default the report's minOverlap */
  minOverlap?: number;
}

export interface CompareAtCoarserResolutionResult {
  report: MatchReport;
  /** One note per hit compared again, also appended to the report's query warnings. */
  notes: string[];
}

/**
 * For every Pearson hit of the report whose entry's resolution differs from the unknown's (each as compared under
 * its recipe: a resolution step's target is a floor) by more than `tolerance`, the sharper spectrum is processed again
 * with a Gaussian instrument line shape that brings it to the coarser resolution (FWHM √(coarser² − sharper²):
 * Gaussian widths add in quadrature, common practice) — the unknown with its own recipe, the entry from its original
 * with its own recipe — and the pair's Pearson r is computed over the points both cover inside the scoring ranges.
 * The hit's score, raw score, overlap and p-value are replaced, its z and contributions (computed at the unequal
 * resolutions) set null, the list re-ranked, and a note names the resolutions and both scores. Other metrics' hits
 * are only marked. Browser-safe. The report given is not modified.
 */
export async function compareAtCoarserResolution(
  input: CompareAtCoarserResolutionInput,
  options: CompareAtCoarserResolutionOptions = {},
): Promise<CompareAtCoarserResolutionResult> {
  const { report, unknown, source } = input;
  const tolerance = options.tolerance ?? LIKE_RESOLUTION_TOLERANCE;
  const recipe = report.query.recipe;
  const ranges = options.ranges ?? report.query.ranges;
  const minOverlap = options.minOverlap ?? report.settings.minOverlap;
  const ownUnknown = input.resolution;
  if (!(Number.isFinite(ownUnknown) && ownUnknown > 0)) return { report, notes: [] };
  const atUnknown = comparedResolution(ownUnknown, recipe);
  const rowOf = new Map(source.entries.map((e, i) => [e.id, i]));
  const metrics = Object.keys(report.hitsByMetric) as (keyof MatchReport['hitsByMetric'])[];
  const ids = [...new Set(metrics.flatMap((m) => (report.hitsByMetric[m] ?? []).map((h) => h.id)))];
  const rows = ids.map((id) => rowOf.get(id)).filter((r): r is number => r !== undefined);
  const originals: ReadonlyMap<number, EntryOriginal> =
    rows.length === 0 ? new Map() : await source.originals(rows);

  const unknownAt = new Map<number, Float64Array>();
  const processUnknownAt = (target: number): Float64Array => {
    let v = unknownAt.get(target);
    if (v === undefined) {
      v = processSpectrum(unknown, recipeAtResolution(recipe, { own: ownUnknown, target }), source.grid, {
        references: new Map(options.references ?? source.references),
      }).processed;
      unknownAt.set(target, v);
    }
    return v;
  };
  const processed = Float64Array.from(report.query.processed, (v) => (v === null ? Number.NaN : v));
  const notes: string[] = [];
  const compared = new Map<string, { score: number; overlap: number; at: number; entry: number } | null>();
  for (const id of ids) {
    const row = rowOf.get(id);
    const original = row === undefined ? undefined : originals.get(row);
    if (row === undefined || original === undefined) continue;
    const own = entryResolution(original);
    if (!(Number.isFinite(own) && own > 0)) continue;
    const atEntry = comparedResolution(own, original.recipe);
    if (Math.abs(atEntry - atUnknown) <= tolerance * Math.min(atEntry, atUnknown)) continue;
    const coarser = Math.max(atEntry, atUnknown);
    const query = atUnknown < coarser ? processUnknownAt(coarser) : processed;
    const reference =
      atEntry < coarser
        ? processSpectrum(
            original.original,
            recipeAtResolution(original.recipe, { own, target: coarser }),
            source.grid,
            {
              references: new Map(original.references),
            },
          ).processed
        : source.processed.subarray(row * source.cols, (row + 1) * source.cols);
    const mask = scoringMask(query, source.grid, { ranges, exclude: recipe.exclude });
    const scored = maskedRowScore(reference, query, mask, { step: source.grid.step });
    compared.set(
      id,
      Number.isFinite(scored.score) && scored.overlap >= minOverlap
        ? { score: scored.score, overlap: scored.overlap, at: coarser, entry: atEntry }
        : null,
    );
  }
  if (compared.size === 0) return { report, notes: [] };

  const nullScores = source.wrongHitNull?.scores ?? null;
  const rescore = (hits: readonly MatchHit[], pearson: boolean): MatchHit[] => {
    const out = hits.map((h) => {
      const c = compared.get(h.id);
      if (c === undefined || c === null || !pearson) return h;
      return {
        ...h,
        score: Math.max(0, c.score),
        rawScore: c.score,
        overlap: c.overlap,
        z: null,
        pValue: nullScores === null ? null : empiricalPValue({ score: c.score, nullScores }),
        contributions: null,
      };
    });
    if (!pearson) return out;
    out.sort((a, b) => b.rawScore - a.rawScore);
    return out.map((h, i) => ({
      ...h,
      rank: i + 1,
      gapToNext: i + 1 < out.length ? h.rawScore - out[i + 1]!.rawScore : null,
    }));
  };
  const hitsByMetric: MatchReport['hitsByMetric'] = {};
  for (const m of metrics) hitsByMetric[m] = rescore(report.hitsByMetric[m] ?? [], m === 'pearson');
  const before = new Map((report.hitsByMetric.pearson ?? []).map((h) => [h.id, h.rawScore]));
  for (const [id, c] of compared) {
    const at = (v: number) => `${Number(v.toPrecision(3))} cm⁻¹`;
    if (c === null) {
      notes.push(
        `hit '${id}': resolutions differ from the unknown's and could not be compared at the coarser one`,
      );
      continue;
    }
    const was = before.get(id);
    notes.push(
      `hit '${id}' (resolution ${at(c.entry)}) and the unknown (${at(atUnknown)}) compared at the coarser ${at(c.at)}` +
        (was === undefined ? '' : `: pearson ${was.toFixed(3)} → ${c.score.toFixed(3)}`),
    );
  }
  const primary = report.standing.metric;
  const hits = hitsByMetric[primary] ?? [];
  const floor = source.wrongHitNull ? 1 / (1 + source.wrongHitNull.sampled) : 0;
  return {
    report: {
      ...report,
      query: { ...report.query, warnings: [...report.query.warnings, ...notes] },
      hits,
      hitsByMetric,
      standing: hitStanding({ metric: primary, hits }, { floor }),
    },
    notes,
  };
}

// Runs the whole match of one or more unknown files against a library: read, process, search, fit, identify, report.
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';
import { BandshelfError } from '../error.js';
import { isSidecarName } from '../formats/isSidecarName.js';
import { readSpectrumFile } from '../formats/readSpectrumFile.js';
import { closeLibrary } from '../library/store/closeLibrary.js';
import { describeIoError } from '../library/store/describeIoError.js';
import { libraryPath } from '../library/store/libraryPath.js';
import { listAssignments } from '../library/store/listAssignments.js';
import { openLibrary } from '../library/store/openLibrary.js';
import { readRecipeFile } from '../library/store/readRecipeFile.js';
import { readSearchSet } from '../library/store/readSearchSet.js';
import type { EntryView, SearchSet } from '../library/types.js';
import { buildBandIndex } from '../match/buildBandIndex.js';
import { buildMatchReport } from '../match/buildMatchReport.js';
import { cachedWrongHitNull } from '../match/cachedWrongHitNull.js';
import { coveredSpan } from '../match/coveredSpan.js';
import { fitMixture } from '../match/fitMixture.js';
import { identifyBands } from '../match/identifyBands.js';
import { scoringMask } from '../match/scoringMask.js';
import { searchLibrary } from '../match/searchLibrary.js';
import type { Hit, Metric } from '../match/searchTypes.js';
import { shippedAssignments } from '../match/shippedAssignments.js';
import type { MixtureCandidate, MixtureResult } from '../match/types.js';
import type { MatchReport } from '../schema/matchReport.js';
import type { WavenumberWindow } from '../schema/recipe.js';
import { gridAxis } from '../spectrum/gridAxis.js';
import { processSpectrum } from '../spectrum/processSpectrum.js';
import type { Spectrum } from '../spectrum/types.js';
import type { CommandContext } from './command.js';
import { mixtureCandidates } from './mixtureCandidates.js';
import { recipeReferences } from './recipeReferences.js';

export interface MatchUnknownsOptions {
  /** --library as given. @default './bandshelf.sqlite' */
  library?: unknown;
  /** A release tag. @default undefined (working state) */
  at?: string;
  /** A recipe JSON file overriding the library's default recipe. @default undefined */
  recipe?: string;
  /** Scoring windows. @default [] (whole grid) */
  ranges?: readonly WavenumberWindow[];
  /** @default ['pearson'] */
  metrics?: readonly Metric[];
  /** Hits reported per metric. @default 10 */
  top?: number;
  /** @default 200 */
  minOverlap?: number;
  /** Run the mixture fit. @default false */
  mixture?: boolean;
  /** Entry ids forced into the mixture. @default [] */
  with?: readonly string[];
  /** @default 6 */
  maxComponents?: number;
  /** Top pearson hits offered to forward selection. @default 30 */
  candidates?: number;
  /**
   * Baseline polynomial degree of the fit. 'auto': a free offset (degree 0) when the recipe removes the baseline,
   * because a rubberband or ALS baseline anchors on noise minima and leaves each spectrum lifted by a little
   * that does not add up across a mixture; degree 2 when the recipe keeps the baseline.
   * @default 'auto'
   */
  baselineDegree?: number | null | 'auto';
  /** Band tolerance for identification, cm⁻¹. @default 4 */
  tolerance?: number;
}

export interface MatchOutcome {
  /** The file as the user named it (a folder's files joined onto the folder as given). */
  file: string;
  block?: number;
  report?: MatchReport;
  /** The one-line error when this unknown failed (batch mode keeps going). */
  error?: string;
}

export interface MatchRun {
  outcomes: MatchOutcome[];
  /** More than one unknown (a folder, several files or a multi-block file). */
  batch: boolean;
  warnings: string[];
}

interface Unknown {
  file: string;
  block?: number;
  hash: string;
  title?: string;
  spectrum: Spectrum;
  warnings: string[];
}

/** Spectrum files of a folder (not recursive): no hidden files, sidecars or manifests; sorted by name. */
function filesOf(target: string, cwd: string): string[] {
  const full = resolve(cwd, target);
  let stat: ReturnType<typeof statSync>;
  try {
    stat = statSync(full);
  } catch {
    throw new BandshelfError('IO_ERROR', 'no such file or folder', { file: target });
  }
  if (!stat.isDirectory()) return [target];
  const names = readdirSync(full)
    .filter((name) => !name.startsWith('.') && !isSidecarName(name) && name.toLowerCase() !== 'manifest.csv')
    .filter((name) => statSync(join(full, name)).isFile())
    .sort();
  if (names.length === 0)
    throw new BandshelfError('EMPTY_FILE', 'the folder holds no spectrum files', { file: target });
  return names.map((name) => join(target, name));
}

function readUnknowns(file: string, cwd: string): Unknown[] {
  let bytes: Uint8Array;
  try {
    bytes = readFileSync(resolve(cwd, file));
  } catch (error) {
    throw new BandshelfError('IO_ERROR', `cannot read: ${describeIoError(error)}`, {
      file,
      cause: error,
    });
  }
  const hash = createHash('sha256').update(bytes).digest('hex');
  const parsed = readSpectrumFile(bytes, { file });
  return parsed.map((p) => {
    const title = typeof p.meta.title === 'string' ? p.meta.title : undefined;
    return {
      file,
      ...(parsed.length > 1 && p.source.block !== undefined ? { block: p.source.block } : {}),
      hash,
      ...(title === undefined ? {} : { title }),
      spectrum: p.spectrum,
      warnings: p.warnings.map((w) => (w.line === undefined ? w.message : `line ${w.line}: ${w.message}`)),
    };
  });
}

function oneLine(error: unknown): string {
  if (error instanceof BandshelfError) return error.oneLine();
  return `internal error: ${error instanceof Error ? error.message.split('\n')[0] : String(error)}`;
}

/**
 * One unknown → one report. In batch mode an unknown that cannot be read, processed or scored is recorded with its
 * error and the rest go on; a single unknown's error is thrown. Library-level problems (no library, empty library,
 * unknown release, a `--with` id that does not exist) always throw.
 */
export function matchUnknowns(
  targets: readonly string[],
  options: MatchUnknownsOptions,
  context: CommandContext,
): MatchRun {
  if (targets.length === 0) throw new BandshelfError('BAD_OPTION', 'name an unknown spectrum file or folder');
  const metrics = options.metrics ?? ['pearson'];
  const top = options.top ?? 10;
  const minOverlap = options.minOverlap ?? 200;
  const ranges = options.ranges ?? [];
  const forced = [...new Set(options.with ?? [])];
  const maxComponents = options.maxComponents ?? 6;
  const poolSize = options.candidates ?? 30;
  const tolerance = options.tolerance ?? 4;
  const warnings: string[] = [];

  const library = openLibrary(libraryPath(options.library, context.cwd), { readonly: true });
  try {
    const set: SearchSet = readSearchSet(library, options.at === undefined ? {} : { at: options.at });
    if (set.entries.length === 0) {
      throw new BandshelfError(
        'EMPTY_LIBRARY',
        set.at === null
          ? 'the library has no entries to match against (add some with `bandshelf add`)'
          : `release '${set.at}' holds no entries to match against`,
      );
    }
    const rowOf = new Map(set.entries.map((e, i) => [e.id, i]));
    for (const id of forced) {
      if (!rowOf.has(id)) {
        throw new BandshelfError(
          'NOT_FOUND',
          `--with names '${id}', which is not an entry of ${set.at === null ? 'the library' : `release '${set.at}'`}`,
          { field: 'with' },
        );
      }
    }
    const recipe =
      options.recipe === undefined
        ? set.recipe
        : readRecipeFile(resolve(context.cwd, options.recipe), { label: options.recipe });
    const references = recipeReferences(library, recipe, options.at === undefined ? {} : { at: options.at });
    let componentVectors: MixtureCandidate[] = [];
    const assignments = [...shippedAssignments(), ...listAssignments(library)];
    const index = buildBandIndex(set);
    const wrongHits = cachedWrongHitNull({ libraryPath: library.path, set });
    const axis = gridAxis(set.grid);

    const files = targets.flatMap((t) => filesOf(t, context.cwd));
    const outcomes: MatchOutcome[] = [];
    const unknowns: { outcome: MatchOutcome; unknown: Unknown; processed: Float64Array }[] = [];
    const single = files.length === 1;
    for (const [i, file] of files.entries()) {
      context.progress(i, files.length, basename(file));
      let read: Unknown[];
      try {
        read = readUnknowns(file, context.cwd);
      } catch (error) {
        if (single) throw error;
        outcomes.push({ file, error: oneLine(error) });
        continue;
      }
      for (const unknown of read) {
        const outcome: MatchOutcome = {
          file,
          ...(unknown.block === undefined ? {} : { block: unknown.block }),
        };
        outcomes.push(outcome);
        try {
          const { processed } = processSpectrum(unknown.spectrum, recipe, set.grid, { references, file });
          // The search refuses a small overlap for the whole batch; check each unknown first so one bad file
          // does not stop the others.
          const mask = scoringMask(processed, set.grid, { ranges, exclude: recipe.exclude });
          const overlap = coveredSpan(mask, set.grid.step);
          if (overlap < minOverlap || overlap === 0) {
            throw new BandshelfError(
              'SMALL_OVERLAP',
              `the unknown covers only ${overlap} cm⁻¹ of the library grid inside the scoring ranges; at least ` +
                `${minOverlap} cm⁻¹ are needed (lower --min-overlap or widen --range)`,
              { file, field: 'minOverlap' },
            );
          }
          unknowns.push({ outcome, unknown, processed });
        } catch (error) {
          if (single && read.length === 1) throw error;
          outcome.error = oneLine(error);
        }
      }
    }
    context.progress(files.length, files.length, 'searching');

    const queries = unknowns.map((u) => u.processed);
    const hitsByMetric = new Map<Metric, Hit[][]>();
    const needPool = options.mixture === true;
    const searchMetrics: Metric[] = [...metrics];
    if (needPool && !searchMetrics.includes('pearson')) searchMetrics.push('pearson');
    for (const metric of searchMetrics) {
      const k = metric === 'pearson' && needPool ? Math.max(top, poolSize) : top;
      hitsByMetric.set(
        metric,
        queries.length === 0 ? [] : searchLibrary(library, queries, { set, metric, ranges, k, minOverlap }),
      );
    }
    const degree =
      options.baselineDegree === undefined || options.baselineDegree === 'auto'
        ? recipe.baseline.method === 'none'
          ? 2
          : 0
        : options.baselineDegree;
    // Entries read to process them again over a partial unknown's span, kept for the rest of the batch.
    const views = new Map<number, EntryView>();

    unknowns.forEach(({ outcome, unknown, processed }, q) => {
      try {
        let mixture: (MixtureResult & { candidates: number }) | null = null;
        if (needPool) {
          const poolHits = hitsByMetric.get('pearson')![q]!.slice(0, poolSize);
          const rows = [...forced.map((id) => rowOf.get(id)!), ...poolHits.map((h) => h.row)];
          const offered = mixtureCandidates(library, set, rows, unknown.spectrum, recipe, { views });
          const fit = fitMixture(processed, offered.candidates, {
            grid: set.grid,
            with: forced,
            maxComponents,
            baselineDegree: degree,
            ranges: ranges.length === 0 ? null : ranges,
          });
          const window = offered.window;
          const criterion =
            window === null || offered.reprocessed.length === 0
              ? fit.criterion
              : `${fit.criterion}; the unknown covers only ${window.max.toFixed(0)}–${window.min.toFixed(0)} cm⁻¹, so ` +
                `${offered.reprocessed.length} reference(s) reaching beyond it were processed again over that span ` +
                `with their own recipes (baseline and normalisation over the same span as the unknown's)`;
          mixture = { ...fit, criterion, candidates: new Set(offered.candidates.map((c) => c.id)).size };
          componentVectors = offered.candidates;
        }
        const bands = identifyBands(
          { wavenumber: axis, absorbance: processed },
          { assignments, index, mixture, tolerance, componentVectors },
        );
        const byMetric: Partial<Record<Metric, Hit[]>> = {};
        for (const metric of metrics) byMetric[metric] = hitsByMetric.get(metric)![q]!.slice(0, top);
        outcome.report = buildMatchReport({
          query: {
            file: unknown.file,
            ...(unknown.block === undefined ? {} : { block: unknown.block }),
            hash: unknown.hash,
            ...(unknown.title === undefined ? {} : { title: unknown.title }),
            recipe,
            recipeSource: options.recipe === undefined ? 'library' : 'file',
            grid: set.grid,
            ranges,
            processed,
            warnings: unknown.warnings,
          },
          library: { name: library.name, release: set.at, stateKey: set.stateKey, entries: set.entries },
          settings: { top, minOverlap, tolerance, maxComponents, with: forced },
          metrics,
          hitsByMetric: byMetric,
          mixture,
          bands,
          wrongHitNull: wrongHits,
          referenceOf: (row) => set.processed.subarray(row * axis.length, (row + 1) * axis.length),
        });
      } catch (error) {
        if (unknowns.length === 1 && outcomes.length === 1) throw error;
        outcome.error = oneLine(error);
      }
    });
    for (const u of unknowns) {
      for (const w of u.unknown.warnings) warnings.push(`${u.unknown.file}: ${w}`);
    }
    return { outcomes, batch: outcomes.length > 1, warnings };
  } finally {
    closeLibrary(library);
  }
}

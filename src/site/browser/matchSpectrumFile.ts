// Matches a dropped spectrum file against the published data with the one match pipeline `bandshelf match` runs
// (browser-safe: the same reader, recipe, search, mixture fit and band identification, bundled for the page).
import { readSpectrumFile } from '../../formats/readSpectrumFile.js';
import type { TimeUnit } from '../../formats/readTimeTrace.js';
import type { SpectrumReadOptions } from '../../formats/types.js';
import { buildBandIndex } from '../../match/buildBandIndex.js';
import { compareAtCoarserResolution } from '../../match/compareAtCoarserResolution.js';
import { instantiateScoreKernels } from '../../match/instantiateScoreKernels.js';
import { jsScoreKernels } from '../../match/jsScoreKernels.js';
import { runMatchPipeline } from '../../match/pipeline/runMatchPipeline.js';
import type { MatchScorer, MatchSource, MatchUnknown } from '../../match/pipeline/types.js';
import { resolutionForUnknown } from '../../match/resolutionForUnknown.js';
import { searchSpectra } from '../../match/searchSpectra.js';
import { type Metric, MIN_OVERLAP_DEFAULT } from '../../match/searchTypes.js';
import { shippedAssignments } from '../../match/shippedAssignments.js';
import { singleThreadRunner } from '../../match/singleThreadRunner.js';
import { timeDomainUnknown } from '../../match/timeDomainUnknown.js';
import type { BandIndex } from '../../match/types.js';
import type { BandAssignment } from '../../schema/bandAssignment.js';
import type { MatchHit, MatchReport } from '../../schema/matchReport.js';
import type { Grid, Recipe, WavenumberWindow } from '../../schema/recipe.js';
import { resolutionOf } from '../../spectrum/resolutionOf.js';
import { publishedMatchSource } from './publishedMatchSource.js';

/** What the build writes beside the binary matrix (`assets/search-matrix.json`), plus the decoded matrix. */
export interface PublishedSearchSet {
  grid: Grid;
  recipe: Recipe;
  stateKey: string;
  /** The library's name. @default 'published library' */
  name?: string;
  at?: string | null;
  entries: {
    id: string;
    revision: number;
    hash?: string;
    name: string;
    class: string;
    path: string | null;
    /** The newest review decision (older sites publish none). @default 'reviewed' */
    reviewState?: string;
    /** Processed with its own recipe, not the library default. @default false */
    ownRecipe?: boolean;
  }[];
  /** rows × gridLength(grid), NaN where not covered. */
  processed: Float32Array;
  references: Record<string, { wavenumber: ArrayLike<number>; absorbance: ArrayLike<number> }>;
  /** Every stored peak, `entry[k]` a row (older sites publish none: no library candidates per band). */
  peaks?: {
    entry: ArrayLike<number>;
    position: ArrayLike<number>;
    height: ArrayLike<number>;
    prominence: ArrayLike<number>;
  };
  /** The library's best-wrong-hit null, as `bandshelf match` computes it. @default none (no p-values) */
  wrongHitNull?: { scores: number[]; entries: number; sampled: number };
  /** The assignment table of `bandshelf match`. @default the shipped table */
  assignments?: BandAssignment[];
}

export interface MatchSpectrumFileOptions {
  /** Hits returned.
   * @default 10 */
  k?: number;
  /** Least shared coverage, cm⁻¹ (as `bandshelf match --min-overlap`).
   * @default MIN_OVERLAP_DEFAULT (200) */
  minOverlap?: number;
  /** Run the mixture fit, as `bandshelf match --mixture`. @default true */
  mixture?: boolean;
  /** Scoring windows, cm⁻¹, as `bandshelf match --range`. @default [] (the whole grid) */
  ranges?: readonly WavenumberWindow[];
  /** The metric the hits are ranked by, as `bandshelf match --metric`. @default 'pearson' */
  metric?: Metric;
  /** Classes left out of the hits and the fit, as `bandshelf match --exclude-class`. @default [] */
  excludeClass?: readonly string[];
  /** The published source already built from `set` (keeps loaded entries across files). @default built from set */
  source?: MatchSource;
  /**
   * How to read the file, as `bandshelf match --x-unit/--y-unit/--block/--column`. @default {} (as the file says)
   */
  read?: Pick<SpectrumReadOptions, 'xUnit' | 'yUnit' | 'block' | 'column'>;
  /**
   * The file is a field-resolved sample trace, converted against these reference traces (and averaged with any
   * further sample traces), as `bandshelf match FILE --time-domain --reference REF [--time-unit U]`; `read` is then
   * not used. @default undefined (a spectrum file)
   */
  timeDomain?: { references: TraceBytes[]; samples?: TraceBytes[]; timeUnit?: TimeUnit };
}

/** A trace file as the page holds it: its name and bytes. */
export interface TraceBytes {
  name: string;
  bytes: Uint8Array;
}

export interface FileMatch {
  /** Title of the spectrum read (JCAMP-DX TITLE) or the file name. */
  title: string;
  /** Spectra in the file; only the first is matched. */
  spectra: number;
  warnings: string[];
  hits: (MatchHit & { path: string | null })[];
  /** The full report, as `bandshelf match --json --mixture` writes it. */
  report: MatchReport;
  /** Milliseconds from the file's bytes to the ranked hits (read, process, score) and to the full report. */
  timings: { hits: number; report: number };
}

/** A source's band index, built once per source (the pipeline would otherwise build it for every file). */
const bandIndexes = new WeakMap<MatchSource, BandIndex>();

/**
 * The WebAssembly kernels `bandshelf match` runs, so scores agree to the last bit; where the engine or the page's
 * Content-Security-Policy (no 'wasm-unsafe-eval') refuses WebAssembly, the JavaScript kernels serve.
 */
export const pageScorer: MatchScorer = (source, queries, options) =>
  searchSpectra(source, queries, {
    ...options,
    precision: 'exact',
    runner: (matrix) =>
      singleThreadRunner(instantiateScoreKernels(matrix.memory) ?? jsScoreKernels(matrix.memory)),
  });

/** The file's SHA-256 (Web Crypto, in the browser and in Node alike). */
async function sha256(bytes: Uint8Array): Promise<string> {
  const digest = await globalThis.crypto.subtle.digest('SHA-256', new Uint8Array(bytes));
  return Array.from(new Uint8Array(digest), (b) => b.toString(16).padStart(2, '0')).join('');
}

/** Concatenated bytes (the hash of a trace pair covers the samples' bytes, then the references'). */
function joined(parts: readonly Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((n, p) => n + p.byteLength, 0));
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.byteLength;
  }
  return out;
}

/** The unknown as the pipeline takes it, and what the page says of the file; `resolution` null skips like-with-like. */
interface ReadUnknown {
  unknown: MatchUnknown;
  title: string | undefined;
  spectra: number;
  recipe: Recipe;
  resolution: number | null;
}

async function readUnknown(
  bytes: Uint8Array,
  file: string,
  source: MatchSource,
  options: MatchSpectrumFileOptions,
): Promise<ReadUnknown> {
  const pair = options.timeDomain;
  if (pair !== undefined) {
    // As `match --time-domain --reference`: one unknown from the traces, no like-with-like step (as the CLI).
    const samples = [{ name: file, bytes }, ...(pair.samples ?? [])];
    const hash = await sha256(joined([...samples, ...pair.references].map((f) => f.bytes)));
    const unknown = timeDomainUnknown(
      { samples, references: pair.references, recipe: source.recipe, file, hash },
      pair.timeUnit === undefined ? {} : { timeUnit: pair.timeUnit },
    );
    return { unknown, title: undefined, spectra: 1, recipe: source.recipe, resolution: null };
  }
  const parsed = readSpectrumFile(bytes, { ...(options.read ?? {}), file });
  const first = parsed[0]!;
  const title = typeof first.meta.title === 'string' ? first.meta.title : undefined;
  const matched = resolutionForUnknown(first.spectrum, source.recipe, { stated: first.meta.resolution });
  const warnings = [
    ...first.warnings.map((w) => (w.line === undefined ? w.message : `line ${w.line}: ${w.message}`)),
    ...matched.warnings,
  ];
  const unknown: MatchUnknown = {
    file,
    ...(parsed.length > 1 && first.source.block !== undefined ? { block: first.source.block } : {}),
    ...(first.source.column === undefined ? {} : { column: first.source.column }),
    hash: await sha256(bytes),
    ...(title === undefined ? {} : { title }),
    spectrum: first.spectrum,
    ...(first.saturated === undefined ? {} : { saturated: first.saturated }),
    warnings,
  };
  const resolution = resolutionOf(first.spectrum, { stated: first.meta.resolution }).value;
  return { unknown, title, spectra: parsed.length, recipe: matched.recipe, resolution };
}

export async function matchSpectrumFile(
  bytes: Uint8Array,
  file: string,
  set: PublishedSearchSet,
  options: MatchSpectrumFileOptions = {},
): Promise<FileMatch> {
  const started = performance.now();
  let scored = started;
  const source = options.source ?? publishedMatchSource(set);
  let index = bandIndexes.get(source);
  if (index === undefined) {
    index = buildBandIndex(source);
    bandIndexes.set(source, index);
  }
  const { unknown, title, spectra, recipe, resolution } = await readUnknown(bytes, file, source, options);
  const warnings = [...unknown.warnings];
  const piped = await runMatchPipeline(
    {
      unknown,
      source,
      // The last search ends before the fit: its end is when the hits are ranked.
      scorer: async (...args) => {
        const hits = await pageScorer(...args);
        scored = performance.now();
        return hits;
      },
      assignments: set.assignments ?? shippedAssignments(),
    },
    {
      top: options.k ?? 10,
      minOverlap: options.minOverlap ?? MIN_OVERLAP_DEFAULT,
      mixture: options.mixture ?? true,
      ranges: options.ranges ?? [],
      metrics: [options.metric ?? 'pearson'],
      excludeClass: options.excludeClass ?? [],
      index,
      ...(recipe === source.recipe ? {} : { recipe }),
    },
  );
  let report = piped;
  if (resolution !== null) {
    // Like with like, as `bandshelf match` does: hits of another resolution scored again at the coarser of the two.
    const alike = await compareAtCoarserResolution({
      report: piped,
      unknown: unknown.spectrum,
      resolution,
      source,
    });
    report = alike.report;
    warnings.push(...alike.notes);
  }
  const paths = new Map(set.entries.map((e) => [e.id, e.path]));
  return {
    title: title !== undefined && title !== '' ? title : file,
    spectra,
    warnings,
    hits: report.hits.map((h) => ({ ...h, path: paths.get(h.id) ?? null })),
    report,
    timings: { hits: scored - started, report: performance.now() - started },
  };
}

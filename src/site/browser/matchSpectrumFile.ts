// Matches a dropped spectrum file against the published data with the one match pipeline `bandshelf match` runs
// (browser-safe: the same reader, recipe, search, mixture fit and band identification, bundled for the page).
import { readSpectrumFile } from '../../formats/readSpectrumFile.js';
import { readTraceSpectrum, type TraceFile } from '../../formats/readTraceSpectrum.js';
import type { ParsedSpectrum, SpectrumReadOptions } from '../../formats/types.js';
import { buildBandIndex } from '../../match/buildBandIndex.js';
import { instantiateScoreKernels } from '../../match/instantiateScoreKernels.js';
import { jsScoreKernels } from '../../match/jsScoreKernels.js';
import { runMatchPipeline } from '../../match/pipeline/runMatchPipeline.js';
import type { MatchScorer, MatchSource } from '../../match/pipeline/types.js';
import { searchSpectra } from '../../match/searchSpectra.js';
import { type Metric, MIN_OVERLAP_DEFAULT } from '../../match/searchTypes.js';
import { shippedAssignments } from '../../match/shippedAssignments.js';
import { singleThreadRunner } from '../../match/singleThreadRunner.js';
import type { BandIndex } from '../../match/types.js';
import type { BandAssignment } from '../../schema/bandAssignment.js';
import type { MatchHit, MatchReport } from '../../schema/matchReport.js';
import { type Grid, type Recipe, timeDomainSchema, type WavenumberWindow } from '../../schema/recipe.js';
import { pinNoiseFloor } from '../../spectrum/trace/pinNoiseFloor.js';
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
   * The file is a field-resolved sample trace and these are its reference traces, as `bandshelf match
   * --time-domain --reference FILE [--time-unit U]`: converted with the published recipe's time-domain step (or the
   * step's defaults), its noise floor pinned as the CLI pins it; further `samples` are averaged with it, as several
   * sample files are in the CLI. @default undefined (a spectrum file)
   */
  timeDomain?: { references: readonly TraceFile[]; samples?: readonly TraceFile[]; timeUnit?: 'fs' | 'ps' };
  /**
   * How the file was measured, as `bandshelf match --technique` (`atr`: the ATR correction ATR entries get).
   * @default the file's own label, if any (else no ATR correction)
   */
  technique?: string;
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

/** What the match reads of a file: a parsed spectrum, or a converted trace pair (which has no block or column). */
type ReadUnknown = Pick<ParsedSpectrum, 'spectrum' | 'meta' | 'warnings' | 'saturated'> & {
  source: Partial<Pick<ParsedSpectrum['source'], 'block' | 'column'>>;
};

/** A sample trace and its references as the one unknown the rest of the match reads. */
function traceUnknown(
  bytes: Uint8Array,
  file: string,
  recipe: Recipe,
  traces: NonNullable<MatchSpectrumFileOptions['timeDomain']>,
  recipeGridStep: number,
): ReadUnknown {
  const step = pinNoiseFloor(recipe.timeDomain ?? timeDomainSchema.parse({}));
  const result = readTraceSpectrum(
    { samples: [{ name: file, bytes }, ...(traces.samples ?? [])], references: traces.references, step },
    { ...(traces.timeUnit === undefined ? {} : { timeUnit: traces.timeUnit }), gridStep: recipeGridStep },
  );
  // The record length's resolution 1/(c·T), as `bandshelf match --time-domain` gives it to like with like.
  return {
    spectrum: result.spectrum,
    meta: { resolution: result.recordResolution },
    warnings: result.warnings,
    source: {},
  };
}

export async function matchSpectrumFile(
  bytes: Uint8Array,
  file: string,
  set: PublishedSearchSet,
  options: MatchSpectrumFileOptions = {},
): Promise<FileMatch> {
  const started = performance.now();
  let scored = started;
  const read = options.read ?? {};
  const traces = options.timeDomain;
  const parsed: ReadUnknown[] =
    traces === undefined
      ? readSpectrumFile(bytes, { ...read, file })
      : [
          traceUnknown(
            bytes,
            file,
            options.source?.recipe ?? set.recipe,
            traces,
            (options.source?.grid ?? set.grid).step,
          ),
        ];
  const first = parsed[0]!;
  const title = typeof first.meta.title === 'string' ? first.meta.title : undefined;
  const source = options.source ?? publishedMatchSource(set);
  let index = bandIndexes.get(source);
  if (index === undefined) {
    index = buildBandIndex(source);
    bandIndexes.set(source, index);
  }
  const technique =
    options.technique ?? (typeof first.meta.technique === 'string' ? first.meta.technique : undefined);
  const report = await runMatchPipeline(
    {
      unknown: {
        file,
        ...(parsed.length > 1 && first.source.block !== undefined ? { block: first.source.block } : {}),
        ...(first.source.column === undefined ? {} : { column: first.source.column }),
        // As the CLI: a trace pair's hash covers the sample files' bytes, then the references'.
        hash: await sha256(
          traces === undefined
            ? bytes
            : joined([
                bytes,
                ...(traces.samples ?? []).map((f) => f.bytes),
                ...traces.references.map((f) => f.bytes),
              ]),
        ),
        ...(title === undefined ? {} : { title }),
        spectrum: first.spectrum,
        ...(first.saturated === undefined ? {} : { saturated: first.saturated }),
        warnings: first.warnings.map((w) =>
          w.line === undefined ? w.message : `line ${w.line}: ${w.message}`,
        ),
        resolution: first.meta.resolution,
        ...(technique === undefined ? {} : { technique }),
      },
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
    },
  );
  // The reader's, the resolution step's and the like-with-like notes, as the report records them.
  const warnings = [...report.query.warnings];
  const paths = new Map(set.entries.map((e) => [e.id, e.path]));
  return {
    title: title !== undefined && title !== '' ? title : file,
    spectra: parsed.length,
    warnings,
    hits: report.hits.map((h) => ({ ...h, path: paths.get(h.id) ?? null })),
    report,
    timings: { hits: scored - started, report: performance.now() - started },
  };
}

// Shapes of the full-spectrum similarity search: the search set it reads, the matrices it scans, the hits it gives.
import type { Grid, WavenumberWindow } from '../schema/recipe.js';

/**
 * `pearson`: correlation of mean-centred vectors; `derivative`: Pearson on Savitzky–Golay first derivatives
 * (blind to offsets and slow baselines); `cosine`: cosine of the uncentred vectors; `euclidean`: distance between
 * the unit-normalised vectors (0 = same shape, at most 2).
 */
/** The least wavenumber range, cm⁻¹, unknown and reference must share by default: the one owner of that default. */
export const MIN_OVERLAP_DEFAULT = 200;

export type Metric = 'pearson' | 'derivative' | 'cosine' | 'euclidean';

/** One library row as the search reports it. A library `SearchSetEntry` satisfies it. */
export interface ScoringEntry {
  id: string;
  revision: number;
  name: string;
  class: string;
}

/**
 * What the search needs from a library state; a library `SearchSet` satisfies it, and so does a plain object in a
 * test or in the browser.
 */
export interface ScoringSet {
  grid: Grid;
  /** Only the exclusion windows are read: they never take part in a score. */
  recipe: { exclude: readonly WavenumberWindow[] };
  /** Equal keys mean equal rows: the matrix cache is keyed by it. */
  stateKey: string;
  entries: readonly ScoringEntry[];
  /**
   * entries.length × gridLength(grid), row-major, ascending wavenumber, NaN where not covered. A library set may
   * read it from disk on first access, so code needing only some rows goes through `processedRow`.
   */
  processed: Float32Array;
  /** Row r of `processed`, read without the others where the set can. @default absent: a view on `processed` */
  row?: (r: number) => Float32Array;
}

export interface Hit {
  id: string;
  revision: number;
  name: string;
  class: string;
  /** Row of the entry in the search set. */
  row: number;
  /**
   * pearson, derivative, cosine: the correlation clamped to 0–1, so an anti-correlated reference shows as 0 (no
   * likeness) rather than as a negative score; the unclamped value is `rawScore`. euclidean: the distance (0–2,
   * lower is closer).
   */
  score: number;
  /** The unclamped correlation (−1 … 1); for euclidean the distance again. */
  rawScore: number;
  /** Wavenumber range both spectra cover inside the scoring ranges, cm⁻¹ (summed over covered stretches). */
  overlap: number;
  /** How far this hit leads the next one in the ranking, in rawScore units (≥ 0); null for the last scored row. */
  gapToNext: number | null;
  /**
   * Standing among the other library scores of this query: (rawScore − mean) / sd with mean and sd over every
   * scored row except this one, sign-flipped for euclidean so that larger always means better; null when fewer
   * than three rows were scored or the others all scored alike. After an int8 scan
   * the rows not rescored enter the mean and sd with their int8 estimates (within about 1e-3 of the exact value).
   */
  z: number | null;
}

/** What a query's search did, for reports and benchmarks (handed to `onQuery`). */
export interface QuerySummary {
  metric: Metric;
  /** Wavenumber range the query covers inside the scoring ranges, cm⁻¹. */
  overlap: number;
  /** Grid points in the query's scoring mask. */
  points: number;
  /** Rows scored by the matrix kernel (their coverage holds the whole mask). */
  fullRows: number;
  /** Rows scored exactly over a partial overlap of at least `minOverlap`. */
  partialRows: number;
  /** Rows left out: overlap below `minOverlap`, or flat / empty over the mask. */
  dropped: number;
  /** How the full rows were scored. */
  path: 'exact' | 'exact-batch' | 'int8+exact' | 'int8+exact-batch';
  /** Full rows rescored exactly after a reduced-precision scan (0 on the exact paths). */
  rescored: number;
  /** Mean and standard deviation of rawScore over every scored row (the z-score basis). */
  mean: number;
  sd: number;
}

/** Names of the score kernels; each takes a half-open range [r0, r1) as its first two arguments. */
export type KernelName = 'dotF32' | 'dotF32Rows' | 'dotF32Batch' | 'dotI8' | 'dotI8Batch' | 'sumF32';

/**
 * The score kernels over one memory. Pointers are byte offsets into that memory; rows are `stride` elements,
 * stride a multiple of 16 and rows zero-padded. See wasm/scoreKernels.wat for the exact contracts.
 */
export interface ScoreKernels {
  /** out[r] = Σ mat[r, i] · vec[i] (float32). */
  dotF32(r0: number, r1: number, mat: number, stride: number, vec: number, out: number): void;
  /** out[j] = Σ mat[idx[j], i] · vec[i]; idx uint32. */
  dotF32Rows(
    j0: number,
    j1: number,
    mat: number,
    stride: number,
    vec: number,
    idx: number,
    out: number,
  ): void;
  /** out[q · outStride + r] = Σ mat[r, i] · queries[q, i]; nq a multiple of 4. */
  dotF32Batch(
    r0: number,
    r1: number,
    mat: number,
    stride: number,
    queries: number,
    nq: number,
    out: number,
    outStride: number,
  ): void;
  /** out[r] = scale[r] · queryScale · Σ mat8[r, i] · vec16[i] (int8 rows, int16 query). */
  dotI8(
    r0: number,
    r1: number,
    mat: number,
    stride: number,
    vec: number,
    scale: number,
    queryScale: number,
    out: number,
  ): void;
  /** out[q · outStride + r] = scale[r] · queryScale[q] · Σ mat8[r, i] · q16[q, i]; nq a multiple of 4. */
  dotI8Batch(
    r0: number,
    r1: number,
    mat: number,
    stride: number,
    queries: number,
    nq: number,
    scale: number,
    queryScale: number,
    out: number,
    outStride: number,
  ): void;
  /** out[r] = Σ mat[r, i]: a plain read of the rows (the memory-bandwidth floor). */
  sumF32(r0: number, r1: number, mat: number, stride: number, out: number): void;
}

/** Runs a kernel over [0, count), on one thread or split across several. */
export interface KernelRunner {
  readonly threads: number;
  /** `args` are the kernel's arguments after its range. */
  run(kernel: KernelName, count: number, args: readonly number[]): void;
}

/** How a matrix's rows are prepared: what the dot product of a prepared row and query then means. */
export interface MatrixPreparation {
  /** `centred`: mean-centred then unit norm over the mask (dot = Pearson r); `unit`: unit norm only (dot = cosine). */
  centring: 'centred' | 'unit';
  /** Savitzky–Golay first derivative taken first (the `derivative` metric), or null. */
  derivative: { window: number; order: number } | null;
}

/** Byte offsets of everything a search matrix keeps in its memory. */
export interface SearchMatrixLayout {
  rows: number;
  cols: number;
  /** Row length in elements: cols rounded up to a multiple of 16. */
  stride: number;
  /** Largest query block the scratch area holds. */
  batch: number;
  /** Scratch (never cached): the query block (float32), its int16 copy and scales, the score planes, row lists. */
  queries: number;
  query16: number;
  queryScales: number;
  scores: number;
  rowList: number;
  rowScores: number;
  /** Start of the cached region; everything from here to `end` is written to and read from the disk cache. */
  cached: number;
  /** uint8 per row: ROW_FULL, ROW_PARTIAL or ROW_EMPTY. */
  status: number;
  /** uint8 per grid point: 1 inside the scoring mask. */
  mask: number;
  /** float32 per row: int8 scale, ‖row − dequantised row‖, ‖dequantised row‖. */
  int8Scale: number;
  int8Error: number;
  int8Norm: number;
  /** float32 rows × stride. */
  f32: number;
  /** int8 rows × stride, or −1 without the reduced-precision copy. */
  i8: number;
  end: number;
}

/** The preprocessed rows of one search set for one preparation and one scoring mask, in a WebAssembly memory. */
export interface SearchMatrix {
  /** Identity of the contents (state key, preparation, mask): equal keys mean equal matrices. */
  key: string;
  preparation: MatrixPreparation;
  layout: SearchMatrixLayout;
  memory: WebAssembly.Memory;
  /** Grid points in the mask and the wavenumber range they cover, cm⁻¹. */
  points: number;
  overlap: number;
}

/** Supplies the matrix for a preparation and mask: builds it, or fetches it from a cache. */
export type MatrixSource = (
  set: ScoringSet,
  preparation: MatrixPreparation,
  mask: Uint8Array,
  key: string,
) => SearchMatrix;

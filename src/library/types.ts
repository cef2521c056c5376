// Shapes of the library of record: what the store hands to the matcher, the site and the CLI.
import type Database from 'better-sqlite3';
import type { SpectrumReadOptions } from '../formats/types.js';
import type { Grid, Recipe } from '../schema/recipe.js';
import type { Peak, QcFlag, Spectrum } from '../spectrum/types.js';

/** An open library file. Obtain with `openLibrary` or `initLibrary`; release with `closeLibrary`. */
export interface Library {
  /** The better-sqlite3 handle; library functions are the only code that should query it. */
  readonly db: Database.Database;
  /** The path the library was opened at, as given. */
  readonly path: string;
  readonly readonly: boolean;
  /** The library's display name (set at `init`). */
  readonly name: string;
  /** The one grid every processed vector lives on. */
  readonly grid: Grid;
  /** The default recipe new entries get unless `add --recipe` overrides it. */
  readonly recipe: Recipe;
  /** ISO time the library was created. */
  readonly createdAt: string;
}

/**
 * What a revision is:
 * - `data`: new data, or the same data under a new recipe (a full ingest);
 * - `metadata`: same data and recipe, new metadata (`edit`);
 * - `retire`: takes the entry out of the current state (`retire`); data, recipe and metadata are the previous revision's.
 */
export type RevisionKind = 'data' | 'metadata' | 'retire';

/** Review state of one revision: draft until a second person approves (`reviewed`) or rejects it. */
export type ReviewState = 'draft' | 'reviewed' | 'rejected';

/** The role of a stored file inside a revision. */
export type FileRole = 'data' | 'sample-trace' | 'reference-trace';

/**
 * Explicit reading options a revision was ingested with (the reader's own, see SpectrumReadOptions; `column` is the
 * header name or number of the y column taken from a delimited file with several); part of its data identity.
 */
export type ReadOptions = Pick<SpectrumReadOptions, 'xUnit' | 'yUnit' | 'block' | 'column' | 'timeUnit'>;

/** A file kept verbatim in a revision. */
export interface StoredFileInfo {
  role: FileRole;
  /** The file name (without folders) it was ingested from. */
  name: string;
  /** SHA-256 of the bytes, lowercase hex. */
  sha256: string;
  size: number;
}

/** Derived figures stored per revision beside the processed vector. */
export interface RevisionExtras {
  /** Least-squares scale of the subtracted reference spectrum, where the recipe subtracts one. */
  referenceScale?: number;
  /**
   * The recipe's multi-reference subtraction: each reference's fitted scale and its standard error (OLS,
   * independent residuals assumed, so a lower bound on correlated spectra).
   */
  subtracted?: { id: string; scale: number; standardError: number }[];
  /**
   * Spectral resolution in cm⁻¹: from the metadata, or estimated from the spectrum (`estimated: true`).
   */
  resolution?: { value: number; estimated: boolean };
  /** Time-domain entries: the reference's spectral dynamic range, orders of magnitude (log10 peak/noise power). */
  dynamicRangeOrders?: number;
  /** Time-domain entries: residual timing spread of the aligned repeated traces, attoseconds. */
  timingSpreadAs?: number;
  /** Time-domain entries: how many sample and reference traces were averaged. */
  traces?: { sample: number; reference: number };
  /** What the reader reported about the source file. */
  source?: { format: string; xUnit: string; yUnit: string; block?: number; column?: string };
  /** Reader warnings (instrument files that bend the standard), with line numbers where known. */
  warnings?: { line?: number; message: string }[];
}

/** One entry of a search set: row `i` of `SearchSet.processed` belongs to `entries[i]`. */
export interface SearchSetEntry {
  id: string;
  revision: number;
  name: string;
  class: string;
  /** The revision's content hash. */
  hash: string;
}

/**
 * Everything a matcher needs in memory: the processed vectors of one library state as one row-major matrix, and an
 * index of every stored peak sorted by position.
 */
export interface SearchSet {
  grid: Grid;
  /** The library's default recipe (an unknown is processed with it before matching). */
  recipe: Recipe;
  /** SHA-256 over the grid and the `id@revision:hash` list of the state; equal keys mean equal search sets. */
  stateKey: string;
  /** The release tag the set was read at, or null for the current working state. */
  at: string | null;
  /** Sorted by id. */
  entries: SearchSetEntry[];
  /**
   * rows × cols, row-major, ascending wavenumber, NaN where the entry is not covered. A lazily read set
   * (`readSearchSet(…, { lazy: true })`) reads every row on the first access: code needing a few rows uses `row`.
   */
  processed: Float32Array;
  /** Row r of `processed` (cols values), read alone when the set is lazy. @default absent: a view on `processed` */
  row?: (r: number) => Float32Array;
  rows: number;
  /** gridLength(grid). */
  cols: number;
  /** Every stored peak of the set, sorted by position; `entry[k]` is the row index into `entries`. */
  peaks: {
    entry: Uint32Array;
    position: Float64Array;
    height: Float64Array;
    prominence: Float64Array;
  };
}

/** One row of `listEntries`. */
export interface EntrySummary {
  id: string;
  revision: number;
  name: string;
  class: string;
  kind: RevisionKind;
  hash: string;
  reviewState: ReviewState;
  /** ISO time of this revision. */
  createdAt: string;
  /** ISO time of the entry's first revision. */
  firstCreatedAt: string;
  /** The full metadata (validated by entryMetaSchema at ingest). */
  meta: Record<string, unknown>;
  /** Lowest and highest covered grid wavenumber, null when nothing is covered. */
  coverage: { min: number; max: number; points: number } | null;
  peakCount: number;
  qcWarnings: number;
}

/** Everything stored about one revision of one entry. */
export interface EntryView {
  id: string;
  revision: number;
  kind: RevisionKind;
  /** True when the entry's newest revision retires it (the view then shows that retire revision). */
  retired: boolean;
  hash: string;
  /** SHA-256 over the files and read options: equal when the data are equal. */
  dataHash: string;
  meta: Record<string, unknown>;
  recipe: Recipe;
  read: ReadOptions;
  files: StoredFileInfo[];
  /** The parsed original spectrum (cm⁻¹ ascending, absorbance), before any processing. */
  original: Spectrum;
  grid: Grid;
  /** gridLength(grid) values, ascending wavenumber, NaN where not covered. */
  processed: Float64Array;
  coverage: { min: number; max: number; points: number } | null;
  peaks: Peak[];
  qc: QcFlag[];
  extras: RevisionExtras;
  author: string;
  message: string;
  createdAt: string;
  reviewState: ReviewState;
  /** The reviews of this revision, oldest first. */
  reviews: ReviewRecord[];
  /** Release tags that contain this exact revision. */
  releases: string[];
}

export interface ReviewRecord {
  state: Exclude<ReviewState, 'draft'>;
  reviewer: string;
  note: string;
  createdAt: string;
}

/** One line of `entryHistory`. */
export interface RevisionSummary {
  revision: number;
  kind: RevisionKind;
  hash: string;
  author: string;
  message: string;
  createdAt: string;
  reviewState: ReviewState;
  reviewer: string | null;
  /** What differs from the previous revision (empty for the first one and for a retire). */
  changed: ChangeKind[];
  releases: string[];
}

export type ChangeKind = 'data' | 'recipe' | 'metadata';

export interface ReleaseSummary {
  tag: string;
  createdAt: string;
  message: string;
  reviewedOnly: boolean;
  entries: number;
}

export interface Release extends ReleaseSummary {
  /** Sorted by id. */
  members: { id: string; revision: number; hash: string }[];
}

/** `diffStates` result; each list sorted by id. */
export interface StateDiff {
  from: string;
  to: string;
  added: { id: string; revision: number }[];
  changed: { id: string; from: number; to: number; what: ChangeKind[] }[];
  removed: { id: string; revision: number }[];
}

/** A problem `checkLibrary` found; `where` names the entry/revision, table or file. */
export interface CheckProblem {
  where: string;
  problem: string;
}

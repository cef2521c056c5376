// Shapes of the site's data layer: what is gathered from the library and the reports, and the page models the
// templates print. Page models hold display-ready strings only, so templates stay free of logic and every string
// reaches the page through the template engine's escaping.

import type {
  ProcessedVectorFile,
  EntryDocument as StoredEntryDocument,
} from '../library/store/entryDocument.js';
import type { BandAssignment } from '../schema/bandAssignment.js';
import type { ContrastReport } from '../schema/contrastReport.js';
import type { MatchReport } from '../schema/matchReport.js';
import type { Grid, Recipe } from '../schema/recipe.js';
import type { Peak, QcFlag, Spectrum } from '../spectrum/types.js';

/** What the site needs to know about one entry without loading its vectors. */
export interface SiteEntrySummary {
  id: string;
  revision: number;
  name: string;
  class: string;
  /** Metadata technique, '' when not given. */
  technique: string;
  sampleForm: string;
  tags: string[];
  synonyms: string[];
  formula: string;
  inchiKey: string;
  cas: string;
  notes: string;
  /** Measurement date from the metadata (yyyy-mm-dd), else the day of the revision. */
  date: string;
  /** ISO time of the revision shown. */
  createdAt: string;
  reviewState: string;
  /** Lowest and highest covered grid wavenumber (cm⁻¹) and the covered points; null when nothing is covered. */
  coverage: { min: number; max: number; points: number } | null;
  synthetic: boolean;
  /** All metadata as stored. */
  meta: Record<string, unknown>;
}

/** One revision in an entry's history. */
export interface SiteHistoryItem {
  revision: number;
  kind: string;
  hash: string;
  author: string;
  message: string;
  createdAt: string;
  reviewState: string;
  /** What differs from the previous revision: data, recipe, metadata. */
  changed: string[];
  /** Release tags holding this revision. */
  releases: string[];
}

/** Everything an entry page and its downloads show. */
export interface SiteEntryDetail {
  summary: SiteEntrySummary;
  hash: string;
  original: Spectrum;
  grid: Grid;
  /** gridLength(grid) values, ascending wavenumber, NaN where not covered. */
  processed: Float32Array | Float64Array;
  recipe: Recipe;
  peaks: Peak[];
  qc: QcFlag[];
  /** Figures stored beside the vectors (reference scale, dynamic range, timing spread, source format …). */
  extras: Record<string, unknown>;
  files: { role: string; name: string; sha256: string; size: number }[];
  history: SiteHistoryItem[];
}

export interface SiteReleaseDiff {
  added: { id: string }[];
  changed: { id: string; what: string[] }[];
  removed: { id: string }[];
}

export interface SiteRelease {
  tag: string;
  createdAt: string;
  message: string;
  reviewedOnly: boolean;
  entries: number;
  /** The release before this one, null for the first. */
  previous: string | null;
  /** Against `previous` (everything added for the first release). */
  diff: SiteReleaseDiff;
}

/** A band-assignment row as the site shows it: the schema's own fields (`BandAssignment`), no copy of its shape. */
export type SiteAssignment = Pick<
  BandAssignment,
  'min' | 'max' | 'centre' | 'label' | 'vibration' | 'group' | 'class' | 'source' | 'basis' | 'origin'
>;

/** A validated match report and the name of the file it came from. */
export interface SiteReport {
  /** URL segment: the file name without `.json`, reduced to safe characters. */
  slug: string;
  /** The file name as found in the reports folder. */
  file: string;
  /** The report as `matchReportSchema` parsed it. */
  report: MatchReport;
  /** The unknown's file name and title were withheld (`site --redact`); the report names it by its hash.
   * @default false */
  redacted?: boolean;
}

/** Everything one site build reads, gathered once; entry vectors are loaded one entry at a time. */
export interface SiteSource {
  /** The library's display name. */
  name: string;
  /** The release the site shows, null for the working state. */
  at: string | null;
  /** Hash of the revision set shown (`SearchSet.stateKey`). */
  stateKey: string;
  grid: Grid;
  recipe: Recipe;
  /** Sorted by id. */
  entries: SiteEntrySummary[];
  /** Oldest first. */
  releases: SiteRelease[];
  assignments: SiteAssignment[];
  /** The processed vectors of the state shown, rows in `entries` order. */
  matrix: {
    processed: Float32Array;
    rows: number;
    cols: number;
    ids: string[];
    revisions: number[];
    /** Each revision's content hash, rows in `ids` order. */
    hashes: string[];
    /** Every stored peak of the state (`entry[k]` a row), for the in-browser match pipeline's band index. */
    peaks: { entry: Uint32Array; position: Float64Array; height: Float64Array; prominence: Float64Array };
    /** The assignment table `bandshelf match` uses (shipped rows plus the library's own). */
    assignments: BandAssignment[];
    /** The library's best-wrong-hit null, so the in-browser p-values equal `bandshelf match`'s. */
    wrongHitNull: { scores: number[]; entries: number; sampled: number };
  };
  /** Library spectra the recipe subtracts or corrects against, by id, for the in-browser matcher. */
  references: Record<string, Spectrum>;
  loadEntry: (id: string) => SiteEntryDetail;
}

/** A label and a display value, plus an outbound link where the value is a DOI. */
export interface SiteRow {
  label: string;
  value: string;
  /** Only ever an https://doi.org/ address built by the site, never a string from the metadata. */
  href?: string;
}

/** A decimated trace for a plot: ascending x, null where the plot must break (not covered). */
export interface PlotTrace {
  x: number[];
  y: (number | null)[];
}

/** What an entry page's plot draws. */
export interface EntryPlotData {
  original: PlotTrace | null;
  processed: PlotTrace | null;
  /** Axis titles. */
  originalLabel: string;
  processedLabel: string;
  /** Points before decimation, so the page can say how much it thinned. */
  originalPoints: number;
  processedPoints: number;
}

export interface EntryPage {
  id: string;
  /** The entry's folder name in the site (the id, made safe); also the base of its download file names. */
  slug: string;
  /** Site path of the page without the prefix, e.g. `entries/serum-07/`. */
  path: string;
  name: string;
  class: string;
  technique: string;
  revision: number;
  reviewState: string;
  createdAt: string;
  synthetic: boolean;
  coverage: string;
  metaRows: SiteRow[];
  /** Stored figures such as the dynamic range of a time-domain reference. */
  extraRows: SiteRow[];
  peaks: { position: string; height: string; prominence: string; fwhm: string; assignments: string }[];
  qc: { level: string; code: string; message: string; value: string }[];
  history: {
    revision: number;
    kind: string;
    date: string;
    author: string;
    message: string;
    changed: string;
    reviewState: string;
    releases: string;
    shown: boolean;
  }[];
  releases: { tag: string; revision: number; anchor: string }[];
  /** The JSON download (static: metadata, the original data, peaks, QC, recipe). */
  dataFile: { file: string; bytes: number; size: string };
  /** The processed vector as little-endian float32 (static), exactly as stored. */
  processedFile: { file: string; bytes: number; size: string };
  /** Formats the page derives from the JSON in the browser with the project's writers, on request. */
  derived: { format: 'csv' | 'jcamp-dx'; label: string; file: string }[];
  /** The processing recipe, step by step. */
  recipe: SiteRow[];
}

/**
 * The JSON download of an entry (`entries/<id>/<id>.json`): the entry's one JSON form (`bandshelf show ID --json`)
 * with the processed vector in a file beside it.
 */
export type EntryDocument = Omit<StoredEntryDocument, 'processed'> & { processed: ProcessedVectorFile };

export interface BrowseRow {
  id: string;
  path: string;
  name: string;
  class: string;
  technique: string;
  techniqueLabel: string;
  sampleForm: string;
  /** Tags joined for display. */
  tags: string;
  /** Tags as `|a|b|` so a filter can test membership with one substring search. */
  tagKey: string;
  date: string;
  revision: number;
  /** draft, reviewed or rejected: the newest review decision of the revision shown. */
  reviewState: string;
  /** Covered span as `high–low` in cm⁻¹, or 'none'. */
  coverage: string;
  /** Width of the covered span in cm⁻¹ (0 when none), for sorting. */
  coverageWidth: number;
}

export interface ReleasePage {
  tag: string;
  /** URL fragment on the releases page. */
  anchor: string;
  date: string;
  message: string;
  reviewedOnly: boolean;
  entries: number;
  previous: string | null;
  added: { id: string; path: string | null }[];
  changed: { id: string; path: string | null; what: string }[];
  removed: { id: string; path: string | null }[];
  shown: boolean;
}

export interface AssignmentRow {
  range: string;
  label: string;
  vibration: string;
  group: string;
  class: string;
  source: string;
  basis: string;
  origin: string;
}

/** The page model of one match report; built by reportPage. */
export interface ReportPage {
  slug: string;
  path: string;
  file: string;
  title: string;
  /** One-line summaries for the reports index. */
  summary: string;
  rows: SiteRow[];
  state: SiteRow[];
  /** The `id@revision` list the report was made against ('' when the report pins the state by its key only). */
  revisions: string;
  hits: {
    metric: string;
    rows: {
      rank: number;
      id: string;
      path: string | null;
      name: string;
      score: string;
      extra: string;
      /** Why this hit: each region's share of r as a bar segment (percent of Σ|share|), empty when not computed. */
      why: { label: string; percent: number; negative: boolean; title: string }[];
      /** Cautions on the entry hit ('draft', 'recipe differs'); empty when none. */
      marks: string[];
    }[];
  }[];
  mixture: {
    r2: string;
    components: {
      id: string;
      path: string | null;
      name: string;
      weight: string;
      /** 95 % interval of the weight, `low – high` (∞ when unbounded). */
      interval: string;
      share: string;
      /** How it entered: forced in by the user, or added by the selection (with its RSS drop). */
      how: string;
      /** 'yes', or why not (the interval reaches 0): a component that is not significant is not reported as found. */
      significant: string;
      /** Candidates this spectrum cannot tell apart from it (the report's `alternatives`). */
      alternatives: { id: string; path: string | null }[];
    }[];
    /** Ids the user forced into the fit (`match --with`). */
    forced: string[];
    /** The selection criterion in one line, as the CLI prints it after `Rule:`. */
    criterion: string;
    /** The selection, uncertainty, detection-limit and residual-band rules in words. */
    rule: string;
    stopReason: string;
    /** The residual in one line: RSS, noise level and its source, bands on fitted components that misfit. */
    residual: string;
    unexplained: { position: string; height: string }[];
  } | null;
  /** The report's JSON file beside the page (a download), and its size for the link. */
  json: { file: string; size: string };
  bands: {
    position: string;
    height: string;
    width: string;
    kind: string;
    assignments: { label: string; class: string; source: string }[];
    candidates: { id: string; path: string | null }[];
    explained: string;
  }[];
  caution: string;
  /** JSON of the report's plot data, escaped for a `<script type="application/json">` block; '' when none. */
  plotJson: string;
}

/** Everything the templates read (Eleventy global data `bs`). */
export interface SiteView {
  name: string;
  version: string;
  caution: string;
  empty: boolean;
  state: {
    label: string;
    at: string | null;
    stateKey: string;
    shortKey: string;
    newestRelease: string | null;
  };
  grid: string;
  /** The band search's default tolerance, cm⁻¹ (the CLI's). */
  bandTolerance: number;
  counts: {
    total: number;
    byClass: { label: string; count: number }[];
    byTechnique: { label: string; count: number }[];
  };
  newest: { id: string; path: string; name: string; class: string; revision: number; date: string }[];
  browse: {
    rows: BrowseRow[];
    classes: string[];
    techniques: { value: string; label: string }[];
    tags: string[];
    sampleForms: string[];
    reviewStates: string[];
  };
  entries: EntryPage[];
  reports: ReportPage[];
  contrasts: ContrastPage[];
  releases: ReleasePage[];
  assignments: AssignmentRow[];
}

/** One line of a report plot. */
export interface ReportPlotSeries extends PlotTrace {
  name: string;
  /** unknown | hit | fit | residual */
  role: string;
}

/** What a report page's plots draw. */
export interface ReportPlotData {
  /** The unknown and its top hits, on the processed scale. */
  overlay: ReportPlotSeries[];
  /** The unknown, the mixture fit and its residual; empty without a mixture. */
  mixture: ReportPlotSeries[];
  /** Positions of the unexplained bands, cm⁻¹. */
  unexplained: number[];
}

/** A validated contrast report to publish, as read from the reports folder. */
export interface SiteContrast {
  slug: string;
  file: string;
  report: ContrastReport;
}

/** What a contrast page's plots draw: wavenumbers ascending, null where not covered. */
export interface ContrastPlotData {
  labelA: string;
  labelB: string;
  x: number[];
  meanA: (number | null)[];
  sdA: (number | null)[];
  meanB: (number | null)[];
  sdB: (number | null)[];
  difference: (number | null)[];
  lower: (number | null)[];
  upper: (number | null)[];
  /** The difference bands (pointwise q ≤ the report's q), cm⁻¹. */
  regions: { min: number; max: number; sign: string }[];
  /** The significant windows of the band-level test, cm⁻¹. */
  windows: { min: number; max: number }[];
}

/** The page model of one contrast report; built by contrastPage. */
export interface ContrastPage {
  slug: string;
  path: string;
  file: string;
  title: string;
  summary: string;
  groups: SiteRow[];
  method: SiteRow[];
  bands: {
    position: string;
    region: string;
    sign: string;
    difference: string;
    interval: string;
    g: string;
    q: string;
    assignment: string;
    candidates: string;
  }[];
  bandTests: {
    window: string;
    centre: string;
    difference: string;
    interval: string;
    g: string;
    p: string;
    q: string;
    verdict: string;
    assignment: string;
  }[];
  outliers: string[];
  hits: { higher: string; lower: string };
  caution: string;
  plotJson: string;
}

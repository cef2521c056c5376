// Shapes the one match pipeline reads: a processed-spectra source, an injected scorer and the unknown spectrum.
import type { BandAssignment } from '../../schema/bandAssignment.js';
import type { Grid, Recipe } from '../../schema/recipe.js';
import type { Spectrum } from '../../spectrum/types.js';
import type { SearchSpectraOptions } from '../searchSpectra.js';
import type { Hit, ScoringSet } from '../searchTypes.js';
import type { PeakTable } from '../types.js';
import type { WrongHitNull } from '../wrongHitNull.js';

/** One searchable entry of a source. */
export interface SourceEntry {
  id: string;
  revision: number;
  name: string;
  class: string;
  /** The revision's content hash. */
  hash: string;
}

/** An entry's original spectrum and its own recipe, to process it again over a narrower span. */
export interface EntryOriginal {
  original: Spectrum;
  recipe: Recipe;
  /** The reference spectra that recipe's reference or EMSC step names, by entry id. */
  references: ReadonlyMap<string, Spectrum>;
  /** The revision's recorded resolution, cm⁻¹ (`extras.resolution`: stated, else estimated), where known. */
  resolution?: number;
}

/**
 * Processed library spectra as the pipeline sees them: the library's search set in Node, the site's published data
 * in the browser. `processed` is rows × cols, row-major, ascending wavenumber, NaN where not covered.
 */
export interface MatchSource extends ScoringSet, PeakTable {
  /** The library's name as reports record it. */
  name: string;
  /** The release tag the data belong to, or null for a working state. */
  at: string | null;
  grid: Grid;
  /** The default recipe an unknown is processed with. */
  recipe: Recipe;
  entries: readonly SourceEntry[];
  processed: Float32Array;
  rows: number;
  cols: number;
  /** The reference spectra the default recipe's reference or EMSC step names, by entry id. */
  references: ReadonlyMap<string, Spectrum>;
  /** The library's best-wrong-hit null for per-hit p-values (pearson); absent or null gives pValue null. */
  wrongHitNull?: WrongHitNull | null;
  /** The originals of the given rows (async: the browser may have to load them). */
  originals: (rows: readonly number[]) => Promise<ReadonlyMap<number, EntryOriginal>>;
}

/** Scores processed queries against a source: Node passes the worker/WASM kernels, the browser in-page kernels. */
export type MatchScorer = (
  source: MatchSource,
  queries: readonly ArrayLike<number>[],
  options: Omit<SearchSpectraOptions, 'matrices' | 'runner'>,
) => Hit[][] | Promise<Hit[][]>;

/** The unknown as read from its file. */
export interface MatchUnknown {
  /** The file name the report records (a directory only when the user asked for it). */
  file: string;
  block?: number;
  /** Header name of the y column, when the unknown's delimited file held several. */
  column?: string;
  /** SHA-256 of the file's bytes, lowercase hex. */
  hash: string;
  title?: string;
  spectrum: Spectrum;
  /** 1 per point the reader clipped at the absorbance ceiling (kept out of scoring and the fit). */
  saturated?: Uint8Array;
  warnings: readonly string[];
  /**
   * The resolution the file states, cm⁻¹ (JCAMP-DX `##RESOLUTION=`; a time-domain unknown's record-length
   * resolution 1/(c·T)). Anything but a finite positive number counts as not stated: it is then estimated as two
   * point spacings (resolutionOf).
   */
  resolution?: unknown;
  /**
   * How the unknown was measured (`atr`, `transmission` …, as entry metadata says it): `atr` gets the ATR step an
   * ATR entry gets under the recipe (its 'auto' default: the diamond preset). Absent: no ATR correction.
   */
  technique?: string;
}

/** Everything one run of the pipeline needs besides its settings. */
export interface MatchPipelineInput {
  unknown: MatchUnknown;
  source: MatchSource;
  scorer: MatchScorer;
  /** Band assignments for identification (the shipped table plus the library's own rows). */
  assignments: readonly BandAssignment[];
}

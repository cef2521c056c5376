// Shapes shared by the band index, band search, mixture fit and band identification.
import type {
  DetectionLimitReport,
  IdentifiedBandReport,
  MisfitBandReport,
  MixtureComponentReport,
  MixtureReport,
  ResidualBandReport,
  UnselectedCandidateReport,
} from '../schema/matchReport.js';

/** The part of a search set the band index needs (a library `SearchSet` satisfies it). */
export interface PeakTable {
  entries: readonly { id: string; revision: number; name: string; class: string }[];
  /** Every stored peak; `entry[k]` is the row index into `entries`. Sorted by position, or sorted on indexing. */
  peaks: {
    entry: Uint32Array;
    position: Float64Array;
    height: Float64Array;
    prominence: Float64Array;
  };
}

/** Every stored peak of a library state sorted by position, for binary search. Build with `buildBandIndex`. */
export interface BandIndex {
  entries: PeakTable['entries'];
  /** Ascending peak positions, cm⁻¹. */
  position: Float64Array;
  /** Row index into `entries` of each peak. */
  entry: Uint32Array;
  height: Float64Array;
  /** Height relative to the strongest peak of the same entry (0–1): what `s`/`m`/`w` strengths compare to. */
  relative: Float64Array;
}

/** A relative band strength as spectroscopists write it: strong, medium, weak. */
export type BandStrength = 's' | 'm' | 'w';

export interface BandQuery {
  /** cm⁻¹. */
  position: number;
  strength?: BandStrength;
}

/** One query band matched in one entry. */
export interface BandMatch {
  /** Index into the query band list. */
  query: number;
  /** The entry's peak position, cm⁻¹. */
  position: number;
  /** Peak position minus query position, cm⁻¹. */
  error: number;
  /** The peak's height relative to the entry's strongest peak. */
  relative: number;
  /** The strength class of that relative height. */
  strength: BandStrength;
}

export interface BandHit {
  /** Row index into the index's entries. */
  row: number;
  id: string;
  revision: number;
  name: string;
  class: string;
  /** How many query bands the entry has a peak for (within tolerance). */
  matched: number;
  /** 0–1: per matched band, position agreement × strength agreement, summed over all query bands and averaged. */
  score: number;
  /** Mean |error| over the matched bands, cm⁻¹. */
  meanError: number;
  matches: BandMatch[];
}

/** One library spectrum offered to the mixture fit. */
export interface MixtureCandidate {
  id: string;
  revision: number;
  name?: string;
  class?: string;
  /** The processed vector on the library grid (ascending, NaN where not covered). */
  vector: ArrayLike<number>;
}

/*
 * The mixture fit's and band identification's results in memory. Each is the report schema's type (the schema owns
 * every field and its meaning, see `schema/matchReport.ts`) with the in-memory differences stated here: a value the
 * report writes as null is NaN or Infinity in memory, and grid vectors are typed arrays.
 */

/** ICH Q2(R1) detection limit 3.3 σ/S as a weight (Infinity when not detectable at all) and as a share. */
export type DetectionLimit = Omit<DetectionLimitReport, 'weight'> & { weight: number };

export type MixtureComponent = Omit<
  MixtureComponentReport,
  'standardError' | 'interval95' | 'detectionLimit'
> & {
  /** Infinity when unbounded. */
  standardError: number;
  /** Upper end Infinity when unbounded. */
  interval95: [number, number];
  detectionLimit: DetectionLimit;
};

export type UnselectedCandidate = Omit<UnselectedCandidateReport, 'detectionLimit'> & {
  detectionLimit: DetectionLimit;
};

/** A residual peak above k × noise; `fwhm` and `width` NaN where not measured. */
export type ResidualBand = Omit<ResidualBandReport, 'fwhm' | 'width'> & { fwhm: number; width: number };

export type MisfitBand = MisfitBandReport;

export type MixtureResult = Omit<
  MixtureReport,
  | 'components'
  | 'r2'
  | 'fitted'
  | 'residual'
  | 'notSelected'
  | 'residualBands'
  | 'misfitBands'
  | 'candidates'
  | 'resolution'
> & {
  components: MixtureComponent[];
  /** NaN when the fitted points have no variance. */
  r2: number;
  /** Fitted vector on the grid (components + baseline), NaN outside the fitted points. */
  fitted: Float64Array;
  /** Query minus fitted on the grid, NaN outside the fitted points. */
  residual: Float64Array;
  notSelected: UnselectedCandidate[];
  residualBands: ResidualBand[];
  misfitBands: MisfitBand[];
};

/** One band of the unknown with what may explain it; `fwhm` NaN where it could not be measured. */
export type IdentifiedBand = Omit<IdentifiedBandReport, 'fwhm'> & { fwhm: number };

/**
 * The one default of the band-position search's tolerance, shared by `bandshelf bands`, searchBands, identify and the
 * site: a stored peak within this many cm⁻¹ of a query band matches it (common practice for condensed-phase mid-IR
 * band positions, whose tables quote bands to a few cm⁻¹).
 */
export const BAND_TOLERANCE_CM1 = 4;

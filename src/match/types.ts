// Shapes shared by the band index, band search, mixture fit and band identification.

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

export interface MixtureComponent {
  id: string;
  revision: number;
  name?: string;
  class?: string;
  /** Non-negative NNLS coefficient on the processed (normalised) vector. */
  weight: number;
  /** Share of the fitted signal: weight × Σ|vector| over the fitted points, over the same sum of all components. */
  share: number;
  /**
   * 95 % interval of the share (delta method on the weights' HAC covariance), clipped to [0, 1]. The share is of the
   * processed signal over the fit points, not of the raw integrated absorbance.
   */
  shareInterval95: [number, number];
  /** True when the user forced it in with `with`. */
  forced: boolean;
  /** Fractional drop of the residual sum of squares when it was added (null for forced components). */
  improvement: number | null;
  /** p-value of the partial F-test that admitted it (null for forced components). */
  pValue: number | null;
  /** Standard error of the weight: HAC error from the final residual combined with the line-shape and baseline model parts. */
  standardError: number;
  /** 95 % interval of the weight, lower end clipped at 0. */
  interval95: [number, number];
  /** The interval's unclipped lower end is above 0; a component that is not is not reported as found. */
  significant: boolean;
  /** ICH Q2(R1) detection limit 3.3 σ/S, as a weight and as a share of the signal. */
  detectionLimit: { weight: number; share: number };
  /** Offered candidates that fit as well in its place at the fit's level: not told apart by this spectrum. */
  alternatives?: string[];
}

/** A candidate the fit was offered but did not keep, with the smallest amount this spectrum could have shown. */
export interface UnselectedCandidate {
  id: string;
  revision: number;
  name?: string;
  class?: string;
  detectionLimit: { weight: number; share: number };
}

/** A residual peak above k × noise: absorption the fitted components do not explain. */
export interface ResidualBand {
  position: number;
  /** Residual value at the peak (processed units). */
  height: number;
  prominence: number;
  fwhm: number;
  /** FWHM of the residual band, cm⁻¹ (the width the resolution test used). */
  width: number;
  /** Residual height over the unknown's value at that position (0–1). */
  share: number;
  /** Local noise σ the k × threshold was built on. */
  localNoise: number;
}

/** A residual peak on a fitted component's band, where that component gives at least twice the residual. */
export interface MisfitBand {
  position: number;
  height: number;
  component: string;
  contribution: number;
}

export interface MixtureResult {
  components: MixtureComponent[];
  /** 1 − RSS/TSS over the fitted points. */
  r2: number;
  rss: number;
  /** Polynomial baseline of free sign (power basis in u = scaled wavenumber ∈ [−1, 1]); null when not fitted. */
  baseline: { degree: number; coefficients: number[]; centre: number; halfWidth: number } | null;
  /** Fitted vector on the grid (components + baseline), NaN outside the fitted points. */
  fitted: Float64Array;
  /** Query minus fitted on the grid, NaN outside the fitted points. */
  residual: Float64Array;
  /** Robust noise σ of the residual (MAD of first differences, AR(1)-corrected). */
  noise: number;
  /** Where the noise figure came from. */
  noiseSource: 'band-free-window' | 'residual-differences';
  /** Lag-1 autocorrelation of the residual noise and the effective number of independent points it implies. */
  noiseLag1: number;
  effectivePoints: number;
  /** Significance level of the selection test. */
  alpha: number;
  /** The selection, uncertainty, detection-limit and residual-band rules in words, for reports. */
  rule: string;
  /** Offered candidates the fit did not keep, each with its detection limit. */
  notSelected: UnselectedCandidate[];
  /** Multiple of the noise a residual peak must exceed. */
  k: number;
  residualBands: ResidualBand[];
  /** Residual peaks on fitted components' bands: band shape or position differing between benches, not new absorbers. */
  misfitBands: MisfitBand[];
  /** Fitted points and their span. */
  points: number;
  span: { min: number; max: number } | null;
  /** The stop criterion in words, for reports. */
  criterion: string;
  /** Why forward selection stopped. */
  stopReason: string;
  /** Candidates left out because they do not cover every fitted point. */
  skipped: string[];
}

/** One band of the unknown with what may explain it. */
export interface IdentifiedBand {
  position: number;
  height: number;
  /** Full width at half prominence, cm⁻¹ (NaN where it could not be measured). */
  fwhm: number;
  kind: 'peak' | 'shoulder';
  /** Table rows offered for a band no fitted component carries, best first (empty when `assignedTo` is set). */
  assignments: {
    /** The matched row's id (shipped rows carry one). */
    id?: string;
    label: string;
    vibration: string;
    group: string;
    class: string[];
    source: string;
    basis: string;
    origin: string;
    min: number;
    max: number;
    /** The row's own tolerance beyond min–max, cm⁻¹. */
    tolerance: number;
    /** 0–1 ranking score: position agreement × width agreement × relative intensity weight. */
    score: number;
  }[];
  /** The fitted component that carries the band (most of its height), or null. */
  assignedTo: { id: string; revision: number; name?: string; share: number } | null;
  /** Region rows the band lies in (e.g. water-vapour lines may disturb it): a caution, not an assignment. */
  flags: { id?: string; label: string; source: string }[];
  /** Library entries with a stored peak within tolerance, closest first. */
  candidates: {
    id: string;
    revision: number;
    name: string;
    class: string;
    position: number;
    error: number;
  }[];
  /** Whether the mixture fit explains the band (no unexplained residual band within tolerance); null without a fit. */
  explained: boolean | null;
}

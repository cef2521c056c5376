// Band identification: every band of the unknown with its table assignments, library candidates and fit status.
import { BandshelfError } from '../error.js';
import type { BandAssignment } from '../schema/bandAssignment.js';
import { findPeaks } from '../spectrum/findPeaks.js';
import { findShoulders } from '../spectrum/findShoulders.js';
import type { Spectrum } from '../spectrum/types.js';
import { assignmentReport } from './assignmentReport.js';
import { buildBandIndex } from './buildBandIndex.js';
import { componentAtBand } from './componentAtBand.js';
import { entriesWithBandAt } from './entriesWithBandAt.js';
import { rankAssignments } from './rankAssignments.js';
import { shippedAssignments } from './shippedAssignments.js';
import type { BandIndex, IdentifiedBand, MixtureCandidate, MixtureResult, PeakTable } from './types.js';

export interface IdentifyBandsOptions {
  /**
   * The assignment table: the shipped rows plus the lab's own.
   * @default shippedAssignments()
   */
  assignments?: readonly BandAssignment[];
  /**
   * The band index of the library state, for the entries that have a band near each one.
   * @default built from `searchSet` when given, else no library candidates
   */
  index?: BandIndex | null;
  /**
   * A search set (or any peak table) to build the index from when `index` is not given.
   * @default null
   */
  searchSet?: PeakTable | null;
  /**
   * The mixture fit of the same unknown: a band is explained when no unexplained residual band lies within
   * `tolerance` of it.
   * @default null (explained is then null)
   */
  mixture?:
    | (Pick<MixtureResult, 'residualBands'> & Partial<Pick<MixtureResult, 'components' | 'baseline'>>)
    | null;
  /**
   * The vectors the mixture fit used (the candidates it was offered, on the unknown's grid): with them a band a
   * fitted component carries (its weight × vector there is most of the band's height) is assigned to that
   * component and no table row is offered for it.
   * @default [] (no band is assigned to a component)
   */
  componentVectors?: readonly Pick<MixtureCandidate, 'id' | 'revision' | 'vector'>[];
  /**
   * cm⁻¹ for a library peak to count as the same band, and for a residual band to sit on it.
   * @default 4
   */
  tolerance?: number;
  /**
   * Library candidates listed per band, closest first.
   * @default 10
   */
  maxCandidates?: number;
  /**
   * Smallest peak prominence as a fraction of the spectrum's range; 0.01 is what the library stores peaks with,
   * so unknown and references are read alike.
   * @default 0.01
   */
  relativeProminence?: number;
  /**
   * Also report shoulders (negative second-derivative minima that are not peaks).
   * @default true
   */
  shoulders?: boolean;
}

/**
 * Bands come from findPeaks and findShoulders on the spectrum as given (the CLI passes the unknown's processed
 * grid vector, the same basis the library's stored peaks were found on); findShoulders itself drops the noise
 * minima inside broad bands and the minima that are a peak's own curvature. A band a fitted component carries is
 * assigned to that component first (see `componentAtBand`); for the others the table rows are offered within each
 * row's own tolerance, ranked by `rankAssignments` (position, width, relative intensity). Region rows (water-vapour
 * lines) only flag the band, they never assign it. Bands are returned from high to low
 * wavenumber, the way spectroscopists read a spectrum.
 */
export function identifyBands(unknown: Spectrum, options: IdentifyBandsOptions = {}): IdentifiedBand[] {
  const tolerance = options.tolerance ?? 4;
  if (!(Number.isFinite(tolerance) && tolerance > 0)) {
    throw new BandshelfError(
      'BAD_OPTION',
      `the tolerance must be a positive number of cm⁻¹, not ${tolerance}`,
      {
        field: 'tolerance',
      },
    );
  }
  const maxCandidates = options.maxCandidates ?? 10;
  const assignments = options.assignments ?? shippedAssignments();
  const index = options.index ?? (options.searchSet ? buildBandIndex(options.searchSet) : null);
  const mixture = options.mixture ?? null;
  const peaks = findPeaks(unknown, { relativeProminence: options.relativeProminence ?? 0.01 });
  const shoulders = options.shoulders === false ? [] : findShoulders(unknown, { peaks, tolerance });
  const found = [
    ...peaks.map((p) => ({ ...p, kind: 'peak' as const })),
    ...shoulders.map((p) => ({ ...p, kind: 'shoulder' as const })),
  ].sort((a, b) => b.position - a.position);

  const vectors = options.componentVectors ?? [];
  const strongest = found.reduce((m, b) => Math.max(m, b.height), 0);
  return found.map((band): IdentifiedBand => {
    const assignedTo =
      mixture?.components === undefined || vectors.length === 0
        ? null
        : componentAtBand({
            wavenumber: unknown.wavenumber,
            absorbance: unknown.absorbance,
            position: band.position,
            mixture: { components: mixture.components, baseline: mixture.baseline ?? null },
            vectors,
          });
    const flags = assignments
      .filter((row) => row.region && band.position >= row.min && band.position <= row.max)
      .map((row) => ({
        ...(row.id === undefined ? {} : { id: row.id }),
        label: row.label,
        source: row.source,
      }));
    const rows =
      assignedTo !== null
        ? []
        : rankAssignments(
            {
              position: band.position,
              fwhm: band.fwhm,
              relative: strongest > 0 ? band.height / strongest : 0,
            },
            assignments,
          ).map(assignmentReport);
    const candidates =
      maxCandidates <= 0 ? [] : entriesWithBandAt(index, band.position, { tolerance, top: maxCandidates });
    const explained =
      mixture === null
        ? null
        : !mixture.residualBands.some((r) => Math.abs(r.position - band.position) <= tolerance);
    return {
      position: band.position,
      height: band.height,
      fwhm: Number.isFinite(band.fwhm) ? band.fwhm : Number.NaN,
      kind: band.kind,
      assignments: rows,
      assignedTo,
      flags,
      candidates,
      explained,
    };
  });
}

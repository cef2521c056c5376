// Band identification: every band of the unknown with its table assignments, library candidates and fit status.
import { BandshelfError } from '../error.js';
import type { BandAssignment } from '../schema/bandAssignment.js';
import { findPeaks } from '../spectrum/findPeaks.js';
import { findShoulders } from '../spectrum/findShoulders.js';
import type { Spectrum } from '../spectrum/types.js';
import { buildBandIndex } from './buildBandIndex.js';
import { searchBands } from './searchBands.js';
import { shippedAssignments } from './shippedAssignments.js';
import type { BandIndex, IdentifiedBand, MixtureResult, PeakTable } from './types.js';

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
  mixture?: Pick<MixtureResult, 'residualBands'> | null;
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
 * minima inside broad bands and the minima that are a peak's own curvature. A table row applies when its range
 * holds the band position; rows are listed nearest centre first. Bands are returned from high to low
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

  return found.map((band): IdentifiedBand => {
    const rows = assignments
      .filter((row) => band.position >= row.min && band.position <= row.max)
      .map((row) => ({ row, distance: Math.abs(band.position - (row.centre ?? (row.min + row.max) / 2)) }))
      .sort((a, b) => a.distance - b.distance)
      .map(({ row }) => ({
        label: row.label,
        vibration: row.vibration,
        group: row.group,
        class: [...row.class],
        source: row.source,
        basis: row.basis,
        origin: row.origin,
        min: row.min,
        max: row.max,
      }));
    const candidates =
      index === null || index.entries.length === 0 || maxCandidates <= 0
        ? []
        : searchBands(index, [{ position: band.position }], { tolerance, top: maxCandidates }).map((hit) => ({
            id: hit.id,
            revision: hit.revision,
            name: hit.name,
            class: hit.class,
            position: hit.matches[0]!.position,
            error: hit.matches[0]!.error,
          }));
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
      candidates,
      explained,
    };
  });
}

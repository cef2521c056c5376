// The band index of the site's band-index.js (the peaks and entry rows `bandshelf bands` indexes), built with the
// CLI's own buildBandIndex so the page and the CLI search the same index.
import { buildBandIndex } from '../../match/buildBandIndex.js';
import type { BandIndex } from '../../match/types.js';

/** What assets/band-index.js holds. */
export interface PublishedBandFile {
  grid: { start: number; stop: number };
  /** The CLI's default tolerance, cm⁻¹. */
  tolerance: number;
  entries: { id: string; revision: number; name: string; class: string; path: string | null }[];
  peaks: { entry: number[]; position: number[]; height: number[] };
}

export interface PublishedBandIndexOptions {
  /** Ignore peaks below this fraction of their entry's strongest one (as buildBandIndex).
   * @default 0 */
  minRelative?: number;
}

export function publishedBandIndex(
  file: PublishedBandFile,
  options: PublishedBandIndexOptions = {},
): BandIndex {
  return buildBandIndex(
    {
      entries: file.entries,
      peaks: {
        entry: Uint32Array.from(file.peaks.entry),
        position: Float64Array.from(file.peaks.position),
        height: Float64Array.from(file.peaks.height),
        prominence: new Float64Array(file.peaks.position.length),
      },
    },
    { minRelative: options.minRelative ?? 0 },
  );
}

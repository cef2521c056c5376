// The library entries with a band at one position, as a band or a difference band lists its library candidates.
import { searchBands } from './searchBands.js';
import type { BandIndex } from './types.js';

export interface EntriesWithBandAtOptions {
  /** Largest |peak − position|, cm⁻¹. @default searchBands' default tolerance */
  tolerance?: number;
  /** Most entries, nearest first as searchBands ranks them. @default searchBands' default */
  top?: number;
}

export interface EntryWithBand {
  id: string;
  revision: number;
  name: string;
  class: string;
  /** The entry's peak position, cm⁻¹, and its distance from the position asked. */
  position: number;
  error: number;
}

/** searchBands for one position, each hit reduced to the entry and its matched peak; none for an empty index. */
export function entriesWithBandAt(
  index: BandIndex | null | undefined,
  position: number,
  options: EntriesWithBandAtOptions = {},
): EntryWithBand[] {
  if (index === null || index === undefined || index.entries.length === 0) return [];
  return searchBands(index, [{ position }], {
    ...(options.tolerance === undefined ? {} : { tolerance: options.tolerance }),
    ...(options.top === undefined ? {} : { top: options.top }),
  }).map((hit) => ({
    id: hit.id,
    revision: hit.revision,
    name: hit.name,
    class: hit.class,
    position: hit.matches[0]!.position,
    error: hit.matches[0]!.error,
  }));
}

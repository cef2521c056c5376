// Loads only the stored peaks of one library state (no processed vectors): what band-position search needs.
import type { Grid } from '../../schema/recipe.js';
import type { Library, SearchSet, SearchSetEntry } from '../types.js';
import { readStateRows } from './readStateRows.js';

export interface ReadPeakSetOptions {
  /** A release tag, or undefined / 'current' for the working state.
   * @default undefined */
  at?: string | null;
}

/** The peak half of a SearchSet: the same entries, state key and position-sorted peak index. */
export interface PeakSet {
  grid: Grid;
  /** Equal to readSearchSet's key for the same state. */
  stateKey: string;
  /** The release tag the set was read at, or null for the current working state. */
  at: string | null;
  /** Sorted by id. */
  entries: SearchSetEntry[];
  /** Every stored peak, sorted by position; `entry[k]` is the row index into `entries`. */
  peaks: SearchSet['peaks'];
}

/**
 * Reads the same rows as readSearchSet (readStateRows: the working state or a release's members, in id order)
 * but neither the processed vectors nor the originals, so a band search over a large library does not pull
 * rows × 1,701 floats into memory. The state key is built by the same code, so both readers name a state alike.
 */
export function readPeakSet(library: Library, options: ReadPeakSetOptions = {}): PeakSet {
  const { stateKey, at, entries, peaks } = readStateRows(library, { at: options.at });
  return { grid: library.grid, stateKey, at, entries, peaks };
}

// Loads one library state into memory for matching: a row-major Float32 matrix of processed vectors and a
// position-sorted index of every stored peak.

import type { Library, SearchSet } from '../types.js';
import { readStateRows } from './readStateRows.js';

export interface ReadSearchSetOptions {
  /** A release tag, or undefined / 'current' for the working state.
   * @default undefined */
  at?: string | null;
}

export function readSearchSet(library: Library, options: ReadSearchSetOptions = {}): SearchSet {
  const state = readStateRows(library, { at: options.at, processed: true });
  return { grid: library.grid, recipe: library.recipe, ...state };
}

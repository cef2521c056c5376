// Loads one library state for matching: a row-major Float32 matrix of processed vectors (read up front, or lazily
// a row at a time) and a position-sorted index of every stored peak.

import type { Library, SearchSet } from '../types.js';
import { readProcessedVector } from './readProcessedVector.js';
import { readStateRows } from './readStateRows.js';

export interface ReadSearchSetOptions {
  /** A release tag, or undefined / 'current' for the working state.
   * @default undefined */
  at?: string | null;
  /**
   * Read no processed vector up front: `row(r)` reads that row alone, and `processed` reads every row on its first
   * access (a search whose matrix comes from the disk cache then never touches the blobs).
   * @default false
   */
  lazy?: boolean;
}

export function readSearchSet(library: Library, options: ReadSearchSetOptions = {}): SearchSet {
  if (options.lazy !== true) {
    const state = readStateRows(library, { at: options.at, processed: true });
    return { grid: library.grid, recipe: library.recipe, ...state };
  }
  const { processed: _none, ...state } = readStateRows(library, { at: options.at });
  const { cols, entries } = state;
  let all: Float32Array | null = null;
  // Not memoised: building a matrix reads every row once, and keeping them would hold the whole matrix twice.
  const row = (r: number): Float32Array =>
    all !== null
      ? all.subarray(r * cols, (r + 1) * cols)
      : readProcessedVector(library, entries[r]!, { cols });
  const set = { grid: library.grid, recipe: library.recipe, ...state, row };
  // A getter rather than a field: a spread of the set would read every blob, so copy it by its descriptors.
  return Object.defineProperty(set, 'processed', {
    enumerable: true,
    configurable: true,
    get(): Float32Array {
      if (all === null) {
        const matrix = new Float32Array(state.rows * cols);
        for (let r = 0; r < state.rows; r++) matrix.set(row(r), r * cols);
        all = matrix;
      }
      return all;
    },
  }) as SearchSet;
}

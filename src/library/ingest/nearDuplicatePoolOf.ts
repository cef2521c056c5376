// The library's current processed vectors as a near-duplicate pool, with each id's row, read once per ingest.
import { readSearchSet } from '../store/readSearchSet.js';
import type { Library } from '../types.js';
import type { NearDuplicatePool } from './nearDuplicateFlag.js';

export interface IndexedPool {
  pool: NearDuplicatePool;
  /** Row of each entry id in the pool, so a new revision replaces its entry's row. */
  index: Map<string, number>;
}

export function nearDuplicatePoolOf(library: Library): IndexedPool {
  const set = readSearchSet(library);
  const rows = set.entries.map((_, i) => set.processed.subarray(i * set.cols, (i + 1) * set.cols));
  return {
    pool: { ids: set.entries.map((e) => e.id), rows },
    index: new Map(set.entries.map((e, i) => [e.id, i])),
  };
}

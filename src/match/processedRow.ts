// One row of a scoring set's processed vectors, through the set's own row reader when it has one (a lazily read
// library set then reads that row alone instead of every row).
import { gridLength } from '../spectrum/gridLength.js';
import type { ScoringSet } from './searchTypes.js';

export function processedRow(set: Pick<ScoringSet, 'grid' | 'processed' | 'row'>, r: number): Float32Array {
  if (set.row !== undefined) return set.row(r);
  const cols = gridLength(set.grid);
  return set.processed.subarray(r * cols, (r + 1) * cols);
}

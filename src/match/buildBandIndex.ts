// Builds the band index: every stored peak of a library state in one sorted array for binary search.
import { BandshelfError } from '../error.js';
import type { BandIndex, PeakTable } from './types.js';

export interface BuildBandIndexOptions {
  /**
   * Ignore peaks lower than this fraction of their entry's strongest peak (noise bumps a store may keep).
   * @default 0
   */
  minRelative?: number;
}

/**
 * Takes the flattened peak table of a search set. The library hands it over already sorted by position; an
 * unsorted table is sorted here (on a copy) rather than trusted, since binary search silently fails otherwise.
 */
export function buildBandIndex(table: PeakTable, options: BuildBandIndexOptions = {}): BandIndex {
  const minRelative = options.minRelative ?? 0;
  const { entry, position, height } = table.peaks;
  const count = position.length;
  if (entry.length !== count || height.length !== count) {
    throw new BandshelfError('BAD_OPTION', 'the peak table columns differ in length', { field: 'peaks' });
  }
  const rows = table.entries.length;
  const strongest = new Float64Array(rows);
  for (let k = 0; k < count; k++) {
    const row = entry[k]!;
    if (row >= rows) {
      throw new BandshelfError('BAD_OPTION', `peak ${k} points at row ${row} of ${rows}`, { field: 'peaks' });
    }
    if (!Number.isFinite(position[k]!)) {
      throw new BandshelfError('BAD_OPTION', `peak ${k} has a non-finite position`, { field: 'peaks' });
    }
    const h = Math.abs(height[k]!);
    if (h > strongest[row]!) strongest[row] = h;
  }
  let sorted = true;
  for (let k = 1; k < count && sorted; k++) if (position[k]! < position[k - 1]!) sorted = false;
  let order: Uint32Array | null = null;
  if (!sorted) {
    order = new Uint32Array(count);
    for (let k = 0; k < count; k++) order[k] = k;
    order.sort((a, b) => position[a]! - position[b]!);
  }
  const keep = new Uint8Array(count);
  let kept = 0;
  for (let k = 0; k < count; k++) {
    const top = strongest[entry[k]!]!;
    const relative = top > 0 ? Math.abs(height[k]!) / top : 0;
    if (relative >= minRelative) {
      keep[k] = 1;
      kept++;
    }
  }
  const index: BandIndex = {
    entries: table.entries,
    position: new Float64Array(kept),
    entry: new Uint32Array(kept),
    height: new Float64Array(kept),
    relative: new Float64Array(kept),
  };
  let out = 0;
  for (let i = 0; i < count; i++) {
    const k = order === null ? i : order[i]!;
    if (!keep[k]) continue;
    const row = entry[k]!;
    const top = strongest[row]!;
    index.position[out] = position[k]!;
    index.entry[out] = row;
    index.height[out] = height[k]!;
    index.relative[out] = top > 0 ? Math.abs(height[k]!) / top : 0;
    out++;
  }
  return index;
}

// Loads only the stored peaks of one library state (no processed vectors): what band-position search needs.
import { createHash } from 'node:crypto';
import type { Grid } from '../schema/recipe.js';
import { canonicalJson } from './canonicalJson.js';
import { peakOrder } from './peakOrder.js';
import { stateSelect } from './stateSelect.js';
import type { Library, SearchSet, SearchSetEntry } from './types.js';

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
 * Selects the same revisions as readSearchSet (stateSelect: the working state or a release's members, in id
 * order) but reads neither the processed vectors nor the originals, so a band search over a large library does
 * not pull rows × 1,701 floats into memory. The state key is built the same way, so both readers name a state
 * alike.
 */
export function readPeakSet(library: Library, options: ReadPeakSetOptions = {}): PeakSet {
  // One read transaction so the count and the rows see the same snapshot even while another process writes.
  return library.db.transaction((): PeakSet => {
    const counted = stateSelect(library, 'coalesce(sum(length(r.peaks)), 0) AS peakBytes', options);
    const { peakBytes } = library.db.prepare(counted.sql).get(...counted.params) as { peakBytes: number };
    const select = stateSelect(
      library,
      `r.entry_id, r.revision, r.content_hash, r.meta ->> '$.name', r.meta ->> '$.class', r.peaks`,
      options,
    );
    // Each stored peak is four little-endian Float64 values: position, height, prominence, fwhm.
    const capacity = Math.floor(peakBytes / 32);
    const peakEntry = new Uint32Array(capacity);
    const peakPosition = new Float64Array(capacity);
    const peakHeight = new Float64Array(capacity);
    const peakProminence = new Float64Array(capacity);
    const entries: SearchSetEntry[] = [];
    const digest = createHash('sha256').update(`${canonicalJson(library.grid)}\n`);
    let k = 0;
    const statement = library.db.prepare(select.sql).raw(true);
    for (const raw of statement.iterate(...select.params)) {
      const [id, revision, hash, name, cls, peaks] = raw as [
        string,
        number,
        string,
        string | null,
        string | null,
        Buffer,
      ];
      const row = entries.length;
      entries.push({ id, revision, name: name ?? id, class: cls ?? 'other', hash });
      digest.update(`${id}@${revision}:${hash}\n`);
      const view = new DataView(peaks.buffer, peaks.byteOffset, peaks.byteLength);
      for (let o = 0; o + 32 <= peaks.byteLength && k < capacity; o += 32) {
        peakEntry[k] = row;
        peakPosition[k] = view.getFloat64(o, true);
        peakHeight[k] = view.getFloat64(o + 8, true);
        peakProminence[k] = view.getFloat64(o + 16, true);
        k++;
      }
    }
    // Peaks were collected in row order, so ordering ties by index orders them by entry row too.
    const order = peakOrder(peakPosition.subarray(0, k));
    const sorted = {
      entry: new Uint32Array(k),
      position: new Float64Array(k),
      height: new Float64Array(k),
      prominence: new Float64Array(k),
    };
    for (let i = 0; i < k; i++) {
      const j = order[i]!;
      sorted.entry[i] = peakEntry[j]!;
      sorted.position[i] = peakPosition[j]!;
      sorted.height[i] = peakHeight[j]!;
      sorted.prominence[i] = peakProminence[j]!;
    }
    return { grid: library.grid, stateKey: digest.digest('hex'), at: select.at, entries, peaks: sorted };
  })();
}

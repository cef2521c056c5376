// Streams the revision rows of one library state once: entries in id order, the state key, a position-sorted
// peak index and, when asked, the processed vectors as one Float32 matrix. readSearchSet and readPeakSet share it.
import { gridLength } from '../../spectrum/gridLength.js';
import { PEAK_BYTES, PEAK_FIELD_OFFSETS } from '../codecs/peaksBlob.js';
import type { Library, SearchSet, SearchSetEntry } from '../types.js';
import { peakOrder } from './peakOrder.js';
import { peaksCachePath } from './peaksCachePath.js';
import { readPeaksCache } from './readPeaksCache.js';
import { stateKeyOf } from './stateKeyOf.js';
import { stateSelect } from './stateSelect.js';
import { writePeaksCache } from './writePeaksCache.js';

export interface ReadStateRowsOptions {
  /** A release tag, or undefined / 'current' for the working state.
   * @default undefined */
  at?: string | null;
  /** Also read the processed vectors; when false the SQL never names them, so they stay on disk.
   * @default false */
  processed?: boolean;
  /**
   * Without the processed vectors, take the sorted peak index from `<library>.cache/` when a file of this state is
   * there (and write it when not): the peaks blob lies after the originals in each row, so reading it from SQLite
   * walks through every row's original and processed bytes.
   * @default true
   */
  cache?: boolean;
}

/** A SearchSet without the library's grid and recipe; `processed` is empty unless it was asked for. */
export type StateRows = Omit<SearchSet, 'grid' | 'recipe'>;

export function readStateRows(library: Library, options: ReadStateRowsOptions = {}): StateRows {
  const withProcessed = options.processed ?? false;
  const cols = gridLength(library.grid);
  const rowBytes = cols * 4;
  const at = { at: options.at };
  // One read transaction so the count and the rows see the same snapshot even while another process writes.
  return library.db.transaction((): StateRows => {
    const cachePath = (stateKey: string) =>
      withProcessed || options.cache === false
        ? null
        : peaksCachePath({ libraryPath: library.path, stateKey });
    if (!withProcessed && options.cache !== false) {
      const cached = fromPeaksCache(library, at, cachePath);
      if (cached !== null) return { ...cached, cols };
    }
    const counted = stateSelect(library, 'count(1) AS n, coalesce(sum(length(r.peaks)), 0) AS peakBytes', at);
    const { n, peakBytes } = library.db.prepare(counted.sql).get(...counted.params) as {
      n: number;
      peakBytes: number;
    };
    const columns = `r.entry_id, r.revision, r.content_hash, r.meta ->> '$.name', r.meta ->> '$.class', r.peaks`;
    const select = stateSelect(library, withProcessed ? `${columns}, r.processed` : columns, at);
    const processed = new Float32Array(withProcessed ? n * cols : 0);
    const bytes = new Uint8Array(processed.buffer);
    const capacity = Math.floor(peakBytes / PEAK_BYTES);
    const peakEntry = new Uint32Array(capacity);
    const peakPosition = new Float64Array(capacity);
    const peakHeight = new Float64Array(capacity);
    const peakProminence = new Float64Array(capacity);
    const entries: SearchSetEntry[] = [];
    let row = 0;
    let k = 0;
    const statement = library.db.prepare(select.sql).raw(true);
    for (const raw of statement.iterate(...select.params)) {
      const [id, revision, hash, name, cls, peaks, blob] = raw as [
        string,
        number,
        string,
        string | null,
        string | null,
        Buffer,
        Buffer | undefined,
      ];
      entries.push({ id, revision, name: name ?? id, class: cls ?? 'other', hash });
      if (withProcessed && row < n) {
        if (blob?.byteLength === rowBytes) bytes.set(blob, row * rowBytes);
        else processed.fill(Number.NaN, row * cols, (row + 1) * cols); // a malformed row matches nothing
      }
      const view = new DataView(peaks.buffer, peaks.byteOffset, peaks.byteLength);
      for (let o = 0; o + PEAK_BYTES <= peaks.byteLength && k < capacity; o += PEAK_BYTES) {
        peakEntry[k] = row;
        peakPosition[k] = view.getFloat64(o + PEAK_FIELD_OFFSETS.position, true);
        peakHeight[k] = view.getFloat64(o + PEAK_FIELD_OFFSETS.height, true);
        peakProminence[k] = view.getFloat64(o + PEAK_FIELD_OFFSETS.prominence, true);
        k++;
      }
      row++;
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
    const stateKey = stateKeyOf({ grid: library.grid, entries });
    const path = cachePath(stateKey);
    if (path !== null) writePeaksCache(path, { stateKey, rows: row, peaks: sorted });
    return {
      stateKey,
      at: select.at,
      entries,
      processed: !withProcessed || row === n ? processed : processed.subarray(0, row * cols),
      rows: row,
      cols,
      peaks: sorted,
    };
  })();
}

/** The state's entries from the columns stored before the big blobs, and its peaks from the cache file, if any. */
function fromPeaksCache(
  library: Library,
  at: { at: string | null | undefined },
  cachePath: (stateKey: string) => string | null,
): Omit<StateRows, 'cols'> | null {
  const select = stateSelect(
    library,
    `r.entry_id, r.revision, r.content_hash, r.meta ->> '$.name', r.meta ->> '$.class'`,
    at,
  );
  const entries: SearchSetEntry[] = [];
  for (const raw of library.db
    .prepare(select.sql)
    .raw(true)
    .iterate(...select.params)) {
    const [id, revision, hash, name, cls] = raw as [string, number, string, string | null, string | null];
    entries.push({ id, revision, name: name ?? id, class: cls ?? 'other', hash });
  }
  const stateKey = stateKeyOf({ grid: library.grid, entries });
  const path = cachePath(stateKey);
  const peaks = path === null ? null : readPeaksCache(path, { stateKey, rows: entries.length });
  if (peaks === null) return null;
  return { stateKey, at: select.at, entries, processed: new Float32Array(0), rows: entries.length, peaks };
}

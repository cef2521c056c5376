// Loads one library state into memory for matching: a row-major Float32 matrix of processed vectors and a
// position-sorted index of every stored peak.
import { createHash } from 'node:crypto';
import { gridLength } from '../spectrum/gridLength.js';
import { canonicalJson } from './canonicalJson.js';
import { peakOrder } from './peakOrder.js';
import { stateSelect } from './stateSelect.js';
import type { Library, SearchSet, SearchSetEntry } from './types.js';

export interface ReadSearchSetOptions {
  /** A release tag, or undefined / 'current' for the working state.
   * @default undefined */
  at?: string | null;
}

export function readSearchSet(library: Library, options: ReadSearchSetOptions = {}): SearchSet {
  const cols = gridLength(library.grid);
  const rowBytes = cols * 4;
  // One read transaction so the count and the rows see the same snapshot even while another process writes.
  return library.db.transaction((): SearchSet => {
    const counted = stateSelect(
      library,
      'count(*) AS n, coalesce(sum(length(r.peaks)), 0) AS peakBytes',
      options,
    );
    const { n, peakBytes } = library.db.prepare(counted.sql).get(...counted.params) as {
      n: number;
      peakBytes: number;
    };
    const select = stateSelect(
      library,
      `r.entry_id, r.revision, r.content_hash, r.meta ->> '$.name', r.meta ->> '$.class', r.processed, r.peaks`,
      options,
    );
    const processed = new Float32Array(n * cols);
    const bytes = new Uint8Array(processed.buffer);
    const totalPeaks = peakBytes / 32;
    const peakEntry = new Uint32Array(totalPeaks);
    const peakPosition = new Float64Array(totalPeaks);
    const peakHeight = new Float64Array(totalPeaks);
    const peakProminence = new Float64Array(totalPeaks);
    const entries: SearchSetEntry[] = [];
    const digest = createHash('sha256').update(`${canonicalJson(library.grid)}\n`);
    let row = 0;
    let k = 0;
    const statement = library.db.prepare(select.sql).raw(true);
    for (const raw of statement.iterate(...select.params)) {
      const [id, revision, hash, name, cls, blob, peaks] = raw as [
        string,
        number,
        string,
        string | null,
        string | null,
        Buffer,
        Buffer,
      ];
      entries.push({ id, revision, name: name ?? id, class: cls ?? 'other', hash });
      digest.update(`${id}@${revision}:${hash}\n`);
      if (blob.byteLength === rowBytes) bytes.set(blob, row * rowBytes);
      else processed.fill(Number.NaN, row * cols, (row + 1) * cols); // a malformed row matches nothing
      const view = new DataView(peaks.buffer, peaks.byteOffset, peaks.byteLength);
      for (let o = 0; o + 32 <= peaks.byteLength; o += 32) {
        peakEntry[k] = row;
        peakPosition[k] = view.getFloat64(o, true);
        peakHeight[k] = view.getFloat64(o + 8, true);
        peakProminence[k] = view.getFloat64(o + 16, true);
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
    return {
      grid: library.grid,
      recipe: library.recipe,
      stateKey: digest.digest('hex'),
      at: select.at,
      entries,
      processed: row === n ? processed : processed.subarray(0, row * cols),
      rows: row,
      cols,
      peaks: sorted,
    };
  })();
}

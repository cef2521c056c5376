// Builds (or finds cached) a synthetic library of N entries for the scale benchmarks, through the real ingest API:
// files are written to a scratch folder a batch at a time, added with `ingest`, and removed again.
import { existsSync, mkdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ingest } from '../src/library/ingest/ingest.js';
import { closeLibrary } from '../src/library/store/closeLibrary.js';
import { initLibrary } from '../src/library/store/initLibrary.js';
import { libraryNearDuplicateIndex } from '../src/match/libraryNearDuplicateIndex.js';
import { syntheticReferenceCsv } from './syntheticReferenceCsv.js';

/** Bump when the generator or the store layout changes, so a cached library is rebuilt. */
export const BENCH_LIBRARY_VERSION = 1;

export interface BatchFigures {
  /** Entries in the library after the batch. */
  entries: number;
  files: number;
  ms: number;
  /** CPU time of the process over the batch (every thread, user + system), ms: comparable on a loaded machine. */
  cpuMs: number;
  /** Resident memory after the batch, bytes. */
  rss: number;
  /** Bytes of data files (the CSVs) in the batch. */
  originalBytes: number;
}

export interface BenchLibraryOptions {
  /** Files per `ingest` call.
   * @default 500 */
  batch?: number;
  /** Called after each batch. @default undefined */
  onBatch?: (figures: BatchFigures) => void;
  /** Build afresh even when a cached library exists (the ingest benchmark measures the build).
   * @default false */
  fresh?: boolean;
}

/** The cache folder of the scale benchmarks in the system's temp folder. */
function benchFolder(): string {
  return join(tmpdir(), `bandshelf-bench-scale-v${BENCH_LIBRARY_VERSION}`);
}

/** Path of the cached N-entry library; built when missing (or when `fresh`). Returns its path and original bytes. */
export function benchLibrary(
  entries: number,
  options: BenchLibraryOptions = {},
): { path: string; dir: string; originalBytes: number } {
  const dir = benchFolder();
  mkdirSync(dir, { recursive: true });
  const path = join(dir, `library-${entries}.sqlite`);
  const bytesFile = `${path}.original-bytes`;
  if (!options.fresh && existsSync(path) && existsSync(bytesFile)) {
    return { path, dir, originalBytes: Number(readFileSync(bytesFile, 'utf8')) };
  }
  const building = join(dir, `building-${process.pid}.sqlite`);
  const scratch = join(dir, `files-${process.pid}`);
  for (const p of [building, `${building}-wal`, `${building}-shm`]) rmSync(p, { force: true });
  const library = initLibrary(building, { name: `synthetic scale benchmark (${entries} entries)` });
  const batch = Math.max(1, options.batch ?? 500);
  let originalBytes = 0;
  try {
    for (let start = 0; start < entries; start += batch) {
      const end = Math.min(entries, start + batch);
      rmSync(scratch, { recursive: true, force: true });
      mkdirSync(scratch);
      let bytes = 0;
      for (let k = start; k < end; k++) {
        const s = syntheticReferenceCsv(k);
        writeFileSync(join(scratch, `${s.id}.csv`), s.csv);
        writeFileSync(
          join(scratch, `${s.id}.meta.json`),
          JSON.stringify({ id: s.id, name: `Synthetic ${s.class} ${k}`, class: s.class, synthetic: true }),
        );
        bytes += Buffer.byteLength(s.csv);
      }
      originalBytes += bytes;
      const t0 = performance.now();
      const cpu0 = process.cpuUsage();
      // As `bandshelf add` does: near-duplicates on the kernels, the search cache extended by each batch.
      const outcome = ingest(library, [scratch], {
        force: true,
        message: 'scale benchmark (synthetic)',
        nearDuplicateIndex: libraryNearDuplicateIndex,
      });
      const ms = performance.now() - t0;
      const cpu = process.cpuUsage(cpu0);
      if (outcome.failed.length > 0) {
        throw new Error(
          `bench library: ${outcome.failed.length} files failed, first: ${outcome.failed[0]!.error}`,
        );
      }
      options.onBatch?.({
        entries: end,
        files: end - start,
        ms,
        cpuMs: (cpu.user + cpu.system) / 1000,
        rss: process.memoryUsage().rss,
        originalBytes: bytes,
      });
    }
  } finally {
    closeLibrary(library);
    rmSync(scratch, { recursive: true, force: true });
  }
  for (const p of [path, `${path}-wal`, `${path}-shm`]) rmSync(p, { force: true });
  rmSync(`${path}.cache`, { recursive: true, force: true });
  renameSync(building, path);
  // The search cache the batches extended is keyed by library state, not path: it moves with the library.
  if (existsSync(`${building}.cache`)) renameSync(`${building}.cache`, `${path}.cache`);
  writeFileSync(bytesFile, JSON.stringify(originalBytes));
  return { path, dir, originalBytes };
}

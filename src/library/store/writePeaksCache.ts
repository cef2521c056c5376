// Writes a state's sorted peak index to its cache file (a temporary file renamed into place); false when it cannot.
import { mkdirSync, readdirSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { crc32 } from 'node:zlib';
import type { SearchSet } from '../types.js';
import { PEAKS_CACHE_MAGIC, type PeaksCacheHeader } from './readPeaksCache.js';

/** The cache only saves time: a read-only folder or a full disk leaves no file and fails nothing. */
export function writePeaksCache(
  path: string,
  input: { stateKey: string; rows: number; peaks: SearchSet['peaks'] },
): boolean {
  const k = input.peaks.position.length;
  const f64 = Math.ceil((4 * k) / 8) * 8;
  const body = Buffer.alloc(f64 + 24 * k);
  Buffer.from(input.peaks.entry.buffer, input.peaks.entry.byteOffset, 4 * k).copy(body, 0);
  const columns = [input.peaks.position, input.peaks.height, input.peaks.prominence];
  columns.forEach((c, j) => {
    Buffer.from(c.buffer, c.byteOffset, 8 * k).copy(body, f64 + j * 8 * k);
  });
  const header: PeaksCacheHeader = {
    stateKey: input.stateKey,
    rows: input.rows,
    peaks: k,
    crc32: crc32(body),
  };
  const json = Buffer.from(JSON.stringify(header), 'utf8');
  const magic = Buffer.from(PEAKS_CACHE_MAGIC, 'ascii');
  const data = Math.ceil((magic.length + 4 + json.length) / 8) * 8;
  const head = Buffer.alloc(data);
  magic.copy(head, 0);
  head.writeUInt32LE(json.length, magic.length);
  json.copy(head, magic.length + 4);
  const temporary = `${path}.${process.pid}.tmp`;
  try {
    mkdirSync(dirname(path), { recursive: true });
    writeFileSync(temporary, Buffer.concat([head, body]));
    renameSync(temporary, path);
  } catch {
    try {
      rmSync(temporary, { force: true });
    } catch {
      // Nothing was created where the folder cannot be made.
    }
    return false;
  }
  prune(path);
  return true;
}

/** Peak files of earlier states are kept only while they may still be asked for: the 6 most recent. */
function prune(path: string): void {
  try {
    const folder = dirname(path);
    const files = readdirSync(folder)
      .filter((name) => /^peaks-[0-9a-f]{32}\.bin$/.test(name) && name !== basename(path))
      .map((name) => ({ name, time: statSync(join(folder, name)).mtimeMs }))
      .sort((a, b) => b.time - a.time);
    for (const file of files.slice(5)) rmSync(join(folder, file.name), { force: true });
  } catch {
    // Housekeeping only; another process pruning the same folder is harmless.
  }
}

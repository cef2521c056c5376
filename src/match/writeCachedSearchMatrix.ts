// Writes a search matrix to its disk cache file (atomically: a temporary file renamed into place).
import {
  closeSync,
  mkdirSync,
  openSync,
  readdirSync,
  renameSync,
  rmSync,
  statSync,
  writeSync,
} from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { crc32 } from 'node:zlib';
import { searchMatrixCacheFormat as F, type SearchMatrixCacheHeader } from './searchMatrixCacheFormat.js';
import type { SearchMatrix } from './searchTypes.js';

export interface WriteCachedSearchMatrixOptions {
  /**
   * Matrix files kept in the cache folder; older ones (earlier library states, other masks) are deleted.
   * @default 6
   */
  keep?: number;
}

const CHUNK = 64 * 1024 * 1024;

/**
 * Returns false (and leaves no partial file) when the cache cannot be written, e.g. a read-only folder: the cache
 * only saves time, so a failure to write it must never fail a search.
 */
export function writeCachedSearchMatrix(
  path: string,
  matrix: SearchMatrix,
  options: WriteCachedSearchMatrixOptions = {},
): boolean {
  const { layout } = matrix;
  const header: SearchMatrixCacheHeader = {
    format: F.version,
    key: matrix.key,
    rows: layout.rows,
    cols: layout.cols,
    stride: layout.stride,
    int8: layout.i8 >= 0,
    preparation: matrix.preparation,
    points: matrix.points,
    overlap: matrix.overlap,
    bytes: layout.end - layout.cached,
    crc32: 0,
  };
  for (let offset = 0; offset < header.bytes; offset += CHUNK) {
    const length = Math.min(CHUNK, header.bytes - offset);
    header.crc32 = crc32(new Uint8Array(matrix.memory.buffer, layout.cached + offset, length), header.crc32);
  }
  const json = Buffer.from(JSON.stringify(header), 'utf8');
  const magic = Buffer.from(F.magic, 'ascii');
  const headLength = Math.ceil((magic.length + 4 + json.length) / F.alignment) * F.alignment;
  const head = Buffer.alloc(headLength);
  magic.copy(head, 0);
  head.writeUInt32LE(json.length, magic.length);
  json.copy(head, magic.length + 4);
  const temporary = `${path}.${process.pid}.tmp`;
  let fd: number | null = null;
  try {
    mkdirSync(dirname(path), { recursive: true });
    fd = openSync(temporary, 'w');
    writeSync(fd, head);
    for (let offset = 0; offset < header.bytes; offset += CHUNK) {
      const length = Math.min(CHUNK, header.bytes - offset);
      writeSync(fd, new Uint8Array(matrix.memory.buffer, layout.cached + offset, length));
    }
    closeSync(fd);
    fd = null;
    renameSync(temporary, path);
  } catch {
    try {
      if (fd !== null) closeSync(fd);
      rmSync(temporary, { force: true });
    } catch {
      // Nothing was created where the folder cannot be made.
    }
    return false;
  }
  prune(path, options.keep ?? 6);
  return true;
}

/** Deletes all but the `keep` most recent matrix files in the cache folder (only files this module writes). */
function prune(path: string, keep: number): void {
  try {
    const folder = dirname(path);
    const files = readdirSync(folder)
      .filter((name) => /^search-[0-9a-f]{32}\.bin$/.test(name) && name !== basename(path))
      .map((name) => ({ name, time: statSync(join(folder, name)).mtimeMs }))
      .sort((a, b) => b.time - a.time);
    for (const file of files.slice(Math.max(0, keep - 1))) rmSync(join(folder, file.name), { force: true });
  } catch {
    // Pruning is housekeeping; a race with another process pruning the same folder is harmless.
  }
}

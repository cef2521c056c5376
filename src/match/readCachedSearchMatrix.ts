// Reads a search matrix back from its disk cache file, or returns null when there is no current one.
import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { crc32 } from 'node:zlib';
import { allocateMatrixMemory } from './allocateMatrixMemory.js';
import { searchMatrixCacheFormat as F, type SearchMatrixCacheHeader } from './searchMatrixCacheFormat.js';
import { searchMatrixLayout } from './searchMatrixLayout.js';
import type { SearchMatrix } from './searchTypes.js';

export interface ReadCachedSearchMatrixOptions {
  /**
   * Load into a shared memory (for a worker pool).
   * @default false
   */
  shared?: boolean;
  /**
   * Told when a current file's bytes fail their checksum (the caller then rebuilds).
   * @default a warning line on stderr
   */
  onDamaged?: (message: string) => void;
}

const CHUNK = 64 * 1024 * 1024;

/**
 * `expect` is what the caller needs; a file whose header differs in any of it (another state, mask, size or
 * format), or that is truncated, is ignored, and the caller rebuilds.
 */
export function readCachedSearchMatrix(
  path: string,
  expect: { key: string; rows: number; cols: number },
  options: ReadCachedSearchMatrixOptions = {},
): SearchMatrix | null {
  let fd: number;
  try {
    fd = openSync(path, 'r');
  } catch {
    return null;
  }
  try {
    const size = fstatSync(fd).size;
    const magic = Buffer.from(F.magic, 'ascii');
    const start = Buffer.alloc(magic.length + 4);
    if (readSync(fd, start, 0, start.length, 0) !== start.length) return null;
    if (!start.subarray(0, magic.length).equals(magic)) return null;
    const jsonLength = start.readUInt32LE(magic.length);
    if (jsonLength > 1 << 24) return null;
    const json = Buffer.alloc(jsonLength);
    if (readSync(fd, json, 0, jsonLength, start.length) !== jsonLength) return null;
    const header = JSON.parse(json.toString('utf8')) as SearchMatrixCacheHeader;
    if (
      header.format !== F.version ||
      header.key !== expect.key ||
      header.rows !== expect.rows ||
      header.cols !== expect.cols
    ) {
      return null;
    }
    const layout = searchMatrixLayout({ rows: header.rows, cols: header.cols }, { int8: header.int8 });
    const dataStart = Math.ceil((start.length + jsonLength) / F.alignment) * F.alignment;
    if (layout.stride !== header.stride || layout.end - layout.cached !== header.bytes) return null;
    if (size !== dataStart + header.bytes) return null;
    const memory = allocateMatrixMemory(layout, { shared: options.shared ?? false });
    let sum = 0;
    for (let offset = 0; offset < header.bytes; ) {
      const length = Math.min(CHUNK, header.bytes - offset);
      const view = new Uint8Array(memory.buffer, layout.cached + offset, length);
      const got = readSync(fd, view, 0, length, dataStart + offset);
      if (got <= 0) return null;
      sum = crc32(view.subarray(0, got), sum);
      offset += got;
    }
    if (sum !== header.crc32) {
      const warn = options.onDamaged ?? ((m: string) => process.stderr.write(`bandshelf: warning: ${m}\n`));
      warn(`the search cache ${path} fails its checksum (damaged on disk); rebuilding it`);
      return null;
    }
    return {
      key: header.key,
      preparation: header.preparation,
      layout,
      memory,
      points: header.points,
      overlap: header.overlap,
    };
  } catch {
    return null;
  } finally {
    closeSync(fd);
  }
}

// Verifies every search-matrix cache file beside a library against its checksum, for `check`.
import { closeSync, existsSync, openSync, readdirSync, readSync } from 'node:fs';
import { join } from 'node:path';
import { crc32 } from 'node:zlib';
import { searchMatrixCacheFormat as F, type SearchMatrixCacheHeader } from './searchMatrixCacheFormat.js';

const CHUNK = 16 * 1024 * 1024;

/** Returns one problem per damaged file (a stale but intact file is fine: `match` ignores and replaces it). */
export function verifySearchMatrixCache(libraryPath: string): { where: string; problem: string }[] {
  const folder = `${libraryPath}.cache`;
  if (!existsSync(folder)) return [];
  const problems: { where: string; problem: string }[] = [];
  for (const name of readdirSync(folder).sort()) {
    if (!/^search-[0-9a-f]{32}\.bin$/.test(name)) continue;
    const where = `search cache ${name}`;
    const fd = openSync(join(folder, name), 'r');
    try {
      const magic = Buffer.from(F.magic, 'ascii');
      const start = Buffer.alloc(magic.length + 4);
      readSync(fd, start, 0, start.length, 0);
      if (!start.subarray(0, magic.length).equals(magic)) {
        problems.push({ where, problem: 'not a search-matrix cache file (delete it; `match` rebuilds it)' });
        continue;
      }
      const jsonLength = start.readUInt32LE(magic.length);
      const json = Buffer.alloc(Math.min(jsonLength, 1 << 24));
      readSync(fd, json, 0, json.length, start.length);
      let header: SearchMatrixCacheHeader;
      try {
        header = JSON.parse(json.toString('utf8')) as SearchMatrixCacheHeader;
      } catch {
        problems.push({ where, problem: 'its header is damaged (delete it; `match` rebuilds it)' });
        continue;
      }
      if (header.format !== F.version) continue;
      const dataStart = Math.ceil((start.length + jsonLength) / F.alignment) * F.alignment;
      const buffer = Buffer.alloc(Math.min(CHUNK, Math.max(1, header.bytes)));
      let sum = 0;
      let read = 0;
      while (read < header.bytes) {
        const got = readSync(fd, buffer, 0, Math.min(buffer.length, header.bytes - read), dataStart + read);
        if (got <= 0) break;
        sum = crc32(buffer.subarray(0, got), sum);
        read += got;
      }
      if (read !== header.bytes) problems.push({ where, problem: 'the file is truncated' });
      else if (sum !== header.crc32)
        problems.push({
          where,
          problem: 'its bytes fail their CRC-32 (damaged on disk; `match` rebuilds it)',
        });
    } finally {
      closeSync(fd);
    }
  }
  return problems;
}

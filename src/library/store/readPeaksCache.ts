// Reads a state's sorted peak index back from its cache file, or null when the file is absent, stale or damaged.
import { readFileSync } from 'node:fs';
import { crc32 } from 'node:zlib';
import type { SearchSet } from '../types.js';

/** Magic, uint32 header length, JSON header, then entry (uint32), position, height, prominence (float64) columns. */
export const PEAKS_CACHE_MAGIC = 'BNDSHLF-PEAKS-1\n';

export interface PeaksCacheHeader {
  stateKey: string;
  rows: number;
  peaks: number;
  crc32: number;
}

/** Every value is checked against what the caller expects: a file of another state or size is never used. */
export function readPeaksCache(
  path: string,
  expect: { stateKey: string; rows: number },
): SearchSet['peaks'] | null {
  let bytes: Buffer;
  try {
    bytes = readFileSync(path);
  } catch {
    return null;
  }
  try {
    const magic = Buffer.from(PEAKS_CACHE_MAGIC, 'ascii');
    if (!bytes.subarray(0, magic.length).equals(magic)) return null;
    const jsonLength = bytes.readUInt32LE(magic.length);
    const start = magic.length + 4;
    const header = JSON.parse(bytes.subarray(start, start + jsonLength).toString('utf8')) as PeaksCacheHeader;
    if (header.stateKey !== expect.stateKey || header.rows !== expect.rows) return null;
    const k = header.peaks;
    if (!Number.isInteger(k) || k < 0) return null;
    // The float columns start on an 8-byte boundary of the body, so its views need no copy.
    const data = Math.ceil((start + jsonLength) / 8) * 8;
    const f64 = Math.ceil((4 * k) / 8) * 8;
    if (bytes.length !== data + f64 + 24 * k) return null;
    if (crc32(bytes.subarray(data)) !== header.crc32) return null;
    const body = new Uint8Array(bytes.length - data);
    body.set(bytes.subarray(data));
    const entry = new Uint32Array(body.buffer, 0, k);
    for (let i = 0; i < k; i++) if (entry[i]! >= expect.rows) return null;
    return {
      entry,
      position: new Float64Array(body.buffer, f64, k),
      height: new Float64Array(body.buffer, f64 + 8 * k, k),
      prominence: new Float64Array(body.buffer, f64 + 16 * k, k),
    };
  } catch {
    return null;
  }
}

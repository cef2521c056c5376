// Reads a little-endian Float64 blob back into a fresh Float64Array.
import { BandshelfError } from '../../error.js';

export interface BlobFloat64Options {
  /** What the blob holds, named in the error when its length is wrong.
   * @default 'a Float64 blob' */
  what?: string;
}

export function blobFloat64(blob: Uint8Array, options: BlobFloat64Options = {}): Float64Array {
  if (blob.byteLength % 8 !== 0) {
    throw new BandshelfError(
      'CHECK_FAILED',
      `${options.what ?? 'a Float64 blob'} has ${blob.byteLength} bytes`,
    );
  }
  const n = blob.byteLength / 8;
  const view = new DataView(blob.buffer, blob.byteOffset, blob.byteLength);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = view.getFloat64(i * 8, true);
  return out;
}

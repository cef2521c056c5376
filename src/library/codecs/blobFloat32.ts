// Reads a little-endian Float32 blob into a fresh Float64Array (NaN stays NaN).
import { BandshelfError } from '../../error.js';

export interface BlobFloat32Options {
  /** What the blob holds, named in the error when its length is wrong.
   * @default 'a Float32 blob' */
  what?: string;
}

export function blobFloat32(blob: Uint8Array, options: BlobFloat32Options = {}): Float64Array {
  if (blob.byteLength % 4 !== 0) {
    throw new BandshelfError(
      'CHECK_FAILED',
      `${options.what ?? 'a Float32 blob'} has ${blob.byteLength} bytes`,
    );
  }
  const n = blob.byteLength / 4;
  const view = new DataView(blob.buffer, blob.byteOffset, blob.byteLength);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = view.getFloat32(i * 4, true);
  return out;
}

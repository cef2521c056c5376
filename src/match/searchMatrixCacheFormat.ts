// The disk format of a cached search matrix: a magic, a JSON header, then the matrix memory's cached region verbatim.
import type { MatrixPreparation } from './searchTypes.js';

/** What the header of a cache file records; a file is used only when all of it matches what is wanted. */
export interface SearchMatrixCacheHeader {
  format: number;
  key: string;
  rows: number;
  cols: number;
  stride: number;
  int8: boolean;
  preparation: MatrixPreparation;
  points: number;
  overlap: number;
  /** Bytes of the cached region that follow the header. */
  bytes: number;
  /** CRC-32 (ISO-HDLC, as zlib) of those bytes: flipped bytes of the same file size are caught before use. */
  crc32: number;
}

export const searchMatrixCacheFormat = {
  magic: 'BNDSHLF-SEARCH-MATRIX\n',
  version: 2,
  /** The data start at a multiple of this, after magic, header length (uint32 LE) and header. */
  alignment: 4096,
} as const;

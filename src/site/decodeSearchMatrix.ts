// Unpacks the in-browser matcher's binary copy of the processed vectors into a float32 matrix (browser-safe).
import { BandshelfError } from '../error.js';

export interface DecodeSearchMatrixOptions {
  /** Name of the file, for error messages.
   * @default 'search-matrix.bin' */
  file?: string;
}

export interface DecodedSearchMatrix {
  rows: number;
  cols: number;
  /** rows × cols, row-major, NaN where not covered. */
  matrix: Float32Array;
}

const LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/** Reads the layout `encodeSearchMatrix` writes; a wrong magic, a short file or a bad size is a BAD_FORMAT error. */
export function decodeSearchMatrix(
  bytes: Uint8Array,
  options: DecodeSearchMatrixOptions = {},
): DecodedSearchMatrix {
  const file = options.file ?? 'search-matrix.bin';
  if (bytes.byteLength < 16 || String.fromCharCode(bytes[0]!, bytes[1]!, bytes[2]!, bytes[3]!) !== 'BSM1') {
    throw new BandshelfError('BAD_FORMAT', 'not a bandshelf search matrix', { file });
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const rows = view.getUint32(4, true);
  const cols = view.getUint32(8, true);
  const expected = 16 + rows * 4 + rows * cols * 2;
  if (bytes.byteLength !== expected) {
    throw new BandshelfError(
      'BAD_FORMAT',
      `expected ${expected} bytes for ${rows} × ${cols}, got ${bytes.byteLength}`,
      {
        file,
      },
    );
  }
  const matrix = new Float32Array(rows * cols);
  const start = 16 + rows * 4;
  // The file is little-endian; on a little-endian engine with an even offset the values are read as one Int16Array.
  const direct = LITTLE_ENDIAN && (bytes.byteOffset + start) % 2 === 0;
  const values = direct ? new Int16Array(bytes.buffer, bytes.byteOffset + start, rows * cols) : null;
  for (let r = 0; r < rows; r++) {
    const scale = view.getFloat32(16 + r * 4, true);
    const base = r * cols;
    for (let c = 0; c < cols; c++) {
      const q = values ? values[base + c]! : view.getInt16(start + (base + c) * 2, true);
      matrix[base + c] = q === -32768 ? Number.NaN : q * scale;
    }
  }
  return { rows, cols, matrix };
}

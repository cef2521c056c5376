// Reads any spectrum file bandshelf accepts from its bytes: sniffs JCAMP-DX or delimited text and parses it.
import { BandshelfError } from '../error.js';
import { decodeText } from './decodeText.js';
import { readDelimited } from './readDelimited.js';
import { readJcampDx } from './readJcampDx.js';
import { MAX_INPUT_BYTES, type ParsedSpectrum, type XUnit, type YUnit } from './types.js';

export interface ReadSpectrumFileOptions {
  /** The file's name as the user gave it; every error and warning is about it. @default undefined */
  file?: string;
  /** Unit of x, overriding what the file says or suggests. @default undefined (detected) */
  xUnit?: XUnit;
  /** Unit of y, overriding what the file says or suggests. @default undefined (detected) */
  yUnit?: YUnit;
  /** Read only this spectrum (1-based) of a multi-block JCAMP-DX file. @default undefined (all) */
  block?: number;
  /**
   * Read only this y column of a delimited file with several: header name (any case) or 1-based number.
   * @default undefined (every column)
   */
  column?: string | number;
  /** Refuse files larger than this many bytes. @default MAX_INPUT_BYTES (200 MB) */
  maxBytes?: number;
}

/**
 * Browser-safe (no fs): the caller reads the bytes. Too large → FILE_TOO_LARGE; empty → EMPTY_FILE; binary →
 * BINARY_DATA; text whose first label line starts with `##` (or that holds `##TITLE=` / `##JCAMP-DX=`) is
 * JCAMP-DX (its blocks), anything else delimited text (one spectrum per y column). Always returns at least one spectrum, converted to cm⁻¹ and
 * absorbance, ascending, finite and free of duplicate x; anything wrong is a BandshelfError naming the file.
 */
export function readSpectrumFile(bytes: Uint8Array, options: ReadSpectrumFileOptions = {}): ParsedSpectrum[] {
  const { file, xUnit, yUnit, block, column, maxBytes = MAX_INPUT_BYTES } = options;
  if (bytes.length > maxBytes) {
    throw new BandshelfError(
      'FILE_TOO_LARGE',
      `the file is ${mebibytes(bytes.length)} MiB; the limit is ${mebibytes(maxBytes)} MiB`,
      { file },
    );
  }
  if (bytes.length === 0) throw new BandshelfError('EMPTY_FILE', 'the file is empty', { file });
  let encodingWarning: string | undefined;
  const text = decodeText(bytes, {
    file,
    onWarning: (message) => {
      encodingWarning = message;
    },
  });
  if (text.trim() === '') throw new BandshelfError('EMPTY_FILE', 'the file holds only white space', { file });
  const parsed = readParsed(text, { file, block, xUnit, yUnit, ...(column === undefined ? {} : { column }) });
  if (encodingWarning === undefined) return parsed;
  const warning = { message: encodingWarning };
  return parsed.map((p) => ({ ...p, warnings: [warning, ...p.warnings] }));
}

function readParsed(
  text: string,
  options: Pick<ReadSpectrumFileOptions, 'file' | 'block' | 'xUnit' | 'yUnit' | 'column'>,
): ParsedSpectrum[] {
  const { file, block, xUnit, yUnit, column } = options;
  if (isJcampDx(text)) {
    if (column !== undefined) {
      throw new BandshelfError(
        'BAD_OPTION',
        'column picks a y column of delimited text; the spectra of a JCAMP-DX file are chosen by block',
        { file, field: 'column' },
      );
    }
    return readJcampDx(text, { file, block, xUnit, yUnit });
  }
  if (block !== undefined && block !== 1) {
    throw new BandshelfError(
      'BAD_OPTION',
      `block ${block} does not exist: the spectra of delimited text are its y columns (choose one by column)`,
      {
        file,
        field: 'block',
      },
    );
  }
  return readDelimited(text, { file, xUnit, yUnit, ...(column === undefined ? {} : { column }) });
}

function isJcampDx(text: string): boolean {
  const head = text.slice(0, 65536);
  const start = head.search(/\S/);
  const end = head.indexOf('\n', start);
  const first = start < 0 ? '' : head.slice(start, end < 0 ? undefined : end);
  if (first.startsWith('##') && first.includes('=')) return true;
  return /^[ \t]*##[ \t]*(TITLE|JCAMP[-_ ]?DX)[ \t]*=/im.test(head);
}

function mebibytes(n: number): string {
  return (n / 1048576).toFixed(n < 1048576 ? 3 : 1);
}

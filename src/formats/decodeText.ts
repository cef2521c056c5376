// Turns a file's bytes into text: UTF-8 (BOM or not), UTF-16 with a BOM, else Latin-1; refuses binary data.
import { BandshelfError } from '../error.js';

export interface DecodeTextOptions {
  /** File named in errors. @default undefined */
  file?: string;
}

/**
 * Browser-safe (TextDecoder only). Instrument software on older systems writes Latin-1 (°, µ, ²), so bytes that
 * are not valid UTF-8 are read as Latin-1 (windows-1252) rather than refused. NUL bytes, or more than 1 % control
 * characters, mean binary data (BINARY_DATA): a text reader would only produce nonsense from them.
 */
export function decodeText(bytes: Uint8Array, options: DecodeTextOptions = {}): string {
  const { file } = options;
  const b0 = bytes[0];
  const b1 = bytes[1];
  if (bytes.length >= 2 && ((b0 === 0xff && b1 === 0xfe) || (b0 === 0xfe && b1 === 0xff))) {
    const text = new TextDecoder(b0 === 0xff ? 'utf-16le' : 'utf-16be').decode(bytes);
    checkText(text, file);
    return text;
  }
  let controls = 0;
  let high = 0;
  for (let i = 0; i < bytes.length; i++) {
    const c = bytes[i]!;
    if (c === 0) {
      throw new BandshelfError(
        'BINARY_DATA',
        `the file holds NUL bytes (first at byte ${i}): binary data, not text`,
        {
          file,
        },
      );
    }
    if ((c < 0x20 && c !== 9 && c !== 10 && c !== 13 && c !== 12 && c !== 0x1a) || c === 0x7f) controls++;
    else if (c >= 0x80) high++;
  }
  if (controls > 0.01 * bytes.length) {
    throw new BandshelfError(
      'BINARY_DATA',
      `${controls} of ${bytes.length} bytes are control characters: binary data, not text`,
      {
        file,
      },
    );
  }
  if (high === 0) return new TextDecoder('utf-8').decode(bytes);
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    // Text that is mostly bytes ≥ 0x80 and not UTF-8 is not a Latin-1 spectrum either.
    if (high > 0.3 * bytes.length) {
      throw new BandshelfError(
        'BINARY_DATA',
        'most bytes are neither ASCII nor UTF-8: binary data, not text',
        {
          file,
        },
      );
    }
    return new TextDecoder('latin1').decode(bytes);
  }
}

function checkText(text: string, file: string | undefined): void {
  let controls = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 0) {
      throw new BandshelfError('BINARY_DATA', 'the file holds NUL characters: binary data, not text', {
        file,
      });
    }
    if (c < 0x20 && c !== 9 && c !== 10 && c !== 13 && c !== 12) controls++;
  }
  if (controls > 0.01 * text.length) {
    throw new BandshelfError('BINARY_DATA', 'too many control characters: binary data, not text', { file });
  }
}

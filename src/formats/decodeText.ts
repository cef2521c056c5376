// The one decoder of every text input (spectra, traces, sidecars, manifests, recipes): a BOM picks UTF-8 or
// UTF-16LE/BE, else valid UTF-8, else Windows-1252 with a warning; refuses binary data.
import { BandshelfError } from '../error.js';

export interface DecodeTextOptions {
  /** File named in errors. @default undefined */
  file?: string;
  /** Called once when the bytes are not valid UTF-8 and were read as Windows-1252. @default undefined (silent) */
  onWarning?: (message: string) => void;
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
    options.onWarning?.(
      'not valid UTF-8, read as Windows-1252 (Latin-1); save the file as UTF-8 to be sure of characters such as µ and °',
    );
    return windows1252(bytes);
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

// Windows-1252 bytes 0x80–0x9F (the rest equal their ISO 8859-1 code points); the five the code page leaves
// unassigned stay C1 controls.
// From the WHATWG Encoding Standard's index-windows-1252; decoded here because Node's TextDecoder may treat the
// label as ISO 8859-1, and the browser and the CLI must read the same text.
const CP1252_HIGH = [
  0x20ac, 0x0081, 0x201a, 0x0192, 0x201e, 0x2026, 0x2020, 0x2021, 0x02c6, 0x2030, 0x0160, 0x2039, 0x0152,
  0x008d, 0x017d, 0x008f, 0x0090, 0x2018, 0x2019, 0x201c, 0x201d, 0x2022, 0x2013, 0x2014, 0x02dc, 0x2122,
  0x0161, 0x203a, 0x0153, 0x009d, 0x017e, 0x0178,
];

function windows1252(bytes: Uint8Array): string {
  const parts: string[] = [];
  const chunk = 8192;
  const codes = new Uint16Array(Math.min(chunk, bytes.length));
  for (let start = 0; start < bytes.length; start += chunk) {
    const end = Math.min(bytes.length, start + chunk);
    for (let i = start; i < end; i++) {
      const b = bytes[i]!;
      codes[i - start] = b >= 0x80 && b < 0xa0 ? CP1252_HIGH[b - 0x80]! : b;
    }
    parts.push(String.fromCharCode(...codes.subarray(0, end - start)));
  }
  return parts.join('');
}

// The one text decoder: BOM → UTF-8/UTF-16LE/UTF-16BE, else valid UTF-8, else Windows-1252 with a warning.
import { describe, expect, it } from 'vitest';
import { decodeText } from '../../src/formats/decodeText.js';
import { bandshelfErrorOf } from '../bandshelfErrorOf.js';

/** UTF-16 code units with a BOM (Unicode Standard §3.10: FF FE little-endian, FE FF big-endian). */
function utf16(text: string, littleEndian: boolean): Uint8Array {
  const out = new Uint8Array(2 + text.length * 2);
  const view = new DataView(out.buffer);
  view.setUint16(0, 0xfeff, littleEndian);
  for (let i = 0; i < text.length; i++) view.setUint16(2 + 2 * i, text.charCodeAt(i), littleEndian);
  return out;
}

describe('decodeText', () => {
  const text = 'path length 25 µm at 37 °C\n';

  it('reads UTF-8 with and without a BOM, and UTF-16 LE and BE with theirs, dropping the BOM', () => {
    const utf8 = new TextEncoder().encode(text);
    expect(decodeText(utf8)).toBe(text);
    expect(decodeText(new Uint8Array([0xef, 0xbb, 0xbf, ...utf8]))).toBe(text);
    expect(decodeText(utf16(text, true))).toBe(text);
    expect(decodeText(utf16(text, false))).toBe(text);
  });

  it('reads bytes that are not UTF-8 as Windows-1252 and says so', () => {
    // Windows-1252 (a superset of ISO 8859-1 printable range): 0xB5 µ, 0xB0 °, 0x80 €.
    const bytes = Uint8Array.from([...'25 ', 0xb5, ...'m 37 ', 0xb0, ...'C 5 ', 0x80], (c) =>
      typeof c === 'number' ? c : c.charCodeAt(0),
    );
    const warnings: string[] = [];
    expect(decodeText(bytes, { onWarning: (m) => warnings.push(m) })).toBe('25 µm 37 °C 5 €');
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toMatch(/Windows-1252/);
    const none: string[] = [];
    decodeText(new TextEncoder().encode(text), { onWarning: (m) => none.push(m) });
    expect(none).toEqual([]);
  });

  it('refuses NUL bytes outside UTF-16 as binary data', () => {
    expect(bandshelfErrorOf(() => decodeText(new Uint8Array([49, 0, 50]), { file: 'b.bin' })).code).toBe(
      'BINARY_DATA',
    );
  });
});

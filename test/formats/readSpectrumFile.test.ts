// The byte-level entry point: sniffing, text encodings, size and binary limits.
import { describe, expect, it } from 'vitest';
import { readSpectrumFile } from '../../src/formats/readSpectrumFile.js';
import { writeJcampDx } from '../../src/formats/writeJcampDx.js';
import { bandshelfErrorOf } from '../bandshelfErrorOf.js';
import { mulberry32 } from '../mulberry32.js';

const utf8 = (text: string): Uint8Array => new TextEncoder().encode(text);

/** Latin-1 bytes: every character below U+0100 as one byte. */
function latin1(text: string): Uint8Array {
  return Uint8Array.from(Array.from(text, (c) => c.charCodeAt(0)));
}

const CSV = 'wavenumber_cm-1,absorbance\n1000,0.5\n1002,0.25\n';

describe('readSpectrumFile', () => {
  it('sniffs delimited text and JCAMP-DX', () => {
    const csv = readSpectrumFile(utf8(CSV), { file: 'a.csv' });
    expect(csv).toHaveLength(1);
    expect(csv[0]!.source.format).toBe('delimited');
    const spectrum = {
      wavenumber: Float64Array.from([1000, 1002]),
      absorbance: Float64Array.from([0.5, 0.25]),
    };
    const jdx = readSpectrumFile(utf8(`\n\n${writeJcampDx(spectrum, { title: 't' })}`), { file: 'a.jdx' });
    expect(jdx[0]!.source.format).toBe('jcamp-dx');
    expect(Array.from(jdx[0]!.spectrum.absorbance)).toEqual([0.5, 0.25]);
  });

  it('returns one spectrum per y column of delimited text, and takes column only there', () => {
    const two = utf8('cm-1,run_1,run_2\n1000,0.5,0.6\n1002,0.25,0.3\n');
    expect(readSpectrumFile(two, { file: 'r.csv' }).map((p) => p.source.column)).toEqual(['run_1', 'run_2']);
    expect(readSpectrumFile(two, { column: 'run_2' }).map((p) => p.source.column)).toEqual(['run_2']);
    const spectrum = {
      wavenumber: Float64Array.from([1000, 1002]),
      absorbance: Float64Array.from([0.5, 0.25]),
    };
    const jdx = utf8(writeJcampDx(spectrum, { title: 't' }));
    const error = bandshelfErrorOf(() => readSpectrumFile(jdx, { file: 'a.jdx', column: 1 }));
    expect(error.code).toBe('BAD_OPTION');
    expect(error.message).toMatch(/chosen by block/);
  });

  it('reads UTF-8 with a BOM, UTF-16 with a BOM and Latin-1 text', () => {
    const bom = new Uint8Array([0xef, 0xbb, 0xbf, ...utf8(CSV)]);
    expect(readSpectrumFile(bom)[0]!.warnings).toEqual([]);
    const utf16 = new Uint8Array(2 + CSV.length * 2);
    utf16[0] = 0xff;
    utf16[1] = 0xfe;
    for (let i = 0; i < CSV.length; i++) utf16[2 + 2 * i] = CSV.charCodeAt(i);
    expect(Array.from(readSpectrumFile(utf16)[0]!.spectrum.absorbance)).toEqual([0.5, 0.25]);
    // 0xB5 is µ and 0xB0 is ° in Latin-1 (ISO 8859-1).
    const jdx = writeJcampDx(
      { wavenumber: Float64Array.from([1000, 1002]), absorbance: Float64Array.from([0.5, 0.25]) },
      { title: 'film 25 \u00b5m at 37 \u00b0C', meta: { origin: 'Labor M\u00fcnster' } },
    );
    const [parsed] = readSpectrumFile(latin1(jdx), { file: 'l1.jdx' });
    expect(parsed!.meta.title).toBe('film 25 µm at 37 °C');
    expect(parsed!.meta.origin).toBe('Labor Münster');
  });

  it('gives a BandshelfError, not a hang, for a 100,000-digit cell and 50,000 block titles', () => {
    // Worst cases from issue reports of quadratic parsers; their time per MB is measured by `npm run fuzz`.
    const digits = '1'.repeat(100_000);
    expect(bandshelfErrorOf(() => readSpectrumFile(utf8(`x,y\n1000,${digits}\n1002,0.5\n`))).code).toBe(
      'NOT_FINITE',
    );
    const titles = `${'##TITLE=a\n'.repeat(50_000)}##END=\n`;
    expect(bandshelfErrorOf(() => readSpectrumFile(utf8(titles))).code).toBe('NOT_A_SPECTRUM');
  });

  it('passes block and unit options through', () => {
    const text = 'x,y\n2500,50\n5000,10\n';
    const [p] = readSpectrumFile(utf8(text), { xUnit: 'nm', yUnit: 'percent-transmittance', block: 1 });
    expect(Array.from(p!.spectrum.wavenumber)).toEqual([2000, 4000]);
    const err = bandshelfErrorOf(() => readSpectrumFile(utf8(text), { file: 'x.csv', block: 2 }));
    expect(err.code).toBe('BAD_OPTION');
  });

  it('refuses a file over the size limit', () => {
    const err = bandshelfErrorOf(() => readSpectrumFile(utf8(CSV), { file: 'big.csv', maxBytes: 10 }));
    expect(err.code).toBe('FILE_TOO_LARGE');
    expect(err.file).toBe('big.csv');
  });

  it('refuses empty and blank files', () => {
    expect(bandshelfErrorOf(() => readSpectrumFile(new Uint8Array(0), { file: 'e' })).code).toBe(
      'EMPTY_FILE',
    );
    expect(bandshelfErrorOf(() => readSpectrumFile(utf8(' \n\t\n'), { file: 'e' })).code).toBe('EMPTY_FILE');
  });

  it('refuses binary data: NUL bytes or noise', () => {
    const withNul = utf8(CSV);
    withNul[5] = 0;
    expect(bandshelfErrorOf(() => readSpectrumFile(withNul, { file: 'n.bin' })).code).toBe('BINARY_DATA');
    const random = mulberry32(9);
    const noise = Uint8Array.from({ length: 4096 }, () => 1 + Math.floor(random() * 255));
    const err = bandshelfErrorOf(() => readSpectrumFile(noise, { file: 'noise.spa' }));
    expect(err.code).toBe('BINARY_DATA');
    expect(err.oneLine()).toMatch(/^noise\.spa: /);
  });
});

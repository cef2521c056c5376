// The JCAMP-DX writer: the standard's forms, round trips in every form and scale, metadata, line width.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { readJcampDx } from '../../src/formats/readJcampDx.js';
import { type JcampForm, writeJcampDx } from '../../src/formats/writeJcampDx.js';
import type { Spectrum } from '../../src/spectrum/types.js';
import { mulberry32 } from '../mulberry32.js';

const FORMS: JcampForm[] = ['affn', 'pac', 'sqz', 'dif', 'difdup'];

function dataLines(text: string): string[] {
  const lines = text.split('\n');
  const start = lines.findIndex((l) => l.startsWith('##XYDATA') || l.startsWith('##XYPOINTS'));
  const end = lines.indexOf('##END=');
  return lines.slice(start + 1, end);
}

/** A 4000–600 cm⁻¹ spectrum at 2 cm⁻¹ (1701 points): seeded bands, a slope and noise, times `scale`. */
function randomSpectrum(seed: number, scale: number, n = 1701): Spectrum {
  const random = mulberry32(seed);
  const wavenumber = new Float64Array(n);
  const absorbance = new Float64Array(n);
  const bands = Array.from({ length: 6 }, () => ({
    centre: 600 + random() * 3400,
    width: 5 + random() * 40,
    height: random(),
  }));
  for (let i = 0; i < n; i++) {
    const x = 600 + i * 2;
    wavenumber[i] = x;
    let y = 0.02 + 1e-5 * (x - 600) + 0.003 * (random() - 0.5);
    for (const b of bands) y += b.height * Math.exp(-0.5 * ((x - b.centre) / b.width) ** 2);
    absorbance[i] = y * scale;
  }
  return { wavenumber, absorbance };
}

function maxAbs(v: Float64Array): number {
  let m = 0;
  for (const a of v) m = Math.max(m, Math.abs(a));
  return m;
}

describe('writeJcampDx', () => {
  it('writes the standard’s ten ordinates in each form as the standard spells them', () => {
    // JCAMP-DX 4.24 (McDonald & Wilks 1988, 2001 corrections): 1 2 3 3 2 1 0 −1 −2 −3 is AFFN `1 2 3 3 2 1 0 -1 -2 -3`,
    // PAC `1+2+3+3+2+1+0-1-2-3`, SQZ `1BCCBA@abc`, DIF `1JJ%jjjjjj`, DIFDUP `1JT%jX`, behind X as in `0 1JT%jX`.
    // The writer starts a compressed line with the SQZ form of the first value (A = 1, from the same table)
    // and closes DIF forms with a Y-check line.
    const spectrum: Spectrum = {
      wavenumber: Float64Array.from({ length: 10 }, (_, i) => i),
      absorbance: Float64Array.from([1, 2, 3, 3, 2, 1, 0, -1, -2, -3]),
    };
    const expected: Record<JcampForm, string[]> = {
      affn: ['0 1 2 3 3 2 1 0 -1 -2 -3'],
      pac: ['0 1+2+3+3+2+1+0-1-2-3'],
      sqz: ['0 ABCCBA@abc'],
      dif: ['0 AJJ%jjjjjj', '9 c'],
      difdup: ['0 AJT%jX', '9 c'],
    };
    for (const form of FORMS) {
      const text = writeJcampDx(spectrum, { form, title: 'ten', significantDigits: 1 });
      expect(dataLines(text)).toEqual(expected[form]);
      expect(text).toContain('##YFACTOR=1E0');
      const [back] = readJcampDx(text);
      expect(Array.from(back!.spectrum.absorbance)).toEqual([1, 2, 3, 3, 2, 1, 0, -1, -2, -3]);
      expect(back!.warnings).toEqual([]);
    }
  });

  it('writes ordinates at the edge of the double range with a YFACTOR the reader accepts (no 1E-331)', () => {
    // 5e-324 is the smallest subnormal double (IEEE 754); 10^(⌊log10 5e-324⌋ − 7) = 1E-331 would read as 0.
    const spectrum: Spectrum = {
      wavenumber: Float64Array.from([1000, 1001, 1002]),
      absorbance: Float64Array.from([5e-324, 0, -1e-310]),
    };
    for (const form of FORMS) {
      const text = writeJcampDx(spectrum, { form });
      expect(text).toContain('##YFACTOR=1E-300');
      const [back] = readJcampDx(text);
      // Within the documented 0.5·YFACTOR: every value this small reads back as 0.
      expect(Array.from(back!.spectrum.absorbance)).toEqual([0, 0, 0]);
    }
  });

  for (const scale of [1e-9, 1, 1e6]) {
    it(`round-trips seeded random data in every form within 1e-6 of max|y| (scale ${scale})`, () => {
      const spectrum = randomSpectrum(42 + Math.round(Math.log10(scale)), scale);
      const limit = 1e-6 * maxAbs(spectrum.absorbance);
      for (const form of FORMS) {
        const text = writeJcampDx(spectrum, { form, title: `random ${form}` });
        for (const line of text.split('\n')) expect(line.length).toBeLessThanOrEqual(80);
        const [back] = readJcampDx(text, { file: `${form}.jdx` });
        expect(back!.warnings.map((w) => `${w.line}: ${w.message}`)).toEqual([]);
        expect(back!.spectrum.wavenumber).toHaveLength(1701);
        let worstY = 0;
        let worstX = 0;
        for (let i = 0; i < 1701; i++) {
          worstY = Math.max(worstY, Math.abs(back!.spectrum.absorbance[i]! - spectrum.absorbance[i]!));
          worstX = Math.max(worstX, Math.abs(back!.spectrum.wavenumber[i]! - spectrum.wavenumber[i]!));
        }
        expect(worstY).toBeLessThanOrEqual(limit);
        expect(worstX).toBeLessThan(1e-9);
      }
    });
  }

  it('compresses long runs with DUP and splits them across lines without losing points', () => {
    const n = 2000;
    const absorbance = new Float64Array(n);
    for (let i = 0; i < n; i++) absorbance[i] = i < 700 ? 0 : i < 1400 ? (i - 700) * 0.001 : 0.7;
    const spectrum = { wavenumber: Float64Array.from({ length: n }, (_, i) => 1000 + i), absorbance };
    const text = writeJcampDx(spectrum, { form: 'difdup', significantDigits: 3 });
    expect(dataLines(text).length).toBeLessThan(10);
    const [back] = readJcampDx(text);
    expect(Array.from(back!.spectrum.absorbance).map((v) => Math.round(v * 1000))).toEqual(
      Array.from(absorbance).map((v) => Math.round(v * 1000)),
    );
  });

  it('writes unevenly spaced x as XYPOINTS and reads them back', () => {
    const random = mulberry32(7);
    const n = 200;
    const wavenumber = new Float64Array(n);
    const absorbance = new Float64Array(n);
    let x = 1000;
    for (let i = 0; i < n; i++) {
      x += 0.5 + random() * 3;
      wavenumber[i] = x;
      absorbance[i] = random() - 0.3;
    }
    const text = writeJcampDx({ wavenumber, absorbance });
    expect(text).toContain('##XYPOINTS=(XY..XY)');
    expect(text).not.toContain('##DELTAX');
    const [back] = readJcampDx(text);
    expect(Array.from(back!.spectrum.wavenumber)).toEqual(Array.from(wavenumber));
    for (let i = 0; i < n; i++)
      expect(Math.abs(back!.spectrum.absorbance[i]! - absorbance[i]!)).toBeLessThan(1e-7);
  });

  it('writes the metadata labels back so the reader returns them', () => {
    const meta = {
      origin: 'Example Lab',
      owner: 'CC0-1.0',
      resolution: 4,
      state: 'dried film',
      samplingProcedure: 'ATR, diamond crystal',
      cas: '7732-18-5',
      formula: 'H2 O',
      casName: 'water',
      names: 'water; dihydrogen oxide',
      date: '2024-05-01',
      instrument: 'bench FTIR (synthetic)',
    };
    const text = writeJcampDx(
      { wavenumber: Float64Array.from([1000, 1002, 1004]), absorbance: Float64Array.from([0.1, 0.2, 0.15]) },
      {
        title:
          'A long title that goes on and on, longer than one line of eighty characters, to show wrapping',
        meta,
      },
    );
    for (const line of text.split('\n')) expect(line.length).toBeLessThanOrEqual(80);
    const [back] = readJcampDx(text);
    expect(back!.meta).toMatchObject({
      ...meta,
      title: 'A long title that goes on and on, longer than one line of eighty characters, to show wrapping',
    });
  });

  it('writes comment lines as $$ lines that a reader skips, cut at 80 characters', () => {
    // `$$` starts a comment anywhere on a line (JCAMP-DX 4.24, McDonald & Wilks 1988).
    const spectrum: Spectrum = {
      wavenumber: Float64Array.of(1000, 1001, 1002),
      absorbance: Float64Array.of(1, 2, 3),
    };
    const long = `made by subtraction ${'x'.repeat(100)}`;
    const text = writeJcampDx(spectrum, { comments: ['a − 0.5 × b', long] });
    const lines = text.split('\n');
    expect(lines).toContain('$$ a − 0.5 × b');
    expect(lines.find((l) => l.startsWith('$$ made by'))!.length).toBe(80);
    const [read] = readJcampDx(text);
    expect(Array.from(read!.spectrum.absorbance)).toEqual([1, 2, 3]);
  });

  it('refuses fewer than two points, non-finite values and bad options', () => {
    const one = { wavenumber: Float64Array.from([1]), absorbance: Float64Array.from([1]) };
    expect(() => writeJcampDx(one)).toThrow(BandshelfError);
    const nan = { wavenumber: Float64Array.from([1, 2]), absorbance: Float64Array.from([1, Number.NaN]) };
    expect(() => writeJcampDx(nan)).toThrow(/not finite/);
    const ok = { wavenumber: Float64Array.from([1, 2]), absorbance: Float64Array.from([1, 2]) };
    expect(() => writeJcampDx(ok, { significantDigits: 0 })).toThrow(BandshelfError);
    expect(() => writeJcampDx(ok, { form: 'zip' as JcampForm })).toThrow(BandshelfError);
  });
});

// The JCAMP-DX reader against the standard's own examples, the quirks of real files, and bad input.
import { describe, expect, it } from 'vitest';
import { readJcampDx } from '../../src/formats/readJcampDx.js';
import { bandshelfErrorOf } from '../bandshelfErrorOf.js';

/** A one-block file around the given data lines; `labels` replace the defaults of the same name. */
function jdx(
  data: string[],
  labels: Record<string, string> = {},
  dataLabel = '##XYDATA=(X++(Y..Y))',
): string {
  const defaults: Record<string, string> = {
    TITLE: 'test block',
    'JCAMP-DX': '4.24',
    'DATA TYPE': 'INFRARED SPECTRUM',
    XUNITS: '1/CM',
    YUNITS: 'ABSORBANCE',
    XFACTOR: '1',
    YFACTOR: '1',
    FIRSTX: '0',
    LASTX: '9',
    NPOINTS: '10',
  };
  const all = { ...defaults, ...labels };
  const head = Object.entries(all)
    .filter(([, v]) => v !== '-')
    .map(([k, v]) => `##${k}=${v}`);
  return [...head, dataLabel, ...data, '##END='].join('\n');
}

const TEN = [1, 2, 3, 3, 2, 1, 0, -1, -2, -3];

describe('readJcampDx: the standard’s own examples', () => {
  // JCAMP-DX 4.24, McDonald & Wilks, Appl. Spectrosc. 42 (1988), with the 2001 corrections (Baumbach et al.):
  // the ordinates 1 2 3 3 2 1 0 −1 −2 −3 in each form, here behind the abscissa 0.
  const forms: [string, string][] = [
    ['AFFN', '0 1 2 3 3 2 1 0 -1 -2 -3'],
    ['PAC', '0 1+2+3+3+2+1+0-1-2-3'],
    ['SQZ', '0 1BCCBA@abc'],
    ['DIF', '0 1JJ%jjjjjj'],
    ['DIFDUP', '0 1JT%jX'],
  ];
  for (const [form, line] of forms) {
    it(`decodes the ten ordinates in ${form}`, () => {
      const [parsed] = readJcampDx(jdx([line]), { file: 'ten.jdx' });
      expect(Array.from(parsed!.spectrum.absorbance)).toEqual(TEN);
      expect(Array.from(parsed!.spectrum.wavenumber)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9]);
      expect(parsed!.warnings).toEqual([]);
    });
  }

  // The DIFDUP line with its Y-check line, as corrected in 2001 (McDonald & Wilks 1988; Baumbach et al. 2001):
  // 53 ordinates summing to 1489, first ten 0 0 0 0 2 4 4 4 7 5, last five 96 104 110 121 128, check A28 = 128.
  const STANDARD_LINE = '599.860@VKT%TLkj%J%KLJ%njKjL%kL%jJULJ%kLK1%lLMNPNPRLJ0QTOJ1P';
  const standardFile = (check: string): string =>
    jdx([STANDARD_LINE, check], { FIRSTX: '599.860', LASTX: '700.158', NPOINTS: '53' });

  it('decodes the DIFDUP line with its Y-check line to the published ordinates', () => {
    const [parsed] = readJcampDx(standardFile('700.158A28'), { file: 'std.jdx' });
    const y = Array.from(parsed!.spectrum.absorbance);
    expect(y).toHaveLength(53);
    expect(y.reduce((a, b) => a + b, 0)).toBe(1489);
    expect(y.slice(0, 10)).toEqual([0, 0, 0, 0, 2, 4, 4, 4, 7, 5]);
    expect(y.slice(-5)).toEqual([96, 104, 110, 121, 128]);
    expect(parsed!.warnings).toEqual([]);
    const x = parsed!.spectrum.wavenumber;
    expect(x[0]).toBeCloseTo(599.86, 9);
    expect(x[52]).toBeCloseTo(700.158, 9);
  });

  it('warns with the line when the Y check fails, and still drops the duplicate', () => {
    const [parsed] = readJcampDx(standardFile('700.158A27'), { file: 'std.jdx' });
    expect(parsed!.spectrum.absorbance).toHaveLength(53);
    const warning = parsed!.warnings.find((w) => /Y-check failed/.test(w.message));
    expect(warning?.line).toBe(13);
    expect(warning?.message).toMatch(/starts with 127 but the previous line ended with 128/);
  });

  it('keeps the first value of a DIF line whose X names a new point (a writer without Y checks)', () => {
    const [parsed] = readJcampDx(jdx(['0 1JJ%j', '5 AjV']), { file: 'nocheck.jdx' });
    expect(Array.from(parsed!.spectrum.absorbance)).toEqual(TEN);
    expect(parsed!.warnings).toEqual([
      { line: 13, message: '1 DIF line starts without the Y check (the X names a new point); read as data' },
    ]);
  });

  it('verifies and drops the Y check between two DIF lines', () => {
    // 1 2 3 3 2 1 | (1) 0 −1 −2 −3 | (−3): each later line starts with the previous line's last ordinate.
    const [parsed] = readJcampDx(jdx(['0 1JT%jj', '5AjV', '9c']), { file: 'two.jdx' });
    expect(Array.from(parsed!.spectrum.absorbance)).toEqual(TEN);
    expect(parsed!.warnings).toEqual([]);
  });
});

describe('readJcampDx: abscissae, factors and units', () => {
  it('applies XFACTOR and YFACTOR, including tiny and huge factors', () => {
    const tiny = readJcampDx(jdx(['0 1 2 3 3 2 1 0 -1 -2 -3'], { YFACTOR: '1E-9' }))[0]!;
    expect(tiny.spectrum.absorbance[2]).toBeCloseTo(3e-9, 20);
    const huge = readJcampDx(jdx(['0 1 2 3 3 2 1 0 -1 -2 -3'], { YFACTOR: '1e6' }))[0]!;
    expect(huge.spectrum.absorbance[2]).toBe(3e6);
    const xf = readJcampDx(
      jdx(['0 1 2 3 3 2 1 0 -1 -2 -3'], { XFACTOR: '2', FIRSTX: '1000', LASTX: '1018' }).replace(
        '\n0 1',
        '\n500 1',
      ),
    )[0]!;
    expect(Array.from(xf.spectrum.wavenumber).slice(0, 3)).toEqual([1000, 1002, 1004]);
    expect(xf.warnings).toEqual([]);
  });

  it('returns descending files ascending', () => {
    const [parsed] = readJcampDx(
      jdx(['9 1 2 3 3 2 1 0 -1 -2 -3'], { FIRSTX: '9', LASTX: '0', DELTAX: '-1' }),
    );
    expect(Array.from(parsed!.spectrum.wavenumber)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9]);
    expect(Array.from(parsed!.spectrum.absorbance)).toEqual([...TEN].reverse());
  });

  it('converts MICROMETERS and NANOMETERS to cm⁻¹', () => {
    // common practice: 10 µm = 1000 cm⁻¹, 2.5 µm = 4000 cm⁻¹, 10⁷/λ(nm).
    const um = readJcampDx(
      jdx(['2.5 1 2 3 4'], { XUNITS: 'MICROMETERS', FIRSTX: '2.5', LASTX: '10', NPOINTS: '4' }),
    )[0]!;
    expect(Array.from(um.spectrum.wavenumber)).toEqual([1000, 1e4 / 7.5, 2000, 4000]);
    expect(Array.from(um.spectrum.absorbance)).toEqual([4, 3, 2, 1]);
    expect(um.source.xUnit).toBe('um');
    const nm = readJcampDx(
      jdx(['2500 1 2'], { XUNITS: 'NANOMETERS', FIRSTX: '2500', LASTX: '10000', NPOINTS: '2' }),
    )[0]!;
    expect(Array.from(nm.spectrum.wavenumber)).toEqual([1000, 4000]);
  });

  it('converts TRANSMITTANCE, %T and PERCENT TRANSMITTANCE to absorbance', () => {
    // common practice: A = −log10 T = 2 − log10(%T); T = 1e-4 is 4 AU.
    const t = readJcampDx(
      jdx(['0 1 0.1 0.01 0.0001'], { YUNITS: 'TRANSMITTANCE', LASTX: '3', NPOINTS: '4' }),
    )[0]!;
    expect(Array.from(t.spectrum.absorbance).map((v) => Number(v.toFixed(12)))).toEqual([0, 1, 2, 4]);
    for (const label of ['%T', 'PERCENT TRANSMITTANCE']) {
      const p = readJcampDx(jdx(['0 100 10 1'], { YUNITS: label, LASTX: '2', NPOINTS: '3' }))[0]!;
      expect(Array.from(p.spectrum.absorbance)).toEqual([0, 1, 2]);
      expect(p.source.yUnit).toBe('percent-transmittance');
    }
  });

  it('detects a 0–100 scale under YUNITS=TRANSMITTANCE and warns', () => {
    const [p] = readJcampDx(jdx(['0 100 10 1'], { YUNITS: 'TRANSMITTANCE', LASTX: '2', NPOINTS: '3' }));
    expect(Array.from(p!.spectrum.absorbance)).toEqual([0, 1, 2]);
    expect(p!.warnings.map((w) => w.message).join()).toMatch(/read as percent/);
  });

  it('refuses a unit option it does not know', () => {
    const err = bandshelfErrorOf(() => readJcampDx(jdx(['0 1 2']), { xUnit: 'inch' as 'nm' }));
    expect(err.code).toBe('BAD_OPTION');
    expect(err.field).toBe('xUnit');
  });

  it('reads decadic absorption-coefficient units as absorbance-shaped, keeping the unit text, with a warning', () => {
    // The YUNITS text of gas-phase reference spectra in an open data set (the 28 real files): a decadic
    // absorption coefficient per amount fraction and path length, shaped like absorbance (common practice).
    for (const unit of ['(micromol/mol)-1m-1 (base 10)', 'DECADIC ABSORPTION COEFFICIENT', 'L mol-1 cm-1']) {
      const [p] = readJcampDx(jdx(['0 0.1 0.2 0.3'], { YUNITS: unit, LASTX: '2', NPOINTS: '3' }));
      expect(Array.from(p!.spectrum.absorbance), unit).toEqual([0.1, 0.2, 0.3]);
      expect(p!.source.yUnit).toBe('absorbance');
      expect(p!.meta.yUnitsText).toBe(unit);
      expect(p!.warnings.map((w) => w.message).join(), unit).toMatch(
        /decadic absorption coefficient.*absorbance-shaped/,
      );
    }
  });

  it('asks for the y unit of ARBITRARY UNITS in one line naming the option', () => {
    const err = bandshelfErrorOf(() =>
      readJcampDx(jdx(['0 100 10 1'], { YUNITS: 'ARBITRARY UNITS', LASTX: '2', NPOINTS: '3' }), {
        file: 'a.jdx',
      }),
    );
    expect(err.code).toBe('UNKNOWN_UNIT');
    expect(err.file).toBe('a.jdx');
    expect(err.message).toMatch(/--y-unit absorbance\|transmittance\|percent-transmittance/);
    expect(err.message).not.toContain('\n');
  });

  it('lets options override the units', () => {
    const [p] = readJcampDx(jdx(['0 100 10 1'], { YUNITS: 'ARBITRARY UNITS', LASTX: '2', NPOINTS: '3' }), {
      yUnit: 'percent-transmittance',
    });
    expect(Array.from(p!.spectrum.absorbance)).toEqual([0, 1, 2]);
  });

  it('reads XYPOINTS in pairs, separated by commas, semicolons or spaces', () => {
    const text = jdx(
      ['1000, 0.5; 1010, 0.7', '1030,0.2 1031 0.1'],
      { NPOINTS: '4', FIRSTX: '1000', LASTX: '1031' },
      '##XYPOINTS=(XY..XY)',
    );
    const [p] = readJcampDx(text);
    expect(Array.from(p!.spectrum.wavenumber)).toEqual([1000, 1010, 1030, 1031]);
    expect(Array.from(p!.spectrum.absorbance)).toEqual([0.5, 0.7, 0.2, 0.1]);
  });
});

describe('readJcampDx: metadata', () => {
  it('carries the standard labels into camelCase meta keys', () => {
    const text = jdx(['0 1 2 3 3 2 1 0 -1 -2 -3'], {
      TITLE: 'Serum albumin film (synthetic)',
      ORIGIN: 'Example Lab',
      OWNER: 'public domain',
      RESOLUTION: '4',
      STATE: 'solid',
      'SAMPLING PROCEDURE': 'ATR, diamond',
      'CAS REGISTRY NO': '7732-18-5',
      MOLFORM: 'H2 O',
      'CAS NAME': 'water',
      NAMES: 'water\ndihydrogen oxide',
    });
    const [p] = readJcampDx(text);
    expect(p!.meta).toMatchObject({
      title: 'Serum albumin film (synthetic)',
      origin: 'Example Lab',
      owner: 'public domain',
      resolution: 4,
      state: 'solid',
      samplingProcedure: 'ATR, diamond',
      cas: '7732-18-5',
      formula: 'H2 O',
      casName: 'water',
      names: 'water; dihydrogen oxide',
      jcampVersion: '4.24',
    });
  });

  it('compares label names without case, spaces, -, _ or /', () => {
    const text = jdx(['0 1 2 3 3 2 1 0 -1 -2 -3'], {
      sampling_procedure: 'KBr pellet',
      'Cas Registry-No': '64-17-5',
    });
    expect(readJcampDx(text)[0]!.meta).toMatchObject({ samplingProcedure: 'KBr pellet', cas: '64-17-5' });
  });
});

describe('readJcampDx: real files bend the rules (read and warn)', () => {
  it('ignores $$ comments after labels and after data', () => {
    const text = jdx(['0 1 2 3 3 2 1 0 -1 -2 -3 $$ checked by hand'], {
      TITLE: 'commented $$ not part of it',
    }).replace(
      '##YUNITS=ABSORBANCE',
      // A function, because a replacement string would read `$$` as an escaped `$`.
      () => '##YUNITS=ABSORBANCE $$ as recorded\n##$$ a whole comment line',
    );
    const [p] = readJcampDx(text);
    expect(Array.from(p!.spectrum.absorbance)).toEqual(TEN);
    expect(p!.meta.title).toBe('commented');
    expect(p!.warnings).toEqual([]);
  });

  it('skips ? ordinates but keeps the abscissae of the rest, with a warning naming the line', () => {
    const [p] = readJcampDx(jdx(['0 1 ? 3 3 2', '5 1 0 -1 ? -3']), { file: 'gaps.jdx' });
    expect(Array.from(p!.spectrum.wavenumber)).toEqual([0, 2, 3, 4, 5, 6, 7, 9]);
    expect(Array.from(p!.spectrum.absorbance)).toEqual([1, 3, 3, 2, 1, 0, -1, -3]);
    const w = p!.warnings.find((x) => /missing/.test(x.message));
    expect(w?.line).toBe(12);
    expect(w?.message).toMatch(/2 missing ordinates \(\?\) skipped, on lines 12, 13/);
  });

  it('reads a literal NaN or NA on an AFFN line as a missing ordinate, never as compressed digits', () => {
    // N, a and A are also ASDF pseudo-digits (JCAMP-DX 4.24, McDonald & Wilks 1988): "NaN" would decode as
    // DIF +5, SQZ −1, DIF +5 and shift every later abscissa. Standing alone on a plain line it is a missing value.
    const [p] = readJcampDx(jdx(['0 1 NaN 3 3 2', '5 1 0 -1 nan -3']), { file: 'nan.jdx' });
    expect(Array.from(p!.spectrum.wavenumber)).toEqual([0, 2, 3, 4, 5, 6, 7, 9]);
    expect(Array.from(p!.spectrum.absorbance)).toEqual([1, 3, 3, 2, 1, 0, -1, -3]);
    const w = p!.warnings.find((x) => /written as a word/.test(x.message));
    expect(w?.line).toBe(12);
    expect(w?.message).toMatch(/2 ordinates written as a word \("NaN"\) read as missing/);
    const [q] = readJcampDx(jdx(['0 1 2 3 3 2', '5 1 0 -1 NA -3']), { file: 'na.jdx' });
    expect(q!.spectrum.wavenumber.length).toBe(9);
  });

  it('refuses inf or Infinity ordinates with NOT_FINITE and the line', () => {
    for (const word of ['inf', 'Infinity', '-Infinity']) {
      const e = bandshelfErrorOf(() =>
        readJcampDx(jdx(['0 1 2 3 3 2', `5 1 ${word} -1 -2 -3`]), { file: 'i.jdx' }),
      );
      expect(e.code, word).toMatch(/NOT_FINITE|NOT_NUMERIC/);
      expect(e.line, word).toBe(13);
    }
  });

  it('still decodes a compressed line that happens to hold the letters N and a', () => {
    // SQZ/DIF with no separators: A = +1, N = DIF +5, a = −1 (JCAMP-DX 4.24 pseudo-digit table).
    const [p] = readJcampDx(jdx(['0 ANaN'], { LASTX: '3', NPOINTS: '4' }), { file: 'sqz.jdx' });
    expect(Array.from(p!.spectrum.absorbance)).toEqual([1, 6, -1, 4]);
  });

  it('refuses a stray repeat count that decodes far beyond NPOINTS, with the line', () => {
    // DUP S9999 makes a value occur 19,999 times (S = 1, JCAMP-DX 4.24 pseudo-digits): 50 such lines are ~10⁶
    // points from 600 bytes. NPOINTS=10 says the file meant ten.
    const e = bandshelfErrorOf(() =>
      readJcampDx(jdx(Array.from({ length: 50 }, (_, i) => `${i} A1S9999`)), { file: 'dup.jdx' }),
    );
    expect(e.code).toBe('BAD_FORMAT');
    expect(e.message).toMatch(/NPOINTS=10 \(a stray repeat count\?\)/);
    expect(e.line).toBe(12);
  });

  it('refuses a repeat count that expands a tiny body past its byte allowance, without NPOINTS or despite it', () => {
    // DUP pseudo-digits S–Z, s are 1–9 (JCAMP-DX 4.24), so `A1S9999` is the value 11 occurring 19,999 times: 50
    // such lines are ~10⁶ points from ~600 bytes. With no NPOINTS to compare, and with an NPOINTS that vouches for
    // them, the body may only hold 65,536 + 16 points per byte (~75,000 here).
    const lines = Array.from({ length: 50 }, (_, i) => `${i} A1S9999`);
    for (const labels of [
      { NPOINTS: '-', LASTX: '-' },
      { NPOINTS: '999950', LASTX: '999949' },
    ]) {
      const e = bandshelfErrorOf(() => readJcampDx(jdx(lines, labels), { file: 'dup.jdx' }));
      expect(e.code).toBe('BAD_FORMAT');
      expect(e.file).toBe('dup.jdx');
      expect(e.message).toMatch(/from \d+ bytes, more than 65536 \+ 16 per byte \(a stray repeat count\?\)/);
      // The fourth data line passes 75,000 points: line 13 without NPOINTS and LASTX, line 15 with them.
      expect(e.line).toBe(labels.NPOINTS === '-' ? 13 : 15);
    }
  });

  it('still reads a long constant run within the allowance (59,997 points of one value)', () => {
    // Three lines of `A1S9999`: the value 11 occurring 19,999 times per line (JCAMP-DX 4.24 DUP).
    const lines = Array.from({ length: 3 }, (_, i) => `${i * 19_999} A1S9999`);
    const [p] = readJcampDx(jdx(lines, { NPOINTS: '59997', LASTX: '59996' }), { file: 'flat.jdx' });
    expect(p!.spectrum.absorbance).toHaveLength(59_997);
    expect(p!.spectrum.absorbance.every((v) => v === 11)).toBe(true);
  });

  it('uses the data when NPOINTS disagrees, taking the spacing from the data lines', () => {
    // The header promises 20 points to 19 cm⁻¹ but the file was cut after 10: x must still step by 1.
    const [p] = readJcampDx(jdx(['0 1 2 3 3 2', '5 1 0 -1 -2 -3'], { NPOINTS: '20', LASTX: '19' }));
    expect(Array.from(p!.spectrum.wavenumber)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9]);
    expect(p!.warnings.map((w) => w.message).join('\n')).toMatch(/NPOINTS=20 but the data hold 10 points/);
  });

  it('warns when FIRSTY disagrees with the first ordinate and keeps the data', () => {
    const [p] = readJcampDx(jdx(['0 1 2 3 3 2 1 0 -1 -2 -3'], { FIRSTY: '7' }));
    expect(p!.spectrum.absorbance[0]).toBe(1);
    expect(p!.warnings.map((w) => w.message).join()).toMatch(/FIRSTY=7 but the first ordinate is 1/);
  });

  it('warns when a line’s X disagrees with FIRSTX + i·ΔX', () => {
    const [p] = readJcampDx(jdx(['0 1 2 3 3 2', '8 1 0 -1 -2 -3']));
    const w = p!.warnings.find((x) => /line's x/.test(x.message));
    expect(w?.line).toBe(13);
    expect(w?.message).toMatch(/x is 8 where FIRSTX and the spacing put 5/);
  });

  it('uses the x written on each line when every line holds one point and x is uneven', () => {
    // One (X, Y) per line, unevenly spaced (as text/manarom_transmittance.txt in ../shared/real-spectra).
    const text = [
      '##TITLE=t',
      '##JCAMP-DX=4.24',
      '##XUNITS=1/CM',
      '##YUNITS=ABSORBANCE',
      '##XYDATA=(X++(Y..Y))',
      '1000 0.1',
      '1001 0.2',
      '1002 0.3',
      '1010 0.4',
      '1011 0.5',
      '##END=',
    ].join('\n');
    const [p] = readJcampDx(text);
    expect(Array.from(p!.spectrum.wavenumber)).toEqual([1000, 1001, 1002, 1010, 1011]);
  });

  it('reads JCAMP-DX 5.01 headers, CRLF line endings and a missing ##END', () => {
    const text = [
      '##TITLE=five-oh-one',
      '##JCAMP-DX=5.01',
      '##DATA TYPE=INFRARED SPECTRUM',
      '##BLOCK_ID=1',
      '##$INSTRUMENT SERIAL=XYZ',
      '##.DIGITISER RES=16',
      '##XUNITS=1/CM',
      '##YUNITS=ABSORBANCE',
      '##FIRSTX=0',
      '##LASTX=9',
      '##NPOINTS=10',
      '##XYDATA=(X++(Y..Y))',
      '0 1JT%jX',
    ].join('\r\n');
    const [p] = readJcampDx(text);
    expect(Array.from(p!.spectrum.absorbance)).toEqual(TEN);
    expect(p!.meta.jcampVersion).toBe('5.01');
    expect(p!.warnings.map((w) => w.message)).toEqual(['the file ends without ##END=']);
  });

  it('reads a compound file: a LINK block around spectra, skipping a peak table with a warning', () => {
    const block = (title: string, line: string): string =>
      jdx([line], { TITLE: title, ORIGIN: '-', 'JCAMP-DX': '-' });
    const text = [
      '##TITLE=collection',
      '##JCAMP-DX=5.01',
      '##DATA TYPE=LINK',
      '##BLOCKS=3',
      '##ORIGIN=Shared Lab',
      block('first', '0 1JT%jX'),
      '##TITLE=peaks',
      '##DATA TYPE=INFRARED PEAK TABLE',
      '##PEAK TABLE=(XY..XY)',
      '1650, 0.9; 1550, 0.6',
      '##END=',
      block('second', '0 1 1 1 1 1 1 1 1 1 1'),
      '##END=',
    ].join('\n');
    const all = readJcampDx(text, { file: 'set.jdx' });
    expect(all.map((p) => p.meta.title)).toEqual(['first', 'second']);
    expect(all.map((p) => p.source.block)).toEqual([1, 2]);
    expect(all[1]!.meta.origin).toBe('Shared Lab');
    expect(all[0]!.warnings.map((w) => w.message)).toContain(
      'a peak table is not a spectrum; that block was skipped',
    );
    const only = readJcampDx(text, { block: 2 });
    expect(only).toHaveLength(1);
    expect(only[0]!.meta.title).toBe('second');
    expect(only[0]!.source.block).toBe(2);
    const err = bandshelfErrorOf(() => readJcampDx(text, { file: 'set.jdx', block: 3 }));
    expect(err.code).toBe('BAD_OPTION');
    expect(err.message).toMatch(/holds 2 spectra/);
  });
});

describe('readJcampDx: bad input is a typed error naming file and line', () => {
  const cases: [string, string, string, number | undefined][] = [
    ['a peak table alone', '##TITLE=p\n##PEAK TABLE=(XY..XY)\n1650, 0.9\n##END=', 'NOT_A_SPECTRUM', 2],
    ['no data at all', '##TITLE=p\n##XUNITS=1/CM\n##END=', 'NOT_A_SPECTRUM', undefined],
    ['an unknown XUNITS', jdx(['0 1 2'], { XUNITS: 'HZ', LASTX: '1', NPOINTS: '2' }), 'UNKNOWN_UNIT', 4],
    [
      'an unknown YUNITS',
      jdx(['0 1 2'], { YUNITS: 'KUBELKA-MUNK', LASTX: '1', NPOINTS: '2' }),
      'UNKNOWN_UNIT',
      5,
    ],
    ['a non-numeric FIRSTX', jdx(['0 1 2'], { FIRSTX: 'four', LASTX: '1', NPOINTS: '2' }), 'NOT_NUMERIC', 8],
    ['a stray character in the data', jdx(['0 1 2 3 3 2 1 0 -1 -2 #3']), 'NOT_NUMERIC', 12],
    ['a number beyond double range', jdx(['0 1 2 3 3 2 1 0 -1 -2 1e400']), 'NOT_FINITE', 12],
    ['a DUP with nothing before it', jdx(['0 S']), 'BAD_FORMAT', 12],
    ['a DIF before any value', jdx(['0 J']), 'BAD_FORMAT', 12],
    ['a single point', jdx(['0 5'], { LASTX: '0', NPOINTS: '1' }), 'TOO_FEW_POINTS', 12],
    ['an XYDATA without lines', jdx([]), 'EMPTY_FILE', 11],
    [
      'XYPOINTS that zig-zag',
      jdx(['1000, 1', '1004, 2', '1002, 3', '1006, 1', '1001, 2'], { NPOINTS: '5' }, '##XYPOINTS=(XY..XY)'),
      'NOT_MONOTONIC',
      14,
    ],
    ['an unsupported variable list', jdx(['0 1 2'], {}, '##XYDATA=(X++(I..I))'), 'BAD_FORMAT', 11],
    ['YFACTOR of zero', jdx(['0 1 2'], { YFACTOR: '0' }), 'BAD_FORMAT', 7],
    ['an empty text', '  \n', 'EMPTY_FILE', undefined],
  ];
  for (const [what, text, code, line] of cases) {
    it(`${what} → ${code}`, () => {
      const err = bandshelfErrorOf(() => readJcampDx(text, { file: 'bad.jdx' }));
      expect(err.code).toBe(code);
      expect(err.file).toBe('bad.jdx');
      expect(err.line).toBe(line);
      expect(err.oneLine()).toMatch(/^bad\.jdx/);
    });
  }

  it('names the label of an unknown unit', () => {
    const err = bandshelfErrorOf(() => readJcampDx(jdx(['0 1 2'], { XUNITS: 'HZ' }), { file: 'u.jdx' }));
    expect(err.field).toBe('XUNITS');
    expect(err.oneLine()).toBe(
      'u.jdx:4: XUNITS: ##XUNITS=HZ is not a unit bandshelf reads (1/CM, MICROMETERS, NANOMETERS); give the x unit as an option [UNKNOWN_UNIT]',
    );
  });

  it('says a peak table is not a spectrum', () => {
    const err = bandshelfErrorOf(() => readJcampDx('##TITLE=p\n##PEAK TABLE=(XY..XY)\n1650, 0.9\n##END='));
    expect(err.message).toBe('a peak table is not a spectrum');
  });
});

// The delimited-text reader: delimiters, decimal commas, unit headers and ranges, and one typed error per defect.
import { describe, expect, it } from 'vitest';
import { type ReadDelimitedOptions, readDelimited } from '../../src/formats/readDelimited.js';
import type { ParsedSpectrum } from '../../src/formats/types.js';
import { bandshelfErrorOf } from '../bandshelfErrorOf.js';

/** The one spectrum of a file with one y column. */
function one(text: string, options: ReadDelimitedOptions = {}): ParsedSpectrum {
  const all = readDelimited(text, options);
  expect(all).toHaveLength(1);
  return all[0]!;
}

const xs = (text: string, options = {}): number[] => Array.from(one(text, options).spectrum.wavenumber);
const ys = (text: string, options = {}): number[] => Array.from(one(text, options).spectrum.absorbance);

describe('readDelimited: delimiters and number forms', () => {
  it('reads comma-separated text with a unit header and no warnings', () => {
    const p = one('wavenumber_cm-1,absorbance\n1000,0.5\n1002,0.25\n1004,-0.125\n');
    expect(Array.from(p.spectrum.wavenumber)).toEqual([1000, 1002, 1004]);
    expect(Array.from(p.spectrum.absorbance)).toEqual([0.5, 0.25, -0.125]);
    expect(p.source).toEqual({ format: 'delimited', xUnit: 'cm-1', yUnit: 'absorbance' });
    expect(p.warnings).toEqual([]);
  });

  it('reads semicolons and tabs with decimal commas, and whitespace with either', () => {
    const header = 'wavenumber (cm-1)\tabsorbance\n';
    expect(ys('cm-1;absorbance\n1000,5;0,25\n1001,5;0,5')).toEqual([0.25, 0.5]);
    expect(xs('cm-1;absorbance\n1000,5;0,25\n1001,5;0,5')).toEqual([1000.5, 1001.5]);
    expect(ys(`${header}1000\t0,25\n1001\t0,5`)).toEqual([0.25, 0.5]);
    expect(ys('cm-1 absorbance\n1000   0.25\n1001 \t 0.5')).toEqual([0.25, 0.5]);
    expect(ys('cm-1 absorbance\n1000,5 0,25\n1001,5 0,5')).toEqual([0.25, 0.5]);
    expect(ys('cm-1,absorbance\n"1000","2.5e-3"\n"1001","1E-2"')).toEqual([0.0025, 0.01]);
  });

  it('skips # comment lines and blank lines, and accepts CRLF and a trailing delimiter', () => {
    const text =
      '# synthetic example\r\n\r\nwavenumber_cm-1,absorbance\r\n# a note in the middle\r\n1000,1,\r\n1001,2,\r\n';
    expect(ys(text)).toEqual([1, 2]);
  });

  it('returns descending x ascending', () => {
    expect(xs('cm-1,A\n4000,1\n3998,2\n3996,3')).toEqual([3996, 3998, 4000]);
    expect(ys('cm-1,A\n4000,1\n3998,2\n3996,3')).toEqual([3, 2, 1]);
  });

  it('leaves a column headed as an uncertainty out, with a warning, and reads it when it is named', () => {
    const p = one('cm-1,A,sd\n1000,1,0.1\n1001,2,0.1');
    expect(Array.from(p.spectrum.absorbance)).toEqual([1, 2]);
    expect(p.warnings[0]?.message).toMatch(/"sd" looks like an uncertainty/);
    expect(
      Array.from(one('cm-1,A,sd\n1000,1,0.1\n1001,2,0.2', { column: 'SD' }).spectrum.absorbance),
    ).toEqual([0.1, 0.2]);
  });
});

describe('readDelimited: units', () => {
  it('converts a header wavelength_um,%T to cm⁻¹ and absorbance', () => {
    // common practice: 10 µm = 1000 cm⁻¹, 2.5 µm = 4000 cm⁻¹; A = 2 − log10(%T), so 1 %T is 2 and 100 %T is 0.
    const p = one('wavelength_um,%T\n2.5,100\n10,1\n');
    expect(Array.from(p.spectrum.wavenumber)).toEqual([1000, 4000]);
    expect(Array.from(p.spectrum.absorbance)).toEqual([2, 0]);
    expect(p.source).toMatchObject({ xUnit: 'um', yUnit: 'percent-transmittance' });
    expect(p.warnings).toEqual([]);
  });

  it('reads a header naming nm, and transmittance fractions', () => {
    const p = one('nm,transmittance\n2500,0.1\n10000,0.0001\n');
    expect(Array.from(p.spectrum.wavenumber)).toEqual([1000, 4000]);
    // common practice: a 10,000-fold attenuation is 4 absorbance units.
    expect(p.spectrum.absorbance[0]).toBeCloseTo(4, 12);
    expect(p.spectrum.absorbance[1]).toBeCloseTo(1, 12);
  });

  it('does not take `wavenumber` for µm: the unit must stand as a word', () => {
    expect(one('wavenumber,absorbance\n5,1\n20,2').source.xUnit).toBe('cm-1');
  });

  it('reads a headerless x in 2–25 as µm, with a warning', () => {
    const p = one('2.5,0.1\n5,0.2\n10,0.3\n');
    expect(p.source.xUnit).toBe('um');
    expect(Array.from(p.spectrum.wavenumber)).toEqual([1000, 2000, 4000]);
    expect(p.warnings.map((w) => w.message).join('\n')).toMatch(/read as wavelength in µm/);
  });

  it('assumes absorbance without a y unit, and says when the values look like %T', () => {
    const p = one('1000,80\n1002,45\n1004,92\n');
    expect(p.source.yUnit).toBe('absorbance');
    expect(Array.from(p.spectrum.absorbance)).toEqual([80, 45, 92]);
    expect(p.warnings.map((w) => w.message).join('\n')).toMatch(/look like %T/);
  });

  it('reads a transmittance header on a 0–100 scale as percent, with a warning', () => {
    const p = one('cm-1,transmittance\n1000,100\n1002,10\n');
    expect(Array.from(p.spectrum.absorbance)).toEqual([0, 1]);
    expect(p.warnings[0]?.message).toMatch(/read as percent/);
  });

  it('lets xUnit and yUnit override header and range', () => {
    const p = one('x,y\n2500,50\n5000,10\n', { xUnit: 'nm', yUnit: 'percent-transmittance' });
    expect(Array.from(p.spectrum.wavenumber)).toEqual([2000, 4000]);
    expect(p.spectrum.absorbance[0]).toBeCloseTo(1, 12);
    expect(p.spectrum.absorbance[1]).toBeCloseTo(2 - Math.log10(50), 12);
    expect(p.warnings).toEqual([]);
  });
});

describe('readDelimited: points', () => {
  it('merges repeated identical points with a warning', () => {
    const p = one('cm-1,A\n1000,1\n1001,2\n1001,2\n1002,3');
    expect(Array.from(p.spectrum.wavenumber)).toEqual([1000, 1001, 1002]);
    expect(p.warnings[0]).toEqual({ line: 4, message: '1 repeated point (same x, same y) merged' });
  });

  it('sorts two sweeps joined in one file, with a warning', () => {
    const p = one('cm-1,A\n1000,1\n1002,2\n1004,3\n1003,4\n1001,5');
    expect(Array.from(p.spectrum.wavenumber)).toEqual([1000, 1001, 1002, 1003, 1004]);
    expect(Array.from(p.spectrum.absorbance)).toEqual([1, 5, 2, 4, 3]);
    expect(p.warnings[0]?.message).toMatch(/changes direction once/);
  });
});

describe('readDelimited: bad input is a typed error naming file and line', () => {
  const cases: [string, string, string, number | undefined][] = [
    ['an empty text', '', 'EMPTY_FILE', undefined],
    ['a header alone', 'wavenumber,absorbance\n', 'EMPTY_FILE', 1],
    ['only words', 'hello there\nnothing to see\n', 'NOT_NUMERIC', 2],
    ['a single point', 'cm-1,A\n1000,1\n', 'TOO_FEW_POINTS', 2],
    ['a non-numeric cell', 'cm-1,A\n1000,1\n1001,abc\n1002,3', 'NOT_NUMERIC', 3],
    ['a row with one value', 'cm-1,A\n1000,1\n1001\n1002,3', 'NOT_NUMERIC', 3],
    ['NaN', 'cm-1,A\n1000,1\n1001,NaN\n1002,3', 'NOT_FINITE', 3],
    ['Infinity', 'cm-1,A\n1000,1\n1001,-Infinity\n', 'NOT_FINITE', 3],
    ['an overflowing number', 'cm-1,A\n1000,1\n1001,1e400\n', 'NOT_FINITE', 3],
    ['a zig-zag x', 'cm-1,A\n1000,1\n1002,2\n1001,3\n1003,4\n1000.5,5\n', 'NOT_MONOTONIC', 4],
    ['a negative wavelength', 'um,A\n-3,1\n5,2\n', 'NOT_FINITE', 2],
    ['a negative wavenumber', 'cm-1,A\n1000,1\n-1000,2\n', 'NOT_A_SPECTRUM', 3],
    ['an x header in Hz', 'frequency_hz,absorbance\n1000,1\n1002,2\n', 'UNKNOWN_UNIT', 1],
    ['an x header naming a delay', 'delay (fs),absorbance\n1000,1\n1002,2\n', 'UNKNOWN_UNIT', 1],
    ['an x header in eV', 'energy_eV;absorbance\n0,1;1\n0,2;2\n', 'UNKNOWN_UNIT', 1],
    ['a y header of reflectance', 'wavenumber_cm-1,reflectance\n1000,0.1\n1002,0.2\n', 'UNKNOWN_UNIT', 1],
    ['a y header of %R', 'cm-1,%R\n1000,50\n1002,60\n', 'UNKNOWN_UNIT', 1],
    ['a y header of raw counts', 'cm-1\tcounts\n1000\t5123\n1002\t5230\n', 'UNKNOWN_UNIT', 1],
  ];
  for (const [what, text, code, line] of cases) {
    it(`${what} → ${code}`, () => {
      const err = bandshelfErrorOf(() => one(text, { file: 'bad.csv' }));
      expect(err.code).toBe(code);
      expect(err.file).toBe('bad.csv');
      expect(err.line).toBe(line);
    });
  }

  it('words the error as one line with file, line and the cell', () => {
    const err = bandshelfErrorOf(() => one('cm-1,A\n1000,1\n1001,1.2.3\n', { file: 's.csv' }));
    expect(err.oneLine()).toBe('s.csv:3: y: y = "1.2.3" is not a number [NOT_NUMERIC]');
  });

  it('names the column and what it holds when a header names a unit bandshelf cannot convert', () => {
    const err = bandshelfErrorOf(() => one('time_ps,absorbance\n1,0.1\n2,0.2\n', { file: 't.csv' }));
    expect(err.oneLine()).toMatch(/^t\.csv:1: x: the x column "time_ps" is a time .*\[UNKNOWN_UNIT\]$/);
    // Giving the unit overrides the header, as with every other unit question.
    const forced = one('frequency_hz,counts\n1000,1\n1002,2\n', {
      xUnit: 'cm-1',
      yUnit: 'absorbance',
    });
    expect(Array.from(forced.spectrum.wavenumber)).toEqual([1000, 1002]);
  });

  it('does not take words that merely contain a unit letter for a unit', () => {
    // "s" in "wavenumbers" and "r" in "absorbance" are not the units s and R.
    const p = one('Wavenumbers,Absorbance units\n1000,1\n1002,2\n');
    expect(p.source).toMatchObject({ xUnit: 'cm-1', yUnit: 'absorbance' });
    expect(one('x,y\n1000,1\n1002,2\n').source.xUnit).toBe('cm-1');
  });

  it('refuses a unit option it does not know', () => {
    const err = bandshelfErrorOf(() => one('1000,1\n1001,2', { xUnit: 'furlong' as 'nm' }));
    expect(err.code).toBe('BAD_OPTION');
  });
});

describe('readDelimited: saturated transmittance', () => {
  it('clips T ≤ 0 to the absorbance ceiling (A = 4), marks the points saturated and warns with their range', () => {
    // A = −log10(T) (common practice); %T 50 → A = 2 − log10 50 ≈ 0.30103.
    const p = one('cm-1,%T\n1000,50\n1001,0\n1002,-0.3\n1003,40\n', { file: 's.csv' });
    expect(Array.from(p.spectrum.absorbance.slice(1, 3))).toEqual([4, 4]);
    expect(p.spectrum.absorbance[0]).toBeCloseTo(0.30103, 5);
    expect(Array.from(p.saturated!)).toEqual([0, 1, 1, 0]);
    expect(p.warnings.map((w) => w.message).join()).toMatch(
      /2 points at or beyond the absorbance ceiling 4.*1001–1002 cm⁻¹/,
    );
  });

  it('refuses values that fit neither a fraction nor a percentage, suggesting a single-beam spectrum', () => {
    const error = bandshelfErrorOf(() => one('cm-1,T\n1000,20000\n1001,28000000\n', { file: 's.csv' }));
    expect(error.code).toBe('NOT_A_SPECTRUM');
    expect(error.message).toMatch(/single-beam/);
  });
});

describe('readDelimited: a terahertz axis', () => {
  it('reads a frequency_THz header as THz and converts to cm⁻¹', () => {
    // common practice: ν̃ = f / c, 1 THz = 10¹² s⁻¹ / 29 979 245 800 cm s⁻¹ = 33.356 409 5 cm⁻¹.
    const p = one('frequency_THz,absorbance\n30,0.1\n60,0.2\n');
    expect(p.source.xUnit).toBe('thz');
    expect(p.spectrum.wavenumber[0]).toBeCloseTo(1000.692285, 5);
    expect(p.spectrum.wavenumber[1]).toBeCloseTo(2001.38457, 4);
    expect(p.warnings).toEqual([]);
  });
});

describe('readDelimited: one x column and several y columns', () => {
  // A spreadsheet export of a small study (invented values): semicolons, decimal commas, one empty cell.
  const study =
    'wavenumber_cm-1;serum_a;serum_b;Serum C\n1000;0,10;0,20;\n1002;0,30;0,40;0,5\n1004;0,50;0,60;0,7\n';

  it('reads each y column as a spectrum named by its header, leaving empty cells out of their column', () => {
    const all = readDelimited(study, { file: 'study.csv' });
    expect(all.map((p) => p.source.column)).toEqual(['serum_a', 'serum_b', 'Serum C']);
    expect(all.map((p) => Array.from(p.spectrum.absorbance))).toEqual([
      [0.1, 0.3, 0.5],
      [0.2, 0.4, 0.6],
      [0.5, 0.7],
    ]);
    expect(Array.from(all[2]!.spectrum.wavenumber)).toEqual([1002, 1004]);
    expect(all[2]!.warnings.map((w) => w.message).join('\n')).toMatch(
      /"Serum C" has 1 empty cell; those rows were left out/,
    );
    expect(all[0]!.warnings.some((w) => /empty cells|first two/.test(w.message))).toBe(false);
  });

  it('picks one column by header name (any case) or by its number among the y columns', () => {
    const byName = readDelimited(study, { column: 'SERUM_B' });
    expect(byName).toHaveLength(1);
    expect(Array.from(byName[0]!.spectrum.absorbance)).toEqual([0.2, 0.4, 0.6]);
    expect(readDelimited(study, { column: 3 })[0]!.source.column).toBe('Serum C');
    const error = bandshelfErrorOf(() => readDelimited(study, { file: 'study.csv', column: 'plasma' }));
    expect(error.code).toBe('BAD_OPTION');
    expect(error.oneLine()).toMatch(
      /^study\.csv: column: column "plasma" is not a y column of the file \(it has 1 "serum_a", 2 "serum_b", 3 "Serum C"\)/,
    );
    expect(bandshelfErrorOf(() => readDelimited(study, { column: 4 })).code).toBe('BAD_OPTION');
  });

  it('reads each column in its own unit, and names header-less columns by number', () => {
    // common practice: A = 2 − log10(%T), so 10 %T is absorbance 1 and 100 %T is 0.
    const mixed = readDelimited('cm-1,%T sample,absorbance blank\n1000,10,0.5\n1002,100,0.25\n');
    expect(mixed.map((p) => p.source.yUnit)).toEqual(['percent-transmittance', 'absorbance']);
    expect(Array.from(mixed[0]!.spectrum.absorbance)).toEqual([1, 0]);
    expect(Array.from(mixed[1]!.spectrum.absorbance)).toEqual([0.5, 0.25]);
    const bare = readDelimited('1000\t0.1\t0.2\n1002\t0.3\t0.4\n');
    expect(bare.map((p) => p.source.column)).toEqual(['y1', 'y2']);
  });

  it('keeps a one-column file as it was: no column name', () => {
    expect(readDelimited('cm-1,A\n1000,1\n1002,2\n')[0]!.source).toEqual({
      format: 'delimited',
      xUnit: 'cm-1',
      yUnit: 'absorbance',
    });
  });
});

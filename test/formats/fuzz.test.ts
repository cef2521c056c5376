// Property-based fuzzing of every reader: random and mutated inputs may only ever raise a BandshelfError.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { readDelimited } from '../../src/formats/readDelimited.js';
import { readJcampDx } from '../../src/formats/readJcampDx.js';
import { readSpectrumFile } from '../../src/formats/readSpectrumFile.js';
import type { ParsedSpectrum } from '../../src/formats/types.js';
import { writeCsv } from '../../src/formats/writeCsv.js';
import { type JcampForm, writeJcampDx } from '../../src/formats/writeJcampDx.js';
import { mulberry32 } from '../mulberry32.js';

const RUNS = { seed: 42, numRuns: 300 };

/** A parse either fails with the typed error naming the file, or yields spectra that meet the contract. */
function expectTypedOutcome(read: () => ParsedSpectrum[] | ParsedSpectrum): void {
  let out: ParsedSpectrum[];
  try {
    const result = read();
    out = Array.isArray(result) ? result : [result];
  } catch (e) {
    if (!(e instanceof BandshelfError)) throw e;
    expect(e.file).toBe('fuzz.dat');
    expect(e.oneLine()).not.toMatch(/\n/);
    return;
  }
  expect(out.length).toBeGreaterThan(0);
  for (const p of out) {
    const { wavenumber: x, absorbance: y } = p.spectrum;
    expect(x.length).toBe(y.length);
    expect(x.length).toBeGreaterThanOrEqual(2);
    for (let i = 0; i < x.length; i++) {
      if (!Number.isFinite(x[i]!) || !Number.isFinite(y[i]!)) throw new Error(`non-finite point ${i}`);
      if (i > 0 && !(x[i]! > x[i - 1]!)) throw new Error(`x not strictly ascending at ${i}`);
      if (x[i]! < 0) throw new Error(`negative wavenumber ${x[i]} at ${i}`);
    }
  }
}

function sampleSpectrum(n: number, seed: number): { wavenumber: Float64Array; absorbance: Float64Array } {
  const random = mulberry32(seed);
  const wavenumber = Float64Array.from({ length: n }, (_, i) => 1000 + 4 * i);
  const absorbance = Float64Array.from(
    { length: n },
    (_, i) => 0.4 * Math.exp(-0.5 * ((i - n / 2) / 8) ** 2) + 0.01 * random(),
  );
  return { wavenumber, absorbance };
}

const spectrum = sampleSpectrum(120, 1);
const VALID: string[] = [
  ...(['affn', 'pac', 'sqz', 'dif', 'difdup'] as JcampForm[]).map((form) =>
    writeJcampDx(spectrum, { form, title: `fuzz ${form}`, meta: { origin: 'synthetic', cas: '7732-18-5' } }),
  ),
  writeJcampDx(
    {
      wavenumber: Float64Array.from([1000, 1001.5, 1004, 1010]),
      absorbance: Float64Array.from([1, 2, 3, 4]),
    },
    { title: 'points' },
  ),
  writeCsv(spectrum),
  writeCsv(spectrum).replace(/,/g, ';').replace(/\./g, ','),
  '# synthetic\nwavelength_um\t%T\n2.5\t90\n5\t45,5\n10\t12\n',
];

const HUGE = ['1e308', '1e400', '-1e400', '1e-400', 'NaN', 'Infinity', '9'.repeat(400), '-0', '?'];

const encoder = new TextEncoder();

/** One mutation of a valid file, returned as bytes. */
const mutated: fc.Arbitrary<Uint8Array> = fc
  .tuple(
    fc.constantFrom(...VALID),
    fc.nat(7),
    fc.array(fc.nat(), { minLength: 1, maxLength: 8 }),
    fc.constantFrom(...HUGE),
  )
  .map(([text, kind, picks, huge]) => {
    const bytes = encoder.encode(text);
    const pick = (k: number): number => picks[k % picks.length]!;
    switch (kind) {
      case 0: // truncate
        return bytes.slice(0, pick(0) % (bytes.length + 1));
      case 1: {
        // flip bits
        const out = bytes.slice();
        for (const p of picks) out[p % out.length]! ^= 1 << (p % 8);
        return out;
      }
      case 2: {
        // shuffle lines
        const lines = text.split('\n');
        for (let i = lines.length - 1; i > 0; i--) {
          const j = pick(i) % (i + 1);
          [lines[i], lines[j]] = [lines[j]!, lines[i]!];
        }
        return encoder.encode(lines.join('\n'));
      }
      case 3: {
        // replace one number by a huge, tiny or non-finite one
        const numbers = [...text.matchAll(/-?\d+(\.\d+)?/g)];
        const m = numbers[pick(0) % numbers.length]!;
        return encoder.encode(text.slice(0, m.index) + huge + text.slice(m.index + m[0].length));
      }
      case 4: {
        // delete a line
        const lines = text.split('\n');
        lines.splice(pick(0) % lines.length, 1);
        return encoder.encode(lines.join('\n'));
      }
      case 5: {
        // duplicate a line somewhere else
        const lines = text.split('\n');
        lines.splice(pick(1) % lines.length, 0, lines[pick(0) % lines.length]!);
        return encoder.encode(lines.join('\n'));
      }
      case 6: {
        // overwrite a run of bytes with arbitrary values
        const out = bytes.slice();
        const at = pick(0) % out.length;
        for (let k = 0; k < picks.length; k++) out[(at + k) % out.length] = picks[k]! % 256;
        return out;
      }
      default: {
        // splice a label or pseudo-digits into the middle of a line
        const insert = ['##XYDATA=(X++(Y..Y))\n', '##END=\n', '##TITLE=x\n', 'S99999', 'j?%', '$$', '\r'][
          pick(0) % 7
        ]!;
        const at = pick(1) % (text.length + 1);
        return encoder.encode(text.slice(0, at) + insert + text.slice(at));
      }
    }
  });

/** Strings built from the readers' own alphabet, so random input reaches deep into the parsers. */
const tokenSoup = fc
  .array(
    fc.constantFrom(
      '##TITLE=t\n',
      '##XYDATA=(X++(Y..Y))\n',
      '##XYPOINTS=(XY..XY)\n',
      '##PEAK TABLE=(XY..XY)\n',
      '##XUNITS=1/CM\n',
      '##XUNITS=MICROMETERS\n',
      '##YUNITS=TRANSMITTANCE\n',
      '##YUNITS=%T\n',
      '##FIRSTX=0\n',
      '##LASTX=9\n',
      '##NPOINTS=10\n',
      '##YFACTOR=1E-9\n',
      '##XFACTOR=1e300\n',
      '##DATA TYPE=LINK\n',
      '##END=\n',
      '0 ',
      '1',
      '-',
      '+',
      '.',
      'E',
      'e5',
      '@',
      'A',
      'j',
      'J',
      '%',
      'S',
      's',
      'Z9',
      '?',
      ',',
      ';',
      '\t',
      ' ',
      '\n',
      '\r\n',
      '$$ c',
      '# c\n',
      'cm-1,%T\n',
      'um;A\n',
      '1e400',
      'NaN',
    ),
    { maxLength: 80 },
  )
  .map((parts) => parts.join(''));

/** A plausible JCAMP-DX header around data lines drawn from the AFFN/ASDF alphabet. */
const jcampSkeleton = fc
  .tuple(
    fc.subarray([
      '##XUNITS=1/CM',
      '##YUNITS=ABSORBANCE',
      '##FIRSTX=0',
      '##LASTX=9',
      '##NPOINTS=10',
      '##DELTAX=1',
      '##YFACTOR=0.5',
      '##FIRSTY=1',
    ]),
    fc.array(
      fc
        .array(
          fc.constantFrom(
            '0',
            '1',
            '9',
            '.',
            '-',
            '+',
            ' ',
            '@',
            'A',
            'i',
            '%',
            'J',
            'r',
            'S',
            'Z',
            's',
            '?',
            'E',
            'e',
            ',',
          ),
          {
            maxLength: 30,
          },
        )
        .map((chars) => chars.join('')),
      { maxLength: 8 },
    ),
  )
  .map(([labels, lines]) =>
    ['##TITLE=skeleton', ...labels, '##XYDATA=(X++(Y..Y))', ...lines, '##END='].join('\n'),
  );

describe('readers under fuzzing only ever throw BandshelfError', () => {
  it('the valid seeds themselves parse', () => {
    for (const text of VALID)
      expect(readSpectrumFile(encoder.encode(text), { file: 'fuzz.dat' }).length).toBe(1);
  });

  it('random bytes', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 600 }), (bytes) => {
        expectTypedOutcome(() => readSpectrumFile(bytes, { file: 'fuzz.dat' }));
      }),
      RUNS,
    );
  });

  it('random strings into each reader', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 400 }), (text) => {
        expectTypedOutcome(() => readJcampDx(text, { file: 'fuzz.dat' }));
        expectTypedOutcome(() => readDelimited(text, { file: 'fuzz.dat' }));
        expectTypedOutcome(() => readSpectrumFile(encoder.encode(text), { file: 'fuzz.dat' }));
      }),
      RUNS,
    );
  });

  it('strings from the readers’ own alphabet', () => {
    fc.assert(
      fc.property(tokenSoup, (text) => {
        expectTypedOutcome(() => readJcampDx(text, { file: 'fuzz.dat' }));
        expectTypedOutcome(() => readDelimited(text, { file: 'fuzz.dat' }));
      }),
      RUNS,
    );
  });

  it('JCAMP-DX headers around random AFFN/ASDF data lines', () => {
    fc.assert(
      fc.property(jcampSkeleton, (text) => {
        expectTypedOutcome(() => readJcampDx(text, { file: 'fuzz.dat' }));
      }),
      RUNS,
    );
  });

  it('mutated valid files: truncated, bit-flipped, shuffled, huge numbers, spliced', () => {
    fc.assert(
      fc.property(mutated, (bytes) => {
        expectTypedOutcome(() => readSpectrumFile(bytes, { file: 'fuzz.dat' }));
      }),
      { seed: 42, numRuns: 1000 },
    );
  });
});

// The generators both the property tests and `npm run fuzz` run: per reader, valid files that must round-trip,
// benign variants that must read the same values, and damaged files that must fail with a stable error code.
import fc from 'fast-check';
import { BandshelfError, type ErrorCode } from '../src/error.js';
import { decodeText } from '../src/formats/decodeText.js';
import { readManifest } from '../src/formats/readManifest.js';
import { readSidecarSections } from '../src/formats/readSidecarSections.js';
import { readSpectrumFile } from '../src/formats/readSpectrumFile.js';
import { readTimeTrace } from '../src/formats/readTimeTrace.js';
import { writeCsv } from '../src/formats/writeCsv.js';
import { type JcampForm, MIN_EXPONENT, writeJcampDx } from '../src/formats/writeJcampDx.js';

/** One generated input and how to judge what the reader made of it. */
export interface FuzzInput {
  /** The bytes handed to the reader (through the one text decoder). */
  bytes: Uint8Array;
  /** Throws an Error describing the failure; returns normally when the reader behaved. */
  check: () => void;
}

/** A named property of one reader: an arbitrary of inputs, each carrying its own check. */
export interface ReaderFuzzCase {
  reader: 'jcamp-dx' | 'delimited' | 'delimited, several y columns' | 'trace' | 'sidecar' | 'manifest';
  property: 'round-trip' | 'benign variant' | 'damaged';
  inputs: fc.Arbitrary<FuzzInput>;
  /** The reader on bytes, for mutated inputs that may only ever raise a BandshelfError. */
  read: (bytes: Uint8Array) => unknown;
}

const FILE = 'fuzz.dat';
const encoder = new TextEncoder();

/** Every code of the ErrorCode union: a damaged file must end in one of these, never another exception. */
const CODES: ReadonlySet<ErrorCode> = new Set<ErrorCode>([
  'EMPTY_FILE',
  'TOO_FEW_POINTS',
  'NOT_NUMERIC',
  'NOT_FINITE',
  'DUPLICATE_X',
  'NOT_MONOTONIC',
  'UNKNOWN_UNIT',
  'BINARY_DATA',
  'FILE_TOO_LARGE',
  'NOT_A_FILE',
  'BAD_FORMAT',
  'NOT_A_SPECTRUM',
  'BAD_TRANSMITTANCE',
  'BAD_METADATA',
]);

/** The reader's error, checked to be a BandshelfError with a known code naming the file; else it throws. */
function errorCodeOf(read: () => unknown): ErrorCode | undefined {
  try {
    read();
    return undefined;
  } catch (error) {
    if (!(error instanceof BandshelfError)) {
      throw new Error(`not a BandshelfError: ${error instanceof Error ? error.stack : String(error)}`);
    }
    if (!CODES.has(error.code)) throw new Error(`unexpected code ${error.code}: ${error.oneLine()}`);
    if (error.file !== FILE) throw new Error(`the error does not name the file: ${error.oneLine()}`);
    if (/\n/.test(error.oneLine())) throw new Error('the error is more than one line');
    return error.code;
  }
}

// ---- spectra ----

const spectrumArb = fc
  .record({
    n: fc.integer({ min: 2, max: 160 }),
    start: fc.double({ min: 400, max: 3000, noNaN: true }),
    step: fc.double({ min: 0.05, max: 8, noNaN: true }),
    scale: fc.constantFrom(1e-6, 1e-3, 0.01, 1, 3, 1e4),
    ys: fc.array(fc.double({ min: -1, max: 1, noNaN: true, noDefaultInfinity: true }), {
      minLength: 160,
      maxLength: 160,
    }),
    uneven: fc.boolean(),
  })
  .map(({ n, start, step, scale, ys, uneven }) => {
    const wavenumber = new Float64Array(n);
    const absorbance = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      wavenumber[i] = start + step * i + (uneven ? step * 0.3 * Math.abs(ys[(i * 7) % 160]!) : 0);
      absorbance[i] = scale * ys[i]!;
    }
    return { wavenumber, absorbance };
  });

const FORMS: JcampForm[] = ['affn', 'pac', 'sqz', 'dif', 'difdup'];

interface WrittenSpectrum {
  text: string;
  expected: { wavenumber: Float64Array; absorbance: Float64Array };
  /** Largest allowed |read − expected| of an ordinate (0: exact). */
  yTolerance: number;
  xTolerance: number;
}

const jcampArb: fc.Arbitrary<WrittenSpectrum> = fc
  .tuple(spectrumArb, fc.constantFrom(...FORMS))
  .map(([spectrum, form]) => {
    const text = writeJcampDx(spectrum, { form, title: `synthetic ${form}` });
    let maxAbs = 0;
    for (const v of spectrum.absorbance) maxAbs = Math.max(maxAbs, Math.abs(v));
    // writeJcampDx's documented bound: within 0.5·YFACTOR, YFACTOR = 10^max(⌊log10 max|y|⌋ − 7, −300).
    const yFactor = maxAbs > 0 ? 10 ** Math.max(MIN_EXPONENT, Math.floor(Math.log10(maxAbs)) - 7) : 1;
    return { text, expected: spectrum, yTolerance: 0.5 * yFactor * (1 + 1e-9), xTolerance: 1e-6 };
  });

const csvArb: fc.Arbitrary<WrittenSpectrum> = spectrumArb.map((spectrum) => ({
  text: writeCsv(spectrum),
  expected: spectrum,
  yTolerance: 0,
  xTolerance: 0,
}));

/** Every spectrum the file holds (mutated bytes may gain or lose a column: any count is a valid reading). */
function readSpectra(bytes: Uint8Array) {
  return readSpectrumFile(bytes, { file: FILE });
}

function readSpectrum(bytes: Uint8Array) {
  const parsed = readSpectra(bytes);
  if (parsed.length !== 1) throw new Error(`${parsed.length} spectra read, not 1`);
  return parsed[0]!.spectrum;
}

function sameSpectrum(
  got: { wavenumber: Float64Array; absorbance: Float64Array },
  want: WrittenSpectrum['expected'],
  xTol: number,
  yTol: number,
): void {
  if (got.wavenumber.length !== want.wavenumber.length) {
    throw new Error(`${got.wavenumber.length} points read, ${want.wavenumber.length} written`);
  }
  for (let i = 0; i < got.wavenumber.length; i++) {
    const dx = Math.abs(got.wavenumber[i]! - want.wavenumber[i]!);
    const dy = Math.abs(got.absorbance[i]! - want.absorbance[i]!);
    if (!(dx <= xTol * Math.max(1, Math.abs(want.wavenumber[i]!))) || !(dy <= yTol)) {
      throw new Error(
        `point ${i}: read (${got.wavenumber[i]}, ${got.absorbance[i]}), written (${want.wavenumber[i]}, ${want.absorbance[i]})`,
      );
    }
  }
}

function sameArrays(a: ArrayLike<number>, b: ArrayLike<number>, what: string): void {
  if (a.length !== b.length) throw new Error(`${what}: ${a.length} values against ${b.length}`);
  for (let i = 0; i < a.length; i++) {
    if (!Object.is(a[i], b[i])) throw new Error(`${what}[${i}]: ${a[i]} against ${b[i]}`);
  }
}

// ---- benign variants and damage, shared ----

type Variant = 'crlf' | 'utf8-bom' | 'utf16le' | 'utf16be' | 'trailing-space';
const VARIANTS: Variant[] = ['crlf', 'utf8-bom', 'utf16le', 'utf16be', 'trailing-space'];

function utf16(text: string, littleEndian: boolean): Uint8Array {
  const out = new Uint8Array(2 + text.length * 2);
  const view = new DataView(out.buffer);
  view.setUint16(0, 0xfeff, littleEndian);
  for (let i = 0; i < text.length; i++) view.setUint16(2 + 2 * i, text.charCodeAt(i), littleEndian);
  return out;
}

/** The same content as other bytes: CRLF line ends, a UTF-8 BOM, UTF-16 LE/BE with a BOM, trailing white space. */
function benignVariant(text: string, variant: Variant): Uint8Array {
  switch (variant) {
    case 'crlf':
      return encoder.encode(text.replace(/\n/g, '\r\n'));
    case 'utf8-bom':
      return new Uint8Array([0xef, 0xbb, 0xbf, ...encoder.encode(text)]);
    case 'utf16le':
      return utf16(text, true);
    case 'utf16be':
      return utf16(text, false);
    default:
      return encoder.encode(text.replace(/\n/g, ' \t\n'));
  }
}

type Damage = 'nul' | 'empty' | 'not-numeric' | 'infinite';

/** A data line (not a header or label) of a written spectrum or trace: every line from the second number row. */
function dataLineIndexes(lines: string[]): number[] {
  const out: number[] = [];
  for (let i = 0; i < lines.length; i++) if (/^\s*[-+]?\d/.test(lines[i]!)) out.push(i);
  return out.slice(1);
}

/** Damages a written file in a way no reader may accept, returning the bytes and the one code it must give. */
function damage(
  text: string,
  kind: Damage,
  pick: number,
  append = false,
): { bytes: Uint8Array; code: ErrorCode } {
  const lines = text.split('\n');
  const data = dataLineIndexes(lines);
  switch (kind) {
    case 'nul': {
      const bytes = encoder.encode(text);
      const out = new Uint8Array(bytes.length + 1);
      const at = pick % (bytes.length + 1);
      out.set(bytes.subarray(0, at));
      out.set(bytes.subarray(at), at + 1);
      return { bytes: out, code: 'BINARY_DATA' };
    }
    case 'empty':
      return { bytes: encoder.encode(' \n\t\n'), code: 'EMPTY_FILE' };
    case 'not-numeric': {
      if (data.length === 0) return { bytes: new Uint8Array(0), code: 'EMPTY_FILE' };
      const i = data[pick % data.length]!;
      lines[i] = append ? `${lines[i]} x!` : lines[i]!.replace(/[-+]?\d[\d.eE+-]*\s*$/, 'x!');
      return { bytes: encoder.encode(lines.join('\n')), code: 'NOT_NUMERIC' };
    }
    default: {
      if (data.length === 0) return { bytes: new Uint8Array(0), code: 'EMPTY_FILE' };
      const i = data[pick % data.length]!;
      // A sign after E marks an exponent even on a compressed JCAMP-DX line (where a bare E is SQZ +5).
      lines[i] = append ? `${lines[i]} 1E+999` : lines[i]!.replace(/[-+]?\d[\d.eE+-]*\s*$/, '1E+999');
      return { bytes: encoder.encode(lines.join('\n')), code: 'NOT_FINITE' };
    }
  }
}

const variantArb = fc.constantFrom(...VARIANTS);
const damageArb = fc.tuple(fc.constantFrom<Damage>('nul', 'empty', 'not-numeric', 'infinite'), fc.nat());

function expectCode(bytes: Uint8Array, want: ErrorCode, read: (bytes: Uint8Array) => unknown): void {
  const got = errorCodeOf(() => read(bytes));
  if (got !== want) throw new Error(`expected ${want}, got ${got ?? 'no error'}`);
}

function spectrumCases(
  reader: 'jcamp-dx' | 'delimited',
  written: fc.Arbitrary<WrittenSpectrum>,
): ReaderFuzzCase[] {
  return [
    {
      reader,
      read: readSpectra,
      property: 'round-trip',
      inputs: written.map((w) => {
        const bytes = encoder.encode(w.text);
        return {
          bytes,
          check: () => sameSpectrum(readSpectrum(bytes), w.expected, w.xTolerance, w.yTolerance),
        };
      }),
    },
    {
      reader,
      read: readSpectra,
      property: 'benign variant',
      inputs: fc.tuple(written, variantArb).map(([w, variant]) => {
        const bytes = benignVariant(w.text, variant);
        return {
          bytes,
          check: () => {
            const plain = readSpectrum(encoder.encode(w.text));
            const got = readSpectrum(bytes);
            sameArrays(got.wavenumber, plain.wavenumber, `${variant} wavenumber`);
            sameArrays(got.absorbance, plain.absorbance, `${variant} absorbance`);
          },
        };
      }),
    },
    {
      reader,
      read: readSpectra,
      property: 'damaged',
      inputs: fc.tuple(written, damageArb).map(([w, [kind, pick]]) => {
        // Compressed XYDATA lines end in pseudo-digits: damage is appended there; AFFN pairs are replaced in place.
        const append = reader === 'jcamp-dx' && !w.text.includes('(XY..XY)');
        const { bytes, code } = damage(w.text, kind, pick, append);
        return { bytes, check: () => expectCode(bytes, code, readSpectrum) };
      }),
    },
  ];
}

// ---- delimited files with several y columns ----

interface WrittenColumns {
  text: string;
  names: string[];
  columns: WrittenSpectrum['expected'][];
}

/** One x column and 2–4 y columns (each its own generated ordinates), comma, semicolon or tab separated. */
const columnsArb: fc.Arbitrary<WrittenColumns> = fc
  .tuple(spectrumArb, fc.array(spectrumArb, { minLength: 1, maxLength: 3 }), fc.constantFrom(',', ';', '\t'))
  .map(([first, others, sep]) => {
    const n = first.wavenumber.length;
    // Every column on the first spectrum's abscissae, each with its own ordinates (cycled to length n).
    const columns = [first, ...others].map((o) => ({
      wavenumber: first.wavenumber,
      absorbance: Float64Array.from({ length: n }, (_, i) => o.absorbance[i % o.absorbance.length]!),
    }));
    const names = columns.map((_, j) => `sample_${j + 1}`);
    const rows = [['wavenumber_cm-1', ...names].join(sep)];
    for (let i = 0; i < n; i++)
      rows.push([first.wavenumber[i]!, ...columns.map((c) => c.absorbance[i]!)].join(sep));
    return { text: `${rows.join('\n')}\n`, names, columns };
  });

function sameColumns(bytes: Uint8Array, w: WrittenColumns): void {
  const parsed = readSpectra(bytes);
  if (parsed.length !== w.columns.length) {
    throw new Error(`${parsed.length} spectra read, ${w.columns.length} columns written`);
  }
  parsed.forEach((p, j) => {
    if (p.source.column !== w.names[j]) throw new Error(`column ${j + 1} read as ${p.source.column}`);
    // Number → String is exact, so the values must come back exactly (|difference| ≤ 0; −0 reads as 0).
    sameSpectrum(p.spectrum, w.columns[j]!, 0, 0);
  });
}

function columnsCases(): ReaderFuzzCase[] {
  const reader = 'delimited, several y columns';
  return [
    {
      reader,
      read: readSpectra,
      property: 'round-trip',
      inputs: columnsArb.map((w) => {
        const bytes = encoder.encode(w.text);
        return { bytes, check: () => sameColumns(bytes, w) };
      }),
    },
    {
      reader,
      read: readSpectra,
      property: 'benign variant',
      inputs: fc.tuple(columnsArb, variantArb).map(([w, variant]) => {
        const bytes = benignVariant(w.text, variant);
        return { bytes, check: () => sameColumns(bytes, w) };
      }),
    },
    {
      reader,
      read: readSpectra,
      property: 'damaged',
      inputs: fc.tuple(columnsArb, damageArb).map(([w, [kind, pick]]) => {
        const { bytes, code } = damage(w.text, kind, pick);
        return { bytes, check: () => expectCode(bytes, code, readSpectra) };
      }),
    },
  ];
}

// ---- time-domain traces ----

const traceArb = fc
  .record({
    n: fc.integer({ min: 16, max: 200 }),
    step: fc.constantFrom(0.5, 1, 2, 4.25),
    field: fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true, noDefaultInfinity: true }), {
      minLength: 200,
      maxLength: 200,
    }),
  })
  .map(({ n, step, field }) => {
    const time = Float64Array.from({ length: n }, (_, i) => i * step);
    const values = Float64Array.from(field.slice(0, n));
    // String(-0) is "0": write the sign, so the text carries every value exactly.
    const cell = (v: number) => (Object.is(v, -0) ? '-0' : String(v));
    const text = `delay (fs),field\n${Array.from(time, (t, i) => `${t},${cell(values[i]!)}`).join('\n')}\n`;
    return { text, time, field: values };
  });

function readTrace(bytes: Uint8Array) {
  return readTimeTrace(bytes, { file: FILE });
}

function traceCases(): ReaderFuzzCase[] {
  return [
    {
      reader: 'trace',
      read: readTrace,
      property: 'round-trip',
      inputs: traceArb.map((t) => {
        const bytes = encoder.encode(t.text);
        return {
          bytes,
          check: () => {
            const got = readTrace(bytes);
            sameArrays(got.time, t.time, 'time');
            sameArrays(got.field, t.field, 'field');
          },
        };
      }),
    },
    {
      reader: 'trace',
      read: readTrace,
      property: 'benign variant',
      inputs: fc.tuple(traceArb, variantArb).map(([t, variant]) => {
        const bytes = benignVariant(t.text, variant);
        return {
          bytes,
          check: () => {
            const got = readTrace(bytes);
            sameArrays(got.time, t.time, `${variant} time`);
            sameArrays(got.field, t.field, `${variant} field`);
          },
        };
      }),
    },
    {
      reader: 'trace',
      read: readTrace,
      property: 'damaged',
      inputs: fc.tuple(traceArb, damageArb).map(([t, [kind, pick]]) => {
        const { bytes, code } = damage(t.text, kind, pick);
        return { bytes, check: () => expectCode(bytes, code, readTrace) };
      }),
    },
  ];
}

// ---- sidecars and manifests ----

/** Single-line text with CSV-hostile and non-ASCII characters: commas, quotes, µ, °, accents. */
const lineText = fc
  .array(fc.constantFrom(...'abcXYZ019 ,"\'-()/µ°éü+'.split('')), { minLength: 1, maxLength: 40 })
  .map((chars) => chars.join('').trim())
  .filter((s) => s.length > 0);

const metaArb = fc.record({ name: lineText, notes: lineText, tags: fc.array(lineText, { maxLength: 3 }) });

function sidecarMeta(bytes: Uint8Array) {
  return readSidecarSections(decodeText(bytes, { file: FILE }), { file: FILE }).meta;
}

function sameMeta(got: Record<string, unknown>, want: Record<string, unknown>): void {
  for (const key of Object.keys(want)) {
    if (JSON.stringify(got[key]) !== JSON.stringify(want[key])) {
      throw new Error(`${key}: read ${JSON.stringify(got[key])}, written ${JSON.stringify(want[key])}`);
    }
  }
}

function sidecarCases(): ReaderFuzzCase[] {
  const written = fc.tuple(metaArb, fc.boolean()).map(([meta, pretty]) => ({
    meta,
    text: `${JSON.stringify(meta, null, pretty ? 2 : undefined)}\n`,
  }));
  return [
    {
      reader: 'sidecar',
      read: sidecarMeta,
      property: 'round-trip',
      inputs: written.map((w) => {
        const bytes = encoder.encode(w.text);
        return { bytes, check: () => sameMeta(sidecarMeta(bytes), w.meta) };
      }),
    },
    {
      reader: 'sidecar',
      read: sidecarMeta,
      property: 'benign variant',
      inputs: fc.tuple(written, variantArb).map(([w, variant]) => {
        const bytes = benignVariant(w.text, variant);
        return { bytes, check: () => sameMeta(sidecarMeta(bytes), w.meta) };
      }),
    },
    {
      reader: 'sidecar',
      read: sidecarMeta,
      property: 'damaged',
      inputs: fc.tuple(written, fc.nat()).map(([w, pick]) => {
        // Cut inside the JSON object (before its closing brace): never a complete document.
        const cut = 1 + (pick % Math.max(1, w.text.trimEnd().length - 1));
        const bytes = encoder.encode(w.text.slice(0, cut));
        return { bytes, check: () => expectCode(bytes, 'BAD_METADATA', sidecarMeta) };
      }),
    },
  ];
}

function csvCell(text: string): string {
  return /[",\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

function manifestRows(bytes: Uint8Array) {
  return readManifest(decodeText(bytes, { file: FILE }), { file: FILE });
}

function manifestCases(): ReaderFuzzCase[] {
  const written = fc.array(fc.tuple(metaArb), { minLength: 1, maxLength: 6 }).map((rows) => {
    const lines = ['file,name,notes'];
    rows.forEach(([meta], i) => {
      lines.push([`s${i}.csv`, csvCell(meta.name), csvCell(meta.notes)].join(','));
    });
    return { rows: rows.map(([m]) => ({ name: m.name, notes: m.notes })), text: `${lines.join('\n')}\n` };
  });
  const check = (bytes: Uint8Array, rows: { name: string; notes: string }[]) => {
    const got = manifestRows(bytes);
    if (got.size !== rows.length) throw new Error(`${got.size} rows read, ${rows.length} written`);
    rows.forEach((row, i) => {
      sameMeta((got.get(`s${i}.csv`) ?? {}) as Record<string, unknown>, row);
    });
  };
  return [
    {
      reader: 'manifest',
      read: manifestRows,
      property: 'round-trip',
      inputs: written.map((w) => {
        const bytes = encoder.encode(w.text);
        return { bytes, check: () => check(bytes, w.rows) };
      }),
    },
    {
      reader: 'manifest',
      read: manifestRows,
      property: 'benign variant',
      // Trailing white space after a closing quote is not CSV (RFC 4180 §2), so that variant is left out here.
      inputs: fc
        .tuple(written, fc.constantFrom(...VARIANTS.filter((v) => v !== 'trailing-space')))
        .map(([w, variant]) => {
          const bytes = benignVariant(w.text, variant);
          return { bytes, check: () => check(bytes, w.rows) };
        }),
    },
    {
      reader: 'manifest',
      read: manifestRows,
      property: 'damaged',
      inputs: fc.tuple(written, fc.nat()).map(([w, pick]) => {
        const bytes = encoder.encode(w.text);
        const out = new Uint8Array(bytes.length + 1);
        const at = pick % (bytes.length + 1);
        out.set(bytes.subarray(0, at));
        out.set(bytes.subarray(at), at + 1);
        return { bytes: out, check: () => expectCode(out, 'BINARY_DATA', manifestRows) };
      }),
    },
  ];
}

/** Shows an input as its text (first 2,000 characters) in fast-check's counterexample, not as a byte list. */
function readable(c: ReaderFuzzCase): ReaderFuzzCase {
  const decoder = new TextDecoder('utf-8');
  return {
    ...c,
    inputs: c.inputs.map((input) =>
      Object.assign(input, {
        [fc.toStringMethod]: () =>
          `${c.reader} ${c.property} input: ${JSON.stringify(decoder.decode(input.bytes.subarray(0, 2000)))}`,
      }),
    ),
  };
}

/** Every reader's round-trip, benign-variant and damaged-file properties. */
export function readerFuzzCases(): ReaderFuzzCase[] {
  return [
    ...spectrumCases('jcamp-dx', jcampArb),
    ...spectrumCases('delimited', csvArb),
    ...columnsCases(),
    ...traceCases(),
    ...sidecarCases(),
    ...manifestCases(),
  ].map(readable);
}

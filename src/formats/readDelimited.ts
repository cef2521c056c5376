// Reads delimited text (CSV, semicolon, tab or whitespace) with one x column and one or more y columns into spectra in
// cm⁻¹ and absorbance, one per y column.
import { BandshelfError } from '../error.js';
import { finiteRange } from '../spectrum/finiteRange.js';
import { checkReadingUnits } from './checkReadingUnits.js';
import { looksPercentTransmittance } from './looksPercentTransmittance.js';
import { markSaturated } from './markSaturated.js';
import { spectrumFromPoints } from './spectrumFromPoints.js';
import { toWavenumberAbsorbance } from './toWavenumberAbsorbance.js';
import { transmittanceScale } from './transmittanceScale.js';
import type { ParsedSpectrum, ParseWarning, XUnit, YUnit } from './types.js';

export interface ReadDelimitedOptions {
  /** File named in errors and warnings. @default undefined */
  file?: string;
  /** Unit of the first column, overriding the header and the value range. @default undefined (detected) */
  xUnit?: XUnit;
  /** Unit of the y columns, overriding the header and the value range. @default undefined (detected) */
  yUnit?: YUnit;
  /**
   * Read only this y column: its header name (any case) or its 1-based number among the y columns.
   * @default undefined (every y column, each one spectrum)
   */
  column?: string | number;
}

/**
 * Lines starting with `#` are comments. Leading lines that are not numbers form the header; its cells name
 * the columns and units (`wavenumber_cm-1`, `wavelength_um`, `nm`, `frequency_THz`, `absorbance`, `%T` …). The
 * delimiter is the first of `;`, tab, `,`, whitespace that splits every sampled data line into numbers; with `;`,
 * tab or whitespace a decimal comma is accepted. x may run either way. The first column is x; every further
 * column is one spectrum, named by its header cell (`y2`, `y3` … without one) in `source.column`, its empty
 * cells left out; a column headed as an uncertainty (`sd`, `error` …) is left out unless `column` names it.
 * Without a unit in the header, x in 2–25 is read as µm and anything else as cm⁻¹, y as absorbance, each with
 * a warning; `xUnit`/`yUnit` override. Errors name the line: a non-number → NOT_NUMERIC, NaN/Infinity →
 * NOT_FINITE; a `column` the file does not have → BAD_OPTION listing its columns.
 */
export function readDelimited(text: string, options: ReadDelimitedOptions = {}): ParsedSpectrum[] {
  const { file } = options;
  checkReadingUnits(options, file === undefined ? {} : { file });
  const lines = text.split(/\r\n|\r|\n/);
  const { header, firstData, delimiter } = findHeader(lines, file);
  const table = readTable(lines, firstData, delimiter, file);
  const { x, pointLine } = table;
  const warnings: ParseWarning[] = [];

  // Each column's header text, gathered over all header lines (a name line and a unit line, say).
  const columns: string[] = [];
  for (const h of header) {
    headerFields(h.text, delimiter).forEach((cell, k) => {
      columns[k] = columns[k] === undefined ? cell : `${columns[k]} ${cell}`;
    });
  }
  const headerLine = header[header.length - 1]?.line;
  const where = { file, line: headerLine };
  const xUnit = options.xUnit ?? detectXUnit(columns[0] ?? '', x, warnings, where);
  const picked = pickColumns(table.y.length, columns, options.column, file, warnings);
  const several = table.y.length > 1;
  return picked.map(({ k, name }) => {
    const own: ParseWarning[] = [...warnings];
    const column = table.y[k]!;
    const kept = keptPoints(column, table.n);
    if (kept.count === 0) {
      throw new BandshelfError('EMPTY_FILE', `the column ${show(name)} holds no values`, {
        file,
        line: firstData + 1,
        field: name,
      });
    }
    if (kept.count < table.n) {
      own.push({
        line: firstData + 1,
        message: `the column ${show(name)} has ${plural(table.n - kept.count, 'empty cell')}; those rows were left out of it`,
      });
    }
    const cx = kept.count === table.n ? x : kept.take(x);
    const cy = kept.count === table.n ? column.slice(0, table.n) : kept.take(column);
    const lineOf = kept.count === table.n ? pointLine : kept.takeLines(pointLine);
    const yUnit = options.yUnit ?? detectYUnit(columns[k + 1] ?? '', cy, own, where);
    const converted = toWavenumberAbsorbance({ x: cx, y: cy }, { xUnit, yUnit, file, lines: lineOf });
    const { spectrum, warnings: pointWarnings } = spectrumFromPoints(converted, { file, lines: lineOf });
    own.push(...pointWarnings);
    const parsed: ParsedSpectrum = {
      spectrum,
      meta: {},
      source: { format: 'delimited', xUnit, yUnit, ...(several ? { column: name } : {}) },
      warnings: own,
    };
    if (yUnit !== 'absorbance') {
      const { saturated, warning } = markSaturated(spectrum);
      if (saturated) parsed.saturated = saturated;
      if (warning) own.push(warning);
    }
    return parsed;
  });
}

/** Non-numeric lines before the first data line are the header; the data lines sampled choose the delimiter. */
function findHeader(lines: readonly string[], file: string | undefined) {
  const header: { text: string; line: number }[] = [];
  const sample: string[] = [];
  let firstData = -1;
  for (let i = 0; i < lines.length && sample.length < 50; i++) {
    const t = lines[i]!.trim();
    if (t === '' || t.startsWith('#')) continue;
    if (firstData < 0 && !DELIMITERS.some((d) => numericFields(t, d) >= 2)) {
      header.push({ text: t, line: i + 1 });
      continue;
    }
    if (firstData < 0) firstData = i;
    sample.push(t);
  }
  if (firstData < 0) {
    if (header.length <= 1) {
      throw new BandshelfError(
        'EMPTY_FILE',
        header.length === 1 ? 'the file has a header but no rows of numbers' : 'the file holds no data',
        { file, line: header[0]?.line },
      );
    }
    throw new BandshelfError(
      'NOT_NUMERIC',
      `no line of the file is a row of numbers: ${show(header[1]!.text)}`,
      {
        file,
        line: header[1]!.line,
      },
    );
  }
  return { header, firstData, delimiter: chooseDelimiter(sample) };
}

interface Table {
  n: number;
  x: Float64Array;
  pointLine: Uint32Array;
  /** One buffer per y column (capacity ≥ n); NaN where a row left the cell empty. */
  y: Float64Array[];
}

/** Every data row: x, then each y column, growing the buffers as rows (and wider rows) come. */
function readTable(lines: readonly string[], firstData: number, delimiter: Delimiter, file?: string): Table {
  const decimalComma = delimiter !== ',';
  let x: Float64Array = new Float64Array(1024);
  let pointLine: Uint32Array = new Uint32Array(1024);
  let y: Float64Array[] = [];
  let n = 0;
  for (let i = firstData; i < lines.length; i++) {
    const t = lines[i]!.trim();
    if (t === '' || t.startsWith('#')) continue;
    const cells = splitCells(t, delimiter);
    if (cells.length < 2) {
      throw new BandshelfError(
        'NOT_NUMERIC',
        `expected two numbers (x and y) but found ${cells.length === 1 ? `only ${show(cells[0]!)}` : 'none'}`,
        { file, line: i + 1 },
      );
    }
    if (n >= x.length) {
      const capacity = x.length * 2;
      x = grown(x, capacity);
      pointLine = grownLines(pointLine, capacity);
      y = y.map((c) => grown(c, capacity));
    }
    while (y.length < cells.length - 1) y.push(new Float64Array(x.length).fill(Number.NaN));
    x[n] = parseCell(cells[0]!, decimalComma, file, i + 1, 'x');
    for (let k = 0; k < y.length; k++) {
      const cell = cells[k + 1];
      y[k]![n] =
        cell === undefined || cell === ''
          ? Number.NaN
          : parseCell(cell, decimalComma, file, i + 1, k === 0 ? 'y' : `y${k + 1}`);
    }
    pointLine[n] = i + 1;
    n++;
  }
  return { n, x: x.slice(0, n), pointLine: pointLine.slice(0, n), y };
}

function grown(a: Float64Array, capacity: number): Float64Array {
  const b = new Float64Array(capacity).fill(Number.NaN);
  b.set(a);
  return b;
}

function grownLines(a: Uint32Array, capacity: number): Uint32Array {
  const b = new Uint32Array(capacity);
  b.set(a);
  return b;
}

/** The rows of a column that hold a value, and copies of any parallel array at those rows. */
function keptPoints(column: Float64Array, n: number) {
  const rows: number[] = [];
  for (let i = 0; i < n; i++) if (!Number.isNaN(column[i]!)) rows.push(i);
  return {
    count: rows.length,
    take: (a: Float64Array) => Float64Array.from(rows, (i) => a[i]!),
    takeLines: (a: Uint32Array) => Uint32Array.from(rows, (i) => a[i]!),
  };
}

/** A header naming a column's uncertainty, not a spectrum of its own. */
const UNCERTAINTY = /^(sd|s\.d\.|std|stdev|std\.? ?dev\.?|sem|se|sigma|σ|err|errors?|uncertainty|±.*)$/i;

/** The y columns to read (index among the y columns and name), by the `column` option or all but uncertainties. */
function pickColumns(
  count: number,
  columns: readonly string[],
  wanted: string | number | undefined,
  file: string | undefined,
  warnings: ParseWarning[],
): { k: number; name: string }[] {
  const all = Array.from({ length: count }, (_, k) => ({
    k,
    name: columns[k + 1]?.trim() ? columns[k + 1]!.trim() : `y${k + 1}`,
  }));
  if (wanted !== undefined) {
    const found =
      typeof wanted === 'number'
        ? all[wanted - 1]
        : all.find((c) => c.name.toLowerCase() === wanted.trim().toLowerCase());
    if (found === undefined) {
      throw new BandshelfError(
        'BAD_OPTION',
        `column ${typeof wanted === 'number' ? wanted : show(wanted)} is not a y column of the file (it has ${all
          .map((c, i) => `${i + 1} ${show(c.name)}`)
          .join(', ')})`,
        { file, field: 'column' },
      );
    }
    return [found];
  }
  if (count === 1) return all;
  const spectra = all.filter((c) => !UNCERTAINTY.test(c.name));
  const left = all.filter((c) => UNCERTAINTY.test(c.name));
  if (left.length > 0 && spectra.length > 0) {
    warnings.push({
      message: `${left.map((c) => show(c.name)).join(', ')} ${left.length === 1 ? 'looks' : 'look'} like an uncertainty, not a spectrum: left out (name it as the column to read it)`,
    });
    return spectra;
  }
  return all;
}

type Delimiter = ';' | '\t' | ',' | ' ';
const DELIMITERS: readonly Delimiter[] = [';', '\t', ',', ' '];

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const NUMBER_DECIMAL_COMMA = /^[+-]?(?:\d+,?\d*|,\d+)(?:[eE][+-]?\d+)?$/;
const NOT_FINITE_WORD = /^[+-]?(nan|inf|infinity|∞)$/i;

function splitCells(line: string, delimiter: Delimiter): string[] {
  const raw = delimiter === ' ' ? line.split(/\s+/) : line.split(delimiter);
  const cells = raw.map((c) => unquote(c.trim()));
  // A trailing delimiter leaves an empty last cell; that is not a missing value.
  while (cells.length > 0 && cells[cells.length - 1] === '') cells.pop();
  return cells;
}

function unquote(cell: string): string {
  return cell.length >= 2 && cell.startsWith('"') && cell.endsWith('"') ? cell.slice(1, -1).trim() : cell;
}

function isNumber(cell: string, decimalComma: boolean): boolean {
  return NUMBER.test(cell) || (decimalComma && NUMBER_DECIMAL_COMMA.test(cell));
}

/** How many leading cells of the line read as numbers under this delimiter (0 if the first two do not). */
function numericFields(line: string, delimiter: Delimiter): number {
  const cells = splitCells(line, delimiter);
  if (cells.length < 2) return 0;
  const dc = delimiter !== ',';
  const okCell = (c: string): boolean => isNumber(c, dc) || NOT_FINITE_WORD.test(c);
  return okCell(cells[0]!) && okCell(cells[1]!) ? cells.length : 0;
}

function chooseDelimiter(sample: string[]): Delimiter {
  for (const d of DELIMITERS) {
    if (sample.every((line) => numericFields(line, d) >= 2)) return d;
  }
  // No delimiter fits every line: take the one that fits most, so the error names the first line that fails.
  let best: Delimiter = ',';
  let bestCount = -1;
  for (const d of DELIMITERS) {
    const count = sample.filter((line) => numericFields(line, d) >= 2).length;
    if (count > bestCount) {
      best = d;
      bestCount = count;
    }
  }
  return best;
}

function parseCell(
  cell: string,
  decimalComma: boolean,
  file: string | undefined,
  line: number,
  field: string,
): number {
  if (NUMBER.test(cell)) return Number(cell);
  if (decimalComma && NUMBER_DECIMAL_COMMA.test(cell)) return Number(cell.replace(',', '.'));
  if (NOT_FINITE_WORD.test(cell)) {
    throw new BandshelfError('NOT_FINITE', `${field} = ${show(cell)} is not a finite number`, {
      file,
      line,
      field,
    });
  }
  throw new BandshelfError('NOT_NUMERIC', `${field} = ${show(cell)} is not a number`, { file, line, field });
}

function headerFields(line: string, delimiter: Delimiter): string[] {
  const cells = splitCells(line, delimiter);
  if (cells.length >= 2) return cells;
  for (const d of DELIMITERS) {
    const alt = splitCells(line, d);
    if (alt.length >= 2) return alt;
  }
  return cells;
}

/** A unit word standing alone or between separators, so `um` matches `wavelength_um` but not `wavenumber`. */
function word(cell: string, pattern: string): boolean {
  return new RegExp(`(^|[^a-zµμ])(${pattern})([^a-zµμ]|$)`, 'i').test(cell);
}

/** Header words naming an x quantity that is not a wavenumber or wavelength: refused, never guessed away. */
const FOREIGN_X: readonly [string, string][] = [
  ['[kmgtp]?hz|hertz', 'a frequency'],
  ['[mk]?ev|electron ?volts?', 'an energy'],
  ['fs|ps|ns|ms|µs|μs|us|s|secs?|seconds?|time|delay', 'a time (a time-domain trace is read as a trace)'],
  ['ppm', 'a chemical shift'],
  ['raman', 'a Raman shift'],
  ['pixels?|channels?', 'a detector channel'],
];

/** Header words naming a y quantity bandshelf cannot turn into absorbance. */
const FOREIGN_Y: readonly [string, string][] = [
  ['reflectance|reflection|%\\s*r|r|kubelka(?:[- ]munk)?|k-m|log\\s*\\(?1\\s*/\\s*r\\)?', 'reflectance'],
  ['counts?|cts|single[ -]?beam|interferogram|emission|photons?', 'a raw detector signal'],
];

interface UnitWhere {
  file?: string;
  line?: number;
}

function refuseForeign(
  cell: string,
  foreign: readonly [string, string][],
  axis: 'x' | 'y',
  allowed: string,
  where: UnitWhere,
): void {
  for (const [pattern, what] of foreign) {
    if (word(cell, pattern)) {
      throw new BandshelfError(
        'UNKNOWN_UNIT',
        `the ${axis} column ${show(cell)} is ${what}, not ${allowed}; give the ${axis} unit if the header is wrong`,
        { file: where.file, line: where.line, field: axis },
      );
    }
  }
}

function detectXUnit(cell: string, x: Float64Array, warnings: ParseWarning[], where: UnitWhere): XUnit {
  const { line } = where;
  const c = cell.toLowerCase();
  if (/cm-1|cm\^-1|cm\^\(-1\)|cm−1|cm⁻¹|1\/cm|cm\*\*-1|wave ?numbers?/.test(c)) return 'cm-1';
  if (word(c, 'um|µm|μm|microns?|micromet(?:er|re)s?')) return 'um';
  if (word(c, 'nm|nanomet(?:er|re)s?')) return 'nm';
  // A terahertz axis is an optical frequency bandshelf converts (ν̃ = f / c); other frequencies are refused below.
  if (word(c, 'thz|terahertz')) return 'thz';
  refuseForeign(c, FOREIGN_X, 'x', 'a wavenumber (cm-1) or wavelength (µm, nm)', where);
  const { min, max } = finiteRange(x);
  if (min >= 2 && max <= 25) {
    warnings.push({
      line,
      message: `no x unit in a header; x from ${min} to ${max} read as wavelength in µm (give the x unit if not)`,
    });
    return 'um';
  }
  if (/wavelength|lambda|λ/.test(c)) {
    warnings.push({
      line,
      message: 'the header says wavelength without a unit; read as nm (give the x unit if not)',
    });
    return 'nm';
  }
  if (max > 15000 || min < 10) {
    warnings.push({
      line,
      message: `no x unit in a header; x from ${min} to ${max} read as wavenumber in cm⁻¹, an unusual range (give the x unit if not)`,
    });
  }
  return 'cm-1';
}

function detectYUnit(cell: string, y: Float64Array, warnings: ParseWarning[], where: UnitWhere): YUnit {
  const { line } = where;
  const c = cell.toLowerCase();
  refuseForeign(c, FOREIGN_Y, 'y', 'absorbance or transmittance', where);
  const { min, max } = finiteRange(y);
  const percentWords = /%|percent/.test(c);
  if (percentWords || /transmittance|transmission/.test(c) || word(c, 't')) {
    const scale = transmittanceScale(y, {
      stated: percentWords ? 'percent' : 'unstated',
      file: where.file,
      line,
    });
    if (scale.warning)
      warnings.push({ ...scale.warning, message: `the header says transmittance: ${scale.warning.message}` });
    return scale.unit;
  }
  if (/absorbance|optical density/.test(c) || word(c, 'a|abs|au|od')) return 'absorbance';
  warnings.push({
    line,
    message: looksPercentTransmittance(y)
      ? `no y unit in a header; read as absorbance, though values from ${min} to ${max} look like %T (give the y unit if so)`
      : 'no y unit in a header; y read as absorbance (give the y unit if not)',
  });
  return 'absorbance';
}

function plural(n: number, what: string): string {
  return `${n} ${what}${n === 1 ? '' : 's'}`;
}

function show(text: string): string {
  return JSON.stringify(text.length > 30 ? `${text.slice(0, 30)}…` : text);
}

// Reads a field-resolved time-domain trace (delay, field) from delimited text into a Trace with its delay in fs.
//
// Contract for the library (`add --time-domain`):
//   readTimeTrace(bytes: Uint8Array | string, { file, timeUnit?, overrideHeader? }) → ParsedTrace
// ParsedTrace is a Trace (time: Float64Array in fs, ascending and uniform; field: Float64Array) plus `warnings` and
// `source` (which unit was used and where it came from). Pass the user's `--time-unit` as `timeUnit` with
// `overrideHeader: true`; pass recipe.timeDomain.timeUnit without it (a fallback for headers that name no unit).
// Every problem is a BandshelfError naming the file and, where there is one, the line.
import { BandshelfError } from '../error.js';
import type { Trace, TraceWarning } from '../spectrum/trace/types.js';
import { decodeText } from './decodeText.js';
import { MAX_INPUT_BYTES } from './types.js';

export type TimeUnit = 'fs' | 'ps';

export interface ReadTimeTraceOptions {
  /**
   * The file name as the user gave it, named in errors and warnings.
   * @default undefined
   */
  file?: string;
  /**
   * Delay unit when the header does not name one (or always, with `overrideHeader`).
   * @default 'fs'
   */
  timeUnit?: TimeUnit;
  /**
   * Use `timeUnit` even when the header names a unit (the CLI's `--time-unit`); a disagreement is warned about.
   * @default false
   */
  overrideHeader?: boolean;
  /**
   * Largest accepted input, bytes.
   * @default MAX_INPUT_BYTES (200 MB)
   */
  maxBytes?: number;
  /**
   * Largest deviation of one delay step from the mean step, as a fraction of it.
   * @default 0.01
   */
  stepTolerance?: number;
  /**
   * The fewest samples accepted.
   * @default 16
   */
  minPoints?: number;
}

export interface ParsedTrace extends Trace {
  warnings: TraceWarning[];
  source: {
    format: 'delimited';
    /** The unit the delay column was read in (it is returned in fs). */
    timeUnit: TimeUnit;
    unitFrom: 'header' | 'option' | 'default';
    /** The header's delay and field column names, when there is a header. */
    columns: [string, string] | null;
    delimiter: 'comma' | 'semicolon' | 'tab' | 'whitespace';
  };
}

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^[+-]?\d+,\d+(?:[eE][+-]?\d+)?$/;
const NOT_FINITE = /^[+-]?(?:nan|inf|infinity)$/i;

/** Units a delay header may name; only fs and ps are read, the rest are recognised so they can be refused clearly. */
const UNIT_WORDS: [RegExp, string][] = [
  // A spectrum's axis, so a spectrum file handed over as a trace is refused rather than transformed.
  [
    /cm-1|cm⁻¹|cm−1|1\/cm|wave ?numbers?|wavelength|(?:^|[^a-z])nm(?:$|[^a-z])|hz(?:$|[^a-z])/,
    'a spectral axis',
  ],
  [/femto|(?:^|[^a-zµ])fs(?:$|[^a-z])/, 'fs'],
  [/pico|(?:^|[^a-zµ])ps(?:$|[^a-z])/, 'ps'],
  [/atto|(?:^|[^a-z])as(?:$|[^a-z])/, 'as'],
  [/nano|(?:^|[^a-z])ns(?:$|[^a-z])/, 'ns'],
  [/micro|(?:^|[^a-z])(?:µs|us)(?:$|[^a-z])/, 'µs'],
  [/(?:^|[^a-z])(?:mm|µm|um)(?:$|[^a-z])/, 'a stage position'],
  [/(?:^|[^a-zµ])s(?:$|[^a-z])|seconds?/, 's'],
];

function splitCells(line: string, delimiter: ParsedTrace['source']['delimiter']): string[] {
  const cells =
    delimiter === 'whitespace'
      ? line.split(/\s+/)
      : line.split(delimiter === 'comma' ? ',' : delimiter === 'semicolon' ? ';' : '\t');
  return cells.map((c) =>
    c
      .trim()
      .replace(/^"(.*)"$/, '$1')
      .trim(),
  );
}

function unitOf(header: string): string | null {
  const text = header.toLowerCase();
  for (const [pattern, unit] of UNIT_WORDS) if (pattern.test(text)) return unit;
  return null;
}

/**
 * Reads two columns, delay and field: comma-, semicolon-, tab- or whitespace-separated (decimal commas are accepted
 * when the separator is not a comma), `#` comments, an optional header line before the data whose first cell names
 * the delay unit (`delay_fs`, `time (ps)`, `t/fs`). Extra columns are ignored with a warning; a descending delay is
 * reversed with a warning. The delay must be uniformly sampled within `stepTolerance`; the returned axis is the
 * uniform one, first + i·step, in fs.
 */
export function readTimeTrace(input: Uint8Array | string, options: ReadTimeTraceOptions = {}): ParsedTrace {
  const file = options.file;
  const maxBytes = options.maxBytes ?? MAX_INPUT_BYTES;
  const tolerance = options.stepTolerance ?? 0.01;
  const minPoints = options.minPoints ?? 16;
  const warnings: TraceWarning[] = [];

  const size = typeof input === 'string' ? input.length : input.byteLength;
  if (size > maxBytes) {
    throw new BandshelfError(
      'FILE_TOO_LARGE',
      `the file has ${size} bytes, more than the limit of ${maxBytes}`,
      {
        file,
      },
    );
  }
  let text =
    typeof input === 'string'
      ? input
      : decodeText(input, { file, onWarning: (message) => warnings.push({ message }) });
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.trim() === '') throw new BandshelfError('EMPTY_FILE', 'the file is empty', { file });

  const lines = text.split(/\r\n|\n|\r/);
  let delimiter: ParsedTrace['source']['delimiter'] | null = null;
  let columns: [string, string] | null = null;
  let headerLine = 0;
  let headerText = '';
  const times: number[] = [];
  const fields: number[] = [];
  const lineOf: number[] = [];
  let warnedExtra = false;

  for (let index = 0; index < lines.length; index++) {
    const lineNo = index + 1;
    const hash = lines[index]!.indexOf('#');
    const line = (hash >= 0 ? lines[index]!.slice(0, hash) : lines[index]!).trim();
    if (line === '') continue;
    if (delimiter === null) {
      delimiter = line.includes('\t')
        ? 'tab'
        : line.includes(';')
          ? 'semicolon'
          : line.includes(',')
            ? 'comma'
            : 'whitespace';
    }
    const cells = splitCells(line, delimiter);
    const isNumber = (cell: string) =>
      NUMBER.test(cell) || (delimiter !== 'comma' && DECIMAL_COMMA.test(cell));
    if (times.length === 0 && columns === null && !isNumber(cells[0]!) && !NOT_FINITE.test(cells[0]!)) {
      columns = [cells[0]!, cells[1] ?? ''];
      headerLine = lineNo;
      headerText = line;
      continue;
    }
    if (cells.length < 2 || cells[1] === '') {
      throw new BandshelfError(
        'BAD_FORMAT',
        `this line has ${cells.length === 1 || cells[1] === '' ? 'one column' : 'no columns'}; a trace needs two, delay and field`,
        { file, line: lineNo },
      );
    }
    if (cells.length > 2 && !warnedExtra) {
      warnedExtra = true;
      warnings.push({
        line: lineNo,
        message: `${cells.length} columns: only the first two (delay, field) are read`,
      });
    }
    const values: number[] = [];
    for (const [c, name] of [
      [0, 'delay'],
      [1, 'field'],
    ] as const) {
      const cell = cells[c]!;
      if (NOT_FINITE.test(cell)) {
        throw new BandshelfError('NOT_FINITE', `the ${name} is ${cell}`, { file, line: lineNo, field: name });
      }
      if (!isNumber(cell)) {
        throw new BandshelfError('NOT_NUMERIC', `the ${name} "${cell.slice(0, 40)}" is not a number`, {
          file,
          line: lineNo,
          field: name,
        });
      }
      const value = Number(DECIMAL_COMMA.test(cell) ? cell.replace(',', '.') : cell);
      if (!Number.isFinite(value)) {
        throw new BandshelfError('NOT_FINITE', `the ${name} ${cell} is out of range`, {
          file,
          line: lineNo,
          field: name,
        });
      }
      values.push(value);
    }
    times.push(values[0]!);
    fields.push(values[1]!);
    lineOf.push(lineNo);
  }

  const n = times.length;
  if (n === 0) throw new BandshelfError('EMPTY_FILE', 'the file holds no data lines', { file });
  if (n < minPoints) {
    throw new BandshelfError(
      'TOO_FEW_POINTS',
      `a trace needs at least ${minPoints} samples, this file has ${n}`,
      {
        file,
      },
    );
  }

  // The unit: the caller's override, else the header's, else the caller's fallback.
  // A whitespace header may split "delay fs" into two cells, so then the whole line is searched.
  const headerUnit =
    columns === null
      ? null
      : (unitOf(columns[0]) ?? (delimiter === 'whitespace' ? unitOf(headerText) : null));
  let timeUnit: TimeUnit;
  let unitFrom: ParsedTrace['source']['unitFrom'];
  if (options.overrideHeader && options.timeUnit !== undefined) {
    timeUnit = options.timeUnit;
    unitFrom = 'option';
    if (headerUnit !== null && headerUnit !== timeUnit) {
      warnings.push({
        line: headerLine,
        message: `the header names the delay in ${headerUnit}, read as ${timeUnit} as asked`,
      });
    }
  } else if (headerUnit === 'fs' || headerUnit === 'ps') {
    timeUnit = headerUnit;
    unitFrom = 'header';
  } else if (headerUnit !== null) {
    throw new BandshelfError(
      'UNKNOWN_UNIT',
      headerUnit === 'a spectral axis'
        ? `the header names ${headerUnit}, not a delay: this is a spectrum, not a time-domain trace`
        : `the header gives the delay in ${headerUnit}; traces are read in fs or ps (give the unit with --time-unit)`,
      { file, line: headerLine, field: 'delay' },
    );
  } else {
    timeUnit = options.timeUnit ?? 'fs';
    unitFrom = options.timeUnit === undefined ? 'default' : 'option';
  }
  const scale = timeUnit === 'ps' ? 1000 : 1;

  let order = Array.from({ length: n }, (_, i) => i);
  if (times[n - 1]! < times[0]!) {
    order = order.reverse();
    warnings.push({ message: 'the delay runs downwards; the trace was reversed' });
  }
  const time = new Float64Array(n);
  const field = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    time[i] = times[order[i]!]! * scale;
    field[i] = fields[order[i]!]!;
  }
  const t0 = time[0]!;
  const step = (time[n - 1]! - t0) / (n - 1);
  let worst = 0;
  for (let i = 1; i < n; i++) {
    const d = time[i]! - time[i - 1]!;
    const line = lineOf[order[i]!]!;
    if (d <= 0) {
      throw new BandshelfError(
        'NOT_MONOTONIC',
        d === 0 ? 'this delay repeats the one before it' : 'the delay goes back here',
        { file, line, field: 'delay' },
      );
    }
    const deviation = Math.abs(d - step) / step;
    if (deviation > tolerance) {
      throw new BandshelfError(
        'BAD_FORMAT',
        `the delay step here is ${(d / scale).toPrecision(4)} ${timeUnit} against a mean of ${(step / scale).toPrecision(4)} ${timeUnit}: a trace must be uniformly sampled (tolerance ${(tolerance * 100).toPrecision(2)} %)`,
        { file, line, field: 'delay' },
      );
    }
    worst = Math.max(worst, deviation);
  }
  if (worst > 1e-3) {
    warnings.push({
      message: `delay steps vary by up to ${(worst * 100).toPrecision(2)} %; the trace is treated as uniformly sampled`,
    });
  }
  for (let i = 0; i < n; i++) time[i] = t0 + i * step;

  // 1 / (2Δt) is the Nyquist frequency; 1 fs⁻¹ = 1000 THz and 1 THz = 33.356 cm⁻¹.
  const nyquistCm = (1000 / (2 * step)) * (1e12 / 29_979_245_800);
  if (nyquistCm < 4000) {
    const hint = unitFrom === 'default' ? ' (the header names no unit and fs was assumed; check it)' : '';
    warnings.push({
      message: `a delay step of ${step.toPrecision(4)} fs samples only up to ${nyquistCm.toPrecision(4)} cm⁻¹${hint}`,
    });
  } else if (unitFrom === 'default' && step < 0.01) {
    warnings.push({
      message: `the header names no delay unit and fs was assumed, giving a step of ${step.toPrecision(3)} fs; check it`,
    });
  }
  return {
    time,
    field,
    warnings,
    source: { format: 'delimited', timeUnit, unitFrom, columns, delimiter: delimiter ?? 'comma' },
  };
}

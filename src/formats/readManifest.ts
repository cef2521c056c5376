// Reads a folder's metadata manifest: a CSV table, one row per data file and one column per metadata field.
import { BandshelfError } from '../error.js';
import { type EntryMetaPatch, entryMetaFields, entryMetaPatchSchema } from '../schema/meta.js';
import { metaErrorFromIssues } from '../schema/metaErrorFromIssues.js';
import { metaValueFromText } from './metaValueFromText.js';

export interface ReadManifestOptions {
  /**
   * The manifest's name as the user sees it, for error messages.
   * @default undefined
   */
  file?: string;
  /**
   * Largest manifest accepted, in characters.
   * @default 20_000_000
   */
  maxChars?: number;
}

interface Cell {
  text: string;
  line: number;
}

interface CsvRecord {
  cells: Cell[];
  line: number;
}

/**
 * One entry of metadata per data file, keyed by the `file` column as written (a name relative to the
 * manifest's folder). The header names metadata fields (case, spaces, `_` and `-` are ignored: `InChIKey`,
 * `sample_form`; `license` is taken as `licence`); `concentration` is a cell like `5 mg/mL`, or two columns
 * `concentration.value` and `concentration.unit`. Cells are separated by `,`, `;` or tab (whichever the header
 * uses most), may be quoted with `"` (doubled inside), and lists (synonyms, tags) are `;`-separated inside a
 * cell (quoted, in a `;`-separated table). Empty cells leave a field unset; blank lines and lines starting with `#` are
 * skipped. Errors are BandshelfError BAD_METADATA naming the file, the line and the field.
 */
export function readManifest(text: string, options: ReadManifestOptions = {}): Map<string, EntryMetaPatch> {
  const file = options.file;
  const maxChars = options.maxChars ?? 20_000_000;
  if (text.length > maxChars) {
    throw new BandshelfError('FILE_TOO_LARGE', `a manifest over ${maxChars} characters is refused`, { file });
  }
  const source = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const delimiter = sniffDelimiter(source);
  const records = parseCsv(source, delimiter, file);
  const header = records[0];
  if (!header) throw new BandshelfError('EMPTY_FILE', 'the manifest has no header row', { file });
  const columns = header.cells.map((cell) => fieldOfColumn(cell.text, file, header.line));
  const seen = new Map<string, number>();
  columns.forEach((column, index) => {
    if (column === unnamed) return;
    const before = seen.get(column);
    if (before !== undefined) {
      throw new BandshelfError('BAD_METADATA', `column ${index + 1} repeats column ${before + 1}`, {
        file,
        line: header.line,
        field: column,
      });
    }
    seen.set(column, index);
  });
  const fileColumn = columns.indexOf('file');
  if (fileColumn < 0) {
    throw new BandshelfError('BAD_METADATA', 'the header needs a "file" column naming each data file', {
      file,
      line: header.line,
      field: 'file',
    });
  }
  const result = new Map<string, EntryMetaPatch>();
  const lineOfFile = new Map<string, number>();
  for (const record of records.slice(1)) {
    if (record.cells.length > columns.length) {
      throw new BandshelfError(
        'BAD_METADATA',
        `the row has ${record.cells.length} cells but the header names ${columns.length} columns`,
        { file, line: record.line },
      );
    }
    const dataFile = record.cells[fileColumn]?.text.trim() ?? '';
    if (dataFile === '') {
      throw new BandshelfError('BAD_METADATA', 'the row names no data file', {
        file,
        line: record.line,
        field: 'file',
      });
    }
    const earlier = lineOfFile.get(dataFile);
    if (earlier !== undefined) {
      throw new BandshelfError('BAD_METADATA', `${dataFile} is already described on line ${earlier}`, {
        file,
        line: record.line,
        field: 'file',
      });
    }
    lineOfFile.set(dataFile, record.line);
    result.set(dataFile, rowMeta(record, columns, file));
  }
  return result;
}

function rowMeta(record: CsvRecord, columns: string[], file: string | undefined): EntryMetaPatch {
  const meta: Record<string, unknown> = {};
  const lines = new Map<string, number>();
  const concentration: Record<string, unknown> = {};
  record.cells.forEach((cell, index) => {
    const field = columns[index]!;
    if (field === 'file' || cell.text.trim() === '') return;
    if (field === unnamed) {
      throw new BandshelfError('BAD_METADATA', `column ${index + 1} has a value but no name in the header`, {
        file,
        line: cell.line,
      });
    }
    const value = metaValueFromText({ field, text: cell.text }, { file, line: cell.line });
    if (field.startsWith('concentration.')) {
      concentration[field.slice('concentration.'.length)] = value;
      lines.set('concentration', cell.line);
    } else {
      meta[field] = value;
      lines.set(field, cell.line);
    }
  });
  if (Object.keys(concentration).length > 0) {
    if (meta['concentration'] !== undefined) {
      throw new BandshelfError(
        'BAD_METADATA',
        'give the concentration in one column or in its two parts, not both',
        {
          file,
          line: record.line,
          field: 'concentration',
        },
      );
    }
    meta['concentration'] = concentration;
  }
  const checked = entryMetaPatchSchema.safeParse(meta);
  if (!checked.success) {
    throw metaErrorFromIssues(checked.error.issues, {
      file,
      line: record.line,
      lineOf: (field) => lines.get(field.split('.')[0]!),
    });
  }
  return checked.data;
}

const normalisedFields = new Map<string, string>([
  ...entryMetaFields.map((f) => [normaliseColumn(f), f] as [string, string]),
  ['file', 'file'],
  ['license', 'licence'],
  ['concentration.value', 'concentration.value'],
  ['concentration.unit', 'concentration.unit'],
]);

function normaliseColumn(name: string): string {
  return name
    .trim()
    .toLowerCase()
    .replace(/[\s_-]+/g, '');
}

// A spreadsheet often saves trailing empty columns: a column without a name is ignored while its cells are
// empty.
const unnamed = '';

function fieldOfColumn(name: string, file: string | undefined, line: number): string {
  if (name.trim() === '') return unnamed;
  const field = normalisedFields.get(normaliseColumn(name));
  if (field !== undefined) return field;
  throw metaErrorFromIssues(
    [{ code: 'unrecognized_keys', keys: [name.trim()], path: [], message: '', input: {} }],
    { file, line, knownFields: ['file', ...entryMetaFields] },
  );
}

// Lists use `;` inside cells, so a `;`-delimited table (a spreadsheet's locale export) cannot be read
// unambiguously.
/**
 * The header's separator: whichever of `,`, tab and `;` it holds most often outside quotes (commas first on a tie),
 * so a table saved by a spreadsheet set to `;` (much of Europe) or tab reads as one written with commas.
 */
function sniffDelimiter(text: string): ',' | '\t' | ';' {
  const lines = text.split(/\r\n|\n|\r/);
  const header = lines.find((l) => l.trim() !== '' && !l.trimStart().startsWith('#')) ?? '';
  const counts = { ',': 0, '\t': 0, ';': 0 };
  let quoted = false;
  for (const c of header) {
    if (c === '"') quoted = !quoted;
    else if (!quoted && (c === ',' || c === '\t' || c === ';')) counts[c]++;
  }
  const order = [',', '\t', ';'] as const;
  return order.reduce((best, d) => (counts[d] > counts[best] ? d : best), order[0]);
}

function parseCsv(text: string, delimiter: string, file: string | undefined): CsvRecord[] {
  const records: CsvRecord[] = [];
  let line = 1;
  let i = 0;
  const n = text.length;
  const newlineAt = (k: number) => text[k] === '\n' || text[k] === '\r';
  const skipNewline = () => {
    if (text[i] === '\r' && text[i + 1] === '\n') i += 2;
    else i += 1;
    line++;
  };
  while (i < n) {
    // Skip blank and comment lines between records.
    let k = i;
    while (k < n && (text[k] === ' ' || text[k] === '\t')) k++;
    if (k >= n) break;
    if (newlineAt(k)) {
      i = k;
      skipNewline();
      continue;
    }
    if (text[k] === '#') {
      while (i < n && !newlineAt(i)) i++;
      if (i < n) skipNewline();
      continue;
    }
    const record: CsvRecord = { cells: [], line };
    for (;;) {
      const cellLine = line;
      let value = '';
      let j = i;
      while (j < n && text[j] === ' ') j++;
      if (text[j] === '"') {
        const opened = line;
        i = j + 1;
        for (;;) {
          if (i >= n) {
            throw new BandshelfError('BAD_METADATA', 'a quoted cell is never closed', { file, line: opened });
          }
          const c = text[i]!;
          if (c === '"') {
            if (text[i + 1] === '"') {
              value += '"';
              i += 2;
              continue;
            }
            i++;
            break;
          }
          if (c === '\r' || c === '\n') {
            value += '\n';
            skipNewline();
            continue;
          }
          value += c;
          i++;
        }
        while (i < n && text[i] === ' ') i++;
        if (i < n && text[i] !== delimiter && !newlineAt(i)) {
          throw new BandshelfError('BAD_METADATA', 'unexpected text after a closing quote', { file, line });
        }
      } else {
        while (i < n && text[i] !== delimiter && !newlineAt(i)) value += text[i++];
      }
      record.cells.push({ text: value, line: cellLine });
      if (i < n && text[i] === delimiter) {
        i++;
        continue;
      }
      if (i < n) skipNewline();
      break;
    }
    records.push(record);
  }
  return records;
}

// Splits JCAMP-DX text into labelled data records and groups them into (possibly nested) blocks.
import type { JcampBlock, JcampRecord } from './jcampTypes.js';
import { normaliseJcampLabel } from './normaliseJcampLabel.js';
import type { ParseWarning } from './types.js';

export interface SplitJcampRecordsResult {
  /** The file's lines, line endings removed (CRLF, CR or LF), `$$` comments removed. */
  lines: string[];
  /** Every block in file order; a nested block comes after the block that holds it. */
  blocks: JcampBlock[];
  warnings: ParseWarning[];
}

/**
 * `$$` starts a comment anywhere on a line (labels and data alike). A line starting with `##` opens a record;
 * the lines up to the next `##` are its body. `##TITLE=` opens a block and `##END=` closes it; a TITLE
 * inside a block that already holds data means its END was left out, which is tolerated with a warning.
 */
export function splitJcampRecords(text: string): SplitJcampRecordsResult {
  const lines = text.split(/\r\n|\r|\n/);
  const warnings: ParseWarning[] = [];
  const blocks: JcampBlock[] = [];
  let current: JcampBlock | undefined;
  let record: JcampRecord | undefined;
  let strayText = -1;
  let missingEnd = -1;

  const closeRecord = (endIndex: number): void => {
    if (record) record.bodyEnd = endIndex;
    record = undefined;
  };
  const hasData = (block: JcampBlock): boolean => block.records.some((r) => DATA_LABELS.has(r.label));

  for (let i = 0; i < lines.length; i++) {
    let line = lines[i]!;
    const comment = line.indexOf('$$');
    if (comment >= 0) {
      line = line.slice(0, comment);
      lines[i] = line;
    }
    const trimmed = line.trimStart();
    if (!trimmed.startsWith('##')) {
      if (!record && trimmed.trim() !== '' && strayText < 0) strayText = i + 1;
      continue;
    }
    closeRecord(i);
    const eq = trimmed.indexOf('=');
    const rawLabel = (eq < 0 ? trimmed.slice(2) : trimmed.slice(2, eq)).trim();
    const value = eq < 0 ? '' : trimmed.slice(eq + 1).trim();
    const label = normaliseJcampLabel(rawLabel);
    // `##$$ note` lost everything after `##` to the comment rule; it is a comment line, not a record.
    if (label === '') continue;
    if (eq < 0) warnings.push({ line: i + 1, message: `label ##${rawLabel} has no '='; read as empty` });
    const rec: JcampRecord = { label, rawLabel, value, line: i + 1, bodyStart: i + 1, bodyEnd: i + 1 };

    if (label === 'TITLE') {
      if (current && hasData(current)) {
        if (missingEnd < 0) missingEnd = i + 1;
        current.closed = true;
        current = current.parent;
      }
      const block: JcampBlock = { records: [], parent: current, line: i + 1, closed: false };
      blocks.push(block);
      current = block;
    } else if (!current) {
      warnings.push({ line: i + 1, message: 'the file does not start with ##TITLE=; read it as one block' });
      current = { records: [], parent: undefined, line: i + 1, closed: false };
      blocks.push(current);
    }
    current.records.push(rec);
    record = rec;
    if (label === 'END') {
      current.closed = true;
      current = current.parent;
      record = undefined;
    }
  }
  closeRecord(lines.length);
  if (strayText > 0) {
    warnings.push({ line: strayText, message: 'text outside any ##label was ignored' });
  }
  if (missingEnd > 0) {
    warnings.push({ line: missingEnd, message: 'a block with data has no ##END= before the next ##TITLE=' });
  }
  if (current && blocks.some((b) => !b.closed && hasData(b))) {
    warnings.push({ line: lines.length, message: 'the file ends without ##END=' });
  }
  return { lines, blocks, warnings };
}

const DATA_LABELS = new Set(['XYDATA', 'XYPOINTS', 'PEAKTABLE', 'NTUPLES', 'PEAKASSIGNMENTS', 'DATATABLE']);

// Converts one metadata value written as text (a manifest cell, `edit --set field=value`) to its typed form.
import { BandshelfError } from '../error.js';
import { type EntryMetaField, type EntryMetaPatch, entryMetaPatchSchema } from '../schema/meta.js';
import { metaErrorFromIssues } from '../schema/metaErrorFromIssues.js';

/** A field name and the text given for it. `concentration.value` and `concentration.unit` address the parts. */
export interface MetaText {
  field: string;
  text: string;
}

export interface MetaValueFromTextOptions {
  /**
   * The file the text came from, for error messages.
   * @default undefined
   */
  file?: string;
  /**
   * The line it came from.
   * @default undefined
   */
  line?: number;
  /**
   * Separator of list fields (synonyms, tags).
   * @default ';'
   */
  listSeparator?: string;
}

const listFields = new Set<string>(['synonyms', 'tags']);
const booleanFields = new Set<string>(['synthetic']);
// Units a number may carry in its text; the value is stored without them (cm⁻¹ and °C are the fields' units).
const numberFields: Record<string, RegExp> = {
  resolution: /^(cm-1|cm⁻¹|cm\^-1|1\/cm|\/cm)$/i,
  temperature: /^(°c|ºc|c|degc|deg c|celsius)$/i,
  'concentration.value': /^$/,
};

/**
 * The typed value of a metadata field given as text: lists split on `;`, numbers with a decimal point or a
 * single decimal comma (and optionally the field's own unit: `4 cm-1`, `25 °C`), booleans as
 * true/false/yes/no/1/0, a concentration as `<number> <unit>` (e.g. `5 mg/mL`), everything else trimmed text.
 * A whole field's value is also checked against the metadata schema; the `concentration.*` parts are checked
 * once assembled.
 */
export function metaValueFromText(
  input: MetaText,
  options: MetaValueFromTextOptions = {},
): EntryMetaPatch[EntryMetaField] {
  const { field } = input;
  const text = input.text.trim();
  const where = { file: options.file, line: options.line, field };
  const fail = (message: string): never => {
    throw new BandshelfError('BAD_METADATA', message, where);
  };
  let value: unknown;
  if (field === 'concentration.unit') return text as never;
  if (field in numberFields) {
    value = numberFromText(text, numberFields[field]!) ?? fail(`${JSON.stringify(text)} is not a number`);
    if (field === 'concentration.value') return value as never;
  } else if (listFields.has(field)) {
    value = text
      .split(options.listSeparator ?? ';')
      .map((item) => item.trim())
      .filter((item) => item.length > 0);
  } else if (booleanFields.has(field)) {
    const lower = text.toLowerCase();
    if (['true', 'yes', '1'].includes(lower)) value = true;
    else if (['false', 'no', '0'].includes(lower)) value = false;
    else fail(`${JSON.stringify(text)} is not true or false`);
  } else if (field === 'concentration') {
    const match = /^(\S+?)\s*([^\d\s.,+-].*)$/.exec(text);
    const amount = match ? numberFromText(match[1]!, /^$/) : undefined;
    if (!match || amount === undefined)
      fail(`${JSON.stringify(text)} is not a concentration such as "5 mg/mL"`);
    value = { value: amount, unit: match![2]!.trim() };
  } else if (field in entryMetaPatchSchema.shape) {
    value = text;
  } else {
    throw metaErrorFromIssues(
      [{ code: 'unrecognized_keys', keys: [field], path: [], message: '', input: {} }],
      {
        file: options.file,
        line: options.line,
      },
    );
  }
  const schema = entryMetaPatchSchema.shape[field as EntryMetaField];
  const checked = schema.safeParse(value);
  if (!checked.success) {
    throw metaErrorFromIssues(checked.error.issues, {
      file: options.file,
      line: options.line,
      prefix: field,
    });
  }
  return checked.data;
}

function numberFromText(text: string, unit: RegExp): number | undefined {
  const match = /^([+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:[eE][+-]?\d+)?)\s*(.*)$/.exec(text);
  if (!match) return undefined;
  const rest = match[2] ?? '';
  if (rest !== '' && !unit.test(rest)) return undefined;
  const value = Number(match[1]!.replace(',', '.'));
  return Number.isFinite(value) ? value : undefined;
}

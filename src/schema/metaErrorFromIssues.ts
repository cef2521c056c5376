// Turns zod's validation issues on metadata into one BandshelfError that names the file, line and field.
import type { z } from 'zod';
import { BandshelfError, type ErrorCode } from '../error.js';
import { entryMetaFields } from './meta.js';

export interface MetaErrorFromIssuesOptions {
  /**
   * The file the metadata came from.
   * @default undefined
   */
  file?: string;
  /**
   * The line of the record, where there is one.
   * @default undefined
   */
  line?: number;
  /**
   * Field name to put before each issue's path (e.g. `recipe` for a sidecar's recipe section).
   * @default undefined
   */
  prefix?: string;
  /**
   * The error code.
   * @default 'BAD_METADATA'
   */
  code?: ErrorCode;
  /**
   * Field names an unknown key is compared against for a "did you mean" hint.
   * @default the entry metadata fields
   */
  knownFields?: readonly string[];
  /**
   * Gives the line of a field, where fields sit on different lines (a manifest cell spanning lines).
   * @default undefined
   */
  lineOf?: (field: string) => number | undefined;
  /**
   * What failed, put before the first issue's message (e.g. `bad grid`, `not a bandshelf match report`).
   * @default undefined
   */
  lead?: string;
  /**
   * One field the error names whatever the issue's path, that path then leading the message: for a value given
   * whole as one option (`grid` for `--grid 4000:600:2`).
   * @default undefined (the first issue's path)
   */
  field?: string;
}

/**
 * The first issue becomes the error (its path is the `field`); the count and fields of any further issues are
 * appended so a user fixes a sidecar in one pass, not one error at a time.
 */
export function metaErrorFromIssues(
  issues: readonly z.core.$ZodIssue[],
  options: MetaErrorFromIssuesOptions = {},
): BandshelfError {
  const described = issues.flatMap((issue) => describe(issue, options));
  const first = described[0] ?? { field: options.prefix, message: 'is not valid' };
  const rest = described.slice(1).map((d) => d.field ?? '(top level)');
  const more = rest.length > 0 ? ` (and ${rest.length} more: ${[...new Set(rest)].join(', ')})` : '';
  const line = first.field && options.lineOf ? (options.lineOf(first.field) ?? options.line) : options.line;
  const inner =
    options.field !== undefined && first.field ? `${first.field}: ${first.message}` : first.message;
  const message = options.lead === undefined ? inner : `${options.lead}: ${inner}`;
  return new BandshelfError(options.code ?? 'BAD_METADATA', `${message}${more}`, {
    file: options.file,
    line,
    field: options.field ?? first.field,
  });
}

function describe(
  issue: z.core.$ZodIssue,
  options: MetaErrorFromIssuesOptions,
): { field: string | undefined; message: string }[] {
  const path = [options.prefix, ...issue.path.map(String)].filter((p) => p !== undefined && p !== '');
  if (issue.code === 'unrecognized_keys') {
    const known = options.knownFields ?? entryMetaFields;
    return issue.keys.map((key) => {
      const hint = closest(key, known);
      return {
        field: [...path, key].join('.'),
        message: `unknown field${hint ? ` (did you mean "${hint}"?)` : ''}`,
      };
    });
  }
  let message = issue.message;
  if (issue.code === 'invalid_value' && 'values' in issue) {
    message = `must be one of ${issue.values.map((v) => String(v)).join(', ')}`;
  } else if (issue.code === 'invalid_type') {
    message = `must be ${article(issue.expected)}`;
  }
  return [{ field: path.length > 0 ? path.join('.') : undefined, message }];
}

function article(expected: string): string {
  if (expected === 'array') return 'a list';
  if (expected === 'object') return 'an object';
  if (expected === 'undefined') return 'absent';
  return `a ${expected}`;
}

// A typo within two edits of a known field gets a hint; further than that, a guess would mislead.
function closest(key: string, known: readonly string[]): string | undefined {
  let best: string | undefined;
  let bestDistance = 3;
  for (const name of known) {
    const d = editDistance(key.toLowerCase(), name.toLowerCase());
    if (d < bestDistance) {
      bestDistance = d;
      best = name;
    }
  }
  return best;
}

function editDistance(a: string, b: string): number {
  let previous = new Uint16Array(b.length + 1);
  let current = new Uint16Array(b.length + 1);
  for (let j = 0; j <= b.length; j++) previous[j] = j;
  for (let i = 1; i <= a.length; i++) {
    current[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      current[j] = Math.min(previous[j]! + 1, current[j - 1]! + 1, previous[j - 1]! + cost);
    }
    [previous, current] = [current, previous];
  }
  return previous[b.length]!;
}

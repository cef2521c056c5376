// Reads a metadata sidecar (JSON) into its sections: entry metadata, an optional recipe, time-domain files.
import { z } from 'zod';
import { BandshelfError } from '../error.js';
import { type EntryMetaPatch, entryMetaPatchSchema } from '../schema/meta.js';
import { metaErrorFromIssues } from '../schema/metaErrorFromIssues.js';
import { type Recipe, recipeSchema } from '../schema/recipe.js';

/** The trace files of a field-resolved measurement, named relative to the sidecar's folder. */
export interface SidecarTimeDomain {
  sample: string[];
  reference: string[];
}

export interface SidecarSections {
  /** Every key that is not a reserved section, validated field by field (id and name may be absent). */
  meta: EntryMetaPatch;
  /** The `recipe` key: a full processing recipe (as `export --all` writes), defaults filled in. */
  recipe?: Recipe;
  /** The `timeDomain` key: `{"sample": [...], "reference": [...]}` (a single name may be a string). */
  timeDomain?: SidecarTimeDomain;
}

export interface ReadSidecarSectionsOptions {
  /**
   * The sidecar's name as the user sees it, for error messages.
   * @default undefined
   */
  file?: string;
  /**
   * Largest sidecar accepted, in characters; metadata is small, so a huge file is a mistake.
   * @default 1_000_000
   */
  maxChars?: number;
}

/** Keys of a sidecar that are not entry metadata. */
const reservedKeys = ['recipe', 'timeDomain'] as const;

// A trace name stays inside the sidecar's folder: no absolute paths, no `..` segments, no control characters.
const traceName = z
  .string()
  .trim()
  .min(1, { message: 'must not be empty' })
  .refine((s) => !/^([/\\]|[A-Za-z]:)/.test(s), { message: 'must be relative to the sidecar folder' })
  .refine((s) => !s.split(/[/\\]/).includes('..'), { message: 'must not contain ".."' })
  .refine((s) => !/\p{Cc}/u.test(s), { message: 'must not contain control characters' });
const traceList = z.union([traceName.transform((s) => [s]), z.array(traceName).min(1)]);
const timeDomainSchema = z.object({ sample: traceList, reference: traceList }).strict();

/**
 * Parses and validates a sidecar. Errors are BandshelfError BAD_METADATA (BAD_RECIPE inside `recipe`) naming
 * the file, the line for JSON syntax errors, and the field as its dotted path (`concentration.value`).
 */
export function readSidecarSections(text: string, options: ReadSidecarSectionsOptions = {}): SidecarSections {
  const file = options.file;
  const maxChars = options.maxChars ?? 1_000_000;
  if (text.length > maxChars) {
    throw new BandshelfError('FILE_TOO_LARGE', `a sidecar over ${maxChars} characters is not metadata`, {
      file,
    });
  }
  const source = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (source.trim() === '') throw new BandshelfError('EMPTY_FILE', 'the sidecar is empty', { file });
  let parsed: unknown;
  try {
    parsed = JSON.parse(source);
  } catch {
    const at = jsonErrorOffset(source);
    const line = source.slice(0, at).split('\n').length;
    throw new BandshelfError('BAD_METADATA', `not valid JSON (near ${JSON.stringify(excerpt(source, at))})`, {
      file,
      line,
    });
  }
  if (parsed === null || typeof parsed !== 'object' || Array.isArray(parsed)) {
    throw new BandshelfError('BAD_METADATA', 'a sidecar must be a JSON object of metadata fields', { file });
  }
  const { recipe, timeDomain, ...metaPart } = parsed as Record<string, unknown>;
  const meta = entryMetaPatchSchema.safeParse(metaPart);
  if (!meta.success) {
    throw metaErrorFromIssues(meta.error.issues, {
      file,
      knownFields: [...Object.keys(entryMetaPatchSchema.shape), ...reservedKeys],
    });
  }
  const sections: SidecarSections = { meta: meta.data };
  if (recipe !== undefined) {
    const checked = recipeSchema.safeParse(recipe);
    if (!checked.success) {
      throw metaErrorFromIssues(checked.error.issues, {
        file,
        prefix: 'recipe',
        code: 'BAD_RECIPE',
        knownFields: Object.keys(recipeSchema.shape),
      });
    }
    sections.recipe = checked.data;
  }
  if (timeDomain !== undefined) {
    const checked = timeDomainSchema.safeParse(timeDomain);
    if (!checked.success) {
      throw metaErrorFromIssues(checked.error.issues, {
        file,
        prefix: 'timeDomain',
        knownFields: ['sample', 'reference'],
      });
    }
    sections.timeDomain = checked.data;
  }
  return sections;
}

function excerpt(text: string, at: number): string {
  return text.slice(Math.max(0, at - 10), at + 10).replace(/\s+/g, ' ');
}

// JSON.parse in Node 20 does not say where it failed, so a minimal JSON scanner finds the offending offset.
function jsonErrorOffset(text: string): number {
  let i = 0;
  const fail = (): never => {
    throw i;
  };
  const space = () => {
    while (i < text.length && ' \t\n\r'.includes(text[i]!)) i++;
  };
  const literal = (word: string) => {
    if (text.startsWith(word, i)) i += word.length;
    else fail();
  };
  const string = () => {
    i++;
    while (i < text.length && text[i] !== '"') {
      if (text.charCodeAt(i) < 0x20) fail();
      if (text[i] === '\\') {
        i++;
        if (text[i] === 'u') {
          if (!/^[0-9a-fA-F]{4}$/.test(text.slice(i + 1, i + 5))) fail();
          i += 4;
        } else if (!'"\\/bfnrt'.includes(text[i] ?? 'x')) fail();
      }
      i++;
    }
    if (i >= text.length) fail();
    i++;
  };
  const value = (): void => {
    space();
    const c = text[i];
    if (c === '{') {
      i++;
      space();
      if (text[i] === '}') {
        i++;
        return;
      }
      for (;;) {
        space();
        if (text[i] !== '"') fail();
        string();
        space();
        if (text[i] !== ':') fail();
        i++;
        value();
        space();
        if (text[i] === ',') i++;
        else if (text[i] === '}') {
          i++;
          return;
        } else fail();
      }
    } else if (c === '[') {
      i++;
      space();
      if (text[i] === ']') {
        i++;
        return;
      }
      for (;;) {
        value();
        space();
        if (text[i] === ',') i++;
        else if (text[i] === ']') {
          i++;
          return;
        } else fail();
      }
    } else if (c === '"') string();
    else if (c === 't') literal('true');
    else if (c === 'f') literal('false');
    else if (c === 'n') literal('null');
    else {
      const m = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/.exec(text.slice(i));
      if (!m) fail();
      i += m![0].length;
    }
  };
  try {
    value();
    space();
    return i;
  } catch (offset) {
    return typeof offset === 'number' ? Math.min(offset, text.length) : 0;
  }
}

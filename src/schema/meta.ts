// The entry metadata schema: what a lab records about each reference spectrum, validated field by field.
import { z } from 'zod';
import { casCheckDigitValid } from './casCheckDigitValid.js';

/** Biomolecule and sample classes an entry can belong to. */
export const entryClasses = [
  'protein',
  'lipid',
  'carbohydrate',
  'nucleic-acid',
  'metabolite',
  'drug',
  'solvent',
  'buffer',
  'mixture',
  'biofluid',
  'other',
] as const;
export type EntryClass = (typeof entryClasses)[number];

/** How the spectrum was measured. */
export const techniques = [
  'atr',
  'transmission',
  'diffuse-reflectance',
  'tunable-laser',
  'field-resolved',
  'other',
] as const;
export type Technique = (typeof techniques)[number];

// C0 and C1 control characters and DEL; tabs and newlines are only allowed in free text (notes, citations).
const controlCharacters = /\p{Cc}/u;
const controlCharactersExceptWhitespace = /[^\P{Cc}\t\n\r]/u;

/** A one-line text field: trimmed, non-empty, no control characters. */
function line(max: number) {
  return z
    .string()
    .trim()
    .min(1, { message: 'must not be empty' })
    .max(max, { message: `must be at most ${max} characters` })
    .refine((s) => !controlCharacters.test(s), { message: 'must not contain control characters' });
}

/** Free text that may span lines. */
function text(max: number) {
  return z
    .string()
    .trim()
    .max(max, { message: `must be at most ${max} characters` })
    .refine((s) => !controlCharactersExceptWhitespace.test(s), {
      message: 'must not contain control characters',
    });
}

/**
 * The entry id becomes a file name, a URL path segment and a command-line argument, so it is a strict slug:
 * lowercase letters, digits, `-`, `_`, `.`, starting with a letter or digit, no `..`, at most 80 characters.
 */
export const entryIdSchema = z
  .string()
  .superRefine((id, ctx) => {
    const problem = entryIdProblem(id);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  })
  .meta({
    description:
      'Slug: lowercase letters, digits, "-", "_", "."; starts with a letter or digit; no ".."; not ending in "."; not a Windows device name (con, nul, com1…); ≤ 80.',
    pattern:
      '^(?!.*\\.\\.)(?!.*\\.$)(?!(?:con|prn|aux|nul|com[0-9]|lpt[0-9])(?:\\.|$))[a-z0-9][a-z0-9._-]{0,79}$',
  });

function entryIdProblem(id: string): string | undefined {
  if (id.length === 0) return 'must not be empty';
  if (id.length > 80) return `must be at most 80 characters (it has ${id.length})`;
  if (controlCharacters.test(id)) return 'must not contain control characters';
  if (/[/\\]/.test(id)) return 'must not contain a path separator';
  if (id.includes('..')) return 'must not contain ".."';
  if (/[A-Z]/.test(id)) return 'must be lowercase';
  if (!/^[a-z0-9]/.test(id)) return 'must start with a lowercase letter or a digit';
  const bad = /[^a-z0-9._-]/.exec(id);
  if (bad)
    return `must use only lowercase letters, digits, "-", "_" and "." (found ${JSON.stringify(bad[0])})`;
  // Windows reserves these device names, with any extension, so export and site files could not be copied there.
  if (/^(con|prn|aux|nul|com[0-9]|lpt[0-9])(\..*)?$/i.test(id))
    return 'is a name Windows reserves for a device';
  if (id.endsWith('.')) return 'must not end with "." (Windows drops it from file names)';
  return undefined;
}

const casSchema = z
  .string()
  .trim()
  .regex(/^[1-9]\d{1,6}-\d{2}-\d$/, { message: 'must look like a CAS Registry Number, e.g. 7732-18-5' })
  .refine((cas) => casCheckDigitValid(cas), { message: 'has a wrong check digit' });

const inchiKeySchema = z
  .string()
  .trim()
  .regex(/^[A-Z]{14}-[A-Z]{10}-[A-Z]$/, {
    message: 'must be an InChIKey: 14 capital letters, "-", 10 capital letters, "-", 1 capital letter',
  });

// Element symbols, digits, brackets, charges, hydrate dots: a light check that rejects prose, not chemistry.
const formulaSchema = line(120).refine((f) => /^[A-Za-z0-9()[\]·.+\-\s]+$/.test(f) && /[A-Z]/.test(f), {
  message: 'must be a molecular formula such as C6H12O6',
});

const isoDateSchema = z
  .string()
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, { message: 'must be an ISO date yyyy-mm-dd' })
  .refine(
    (d) => {
      const [y, m, day] = d.split('-').map(Number) as [number, number, number];
      const t = new Date(Date.UTC(y, m - 1, day));
      return t.getUTCFullYear() === y && t.getUTCMonth() === m - 1 && t.getUTCDate() === day;
    },
    { message: 'is not a calendar date' },
  );

// An SPDX licence id (e.g. CC-BY-4.0, CC0-1.0, LicenseRef-lab) or a simple AND/OR/WITH expression of them.
const spdxId = '[A-Za-z0-9][A-Za-z0-9.+-]*';
const licenceSchema = z
  .string()
  .trim()
  .regex(new RegExp(`^\\(?${spdxId}(\\s+(AND|OR|WITH)\\s+\\(?${spdxId}\\)?)*\\)?$`), {
    message: 'must be an SPDX licence identifier such as CC-BY-4.0',
  });

// A DOI (bare, doi:, or as a doi.org URL) is checked for shape; anything else is taken as a citation.
const sourceSchema = text(1000)
  .pipe(z.string().min(1, { message: 'must not be empty' }))
  .refine(
    (s) => {
      const doi = /^(?:doi:\s*|https?:\/\/(?:dx\.)?doi\.org\/)?(10\.[^\s]*)$/i.exec(s);
      if (!doi) return true;
      return /^10\.\d{4,9}\/\S+$/.test(doi[1] ?? '');
    },
    { message: 'looks like a DOI but is not one (expected 10.NNNN/suffix)' },
  );

const tagSchema = line(60).refine((t) => !t.includes(';'), { message: 'must not contain ";"' });

/** An enum whose values are lower case, accepting any case (`Biofluid`, `ATR`) and stray spaces around. */
function caseInsensitiveEnum<const T extends readonly [string, ...string[]]>(values: T) {
  return z.preprocess((v) => (typeof v === 'string' ? v.trim().toLowerCase() : v), z.enum(values));
}

/** Metadata of one entry. Only `id` and `name` are required. */
export const entryMetaSchema = z
  .object({
    id: entryIdSchema,
    name: line(300),
    synonyms: z.array(line(300)).max(100),
    class: caseInsensitiveEnum(entryClasses),
    formula: formulaSchema,
    inchiKey: inchiKeySchema,
    cas: casSchema,
    /** How the sample was presented, e.g. dried film, liquid, powder, KBr pellet. */
    sampleForm: line(120),
    preparation: text(2000),
    solvent: line(120),
    concentration: z
      .object({
        value: z.number().finite().nonnegative(),
        unit: line(40),
      })
      .strict(),
    technique: caseInsensitiveEnum(techniques),
    /** Spectral resolution in cm⁻¹. */
    resolution: z.number().finite().positive(),
    /** Sample temperature in °C. */
    temperature: z
      .number()
      .finite()
      .min(-273.15, { message: 'must not be below absolute zero (−273.15 °C)' }),
    contributor: line(200),
    /** Measurement date, ISO yyyy-mm-dd. */
    date: isoDateSchema,
    /** SPDX licence identifier. */
    licence: licenceSchema,
    /** A DOI or a citation. */
    source: sourceSchema,
    tags: z.array(tagSchema).max(100),
    notes: text(10000),
    /** True for invented demo data. */
    synthetic: z.boolean(),
    /** JCAMP-DX ORIGIN, OWNER, STATE and SAMPLING PROCEDURE labels, carried from the file when present. */
    origin: line(300),
    owner: line(300),
    state: line(120),
    samplingProcedure: line(300),
  })
  .partial()
  .required({ id: true, name: true })
  .strict();

/** Any subset of the fields, each valid on its own: a sidecar, a manifest row, an `edit --set`. */
export const entryMetaPatchSchema = entryMetaSchema.partial();

export type EntryMeta = z.output<typeof entryMetaSchema>;
export type EntryMetaInput = z.input<typeof entryMetaSchema>;
export type EntryMetaPatch = z.input<typeof entryMetaPatchSchema>;
/** The names of the metadata fields, in schema order. */
export type EntryMetaField = keyof EntryMeta;
export const entryMetaFields = Object.keys(entryMetaSchema.shape) as EntryMetaField[];

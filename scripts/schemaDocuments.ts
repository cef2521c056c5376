// The JSON Schema documents bandshelf publishes in schema/, generated from its zod schemas (input side: what a
// user may write, defaults optional).
import { z } from 'zod';
import { bandAssignmentSchema } from '../src/schema/bandAssignment.js';
import { bundleSchema } from '../src/schema/bundle.js';
import { contrastReportSchema } from '../src/schema/contrastReport.js';
import { matchReportSchema } from '../src/schema/matchReport.js';
import { entryMetaSchema } from '../src/schema/meta.js';
import { recipeSchema } from '../src/schema/recipe.js';

const SCHEMAS: { file: string; title: string; description: string; schema: z.ZodType }[] = [
  {
    file: 'recipe.schema.json',
    title: 'bandshelf processing recipe',
    description:
      'The processing steps stored with every revision; together with the original data they fully determine the processed vector.',
    schema: recipeSchema,
  },
  {
    file: 'entry-meta.schema.json',
    title: 'bandshelf entry metadata',
    description:
      'Metadata of one library entry, as written in a sidecar (NAME.meta.json), a manifest row or edit --meta.',
    schema: entryMetaSchema,
  },
  {
    file: 'band-assignment.schema.json',
    title: 'bandshelf band assignment',
    description:
      'One row of the band-assignment table: a wavenumber range, the vibration, the group and its published source.',
    schema: bandAssignmentSchema,
  },
  {
    file: 'match-report.schema.json',
    title: 'bandshelf match report',
    description:
      'What match --json and --report write: the query, the library state, hits, mixture and bands.',
    schema: matchReportSchema,
  },
  {
    file: 'contrast-report.schema.json',
    title: 'bandshelf contrast report',
    description:
      'Two groups of spectra compared at every grid point (Welch t-test, Benjamini–Hochberg q-values, Hedges g) and the difference bands, printed by contrast --json.',
    schema: contrastReportSchema,
  },
  {
    file: 'library-bundle.schema.json',
    title: 'bandshelf library bundle',
    description:
      'A library with its whole history (every revision with its original bytes, recipe, metadata, peaks and QC; reviews; releases; lab band-assignment rows), written gzip-compressed by export --bundle and read by import.',
    schema: bundleSchema,
  },
];

/** File name → document text (two-space JSON, trailing newline), in a fixed order. */
export function schemaDocuments(): Map<string, string> {
  const out = new Map<string, string>();
  for (const s of SCHEMAS) {
    const generated = z.toJSONSchema(s.schema, { io: 'input' }) as Record<string, unknown>;
    const { $schema, ...rest } = generated;
    const document = { $schema, title: s.title, description: s.description, ...rest };
    out.set(s.file, `${JSON.stringify(document, null, 2)}\n`);
  }
  return out;
}

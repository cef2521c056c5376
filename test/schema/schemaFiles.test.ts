// The published JSON Schema files in schema/ are current: regenerating them from the zod schemas changes nothing.
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { schemaDocuments } from '../../scripts/schemaDocuments.js';
import { ROOT } from '../cli/bandshelfCli.js';

const dir = join(ROOT, 'schema');

describe('schema/*.schema.json', () => {
  const documents = schemaDocuments();

  it('covers the recipe, entry metadata, band assignment, match report, contrast report and library bundle', () => {
    expect([...documents.keys()].sort()).toEqual([
      'band-assignment.schema.json',
      'contrast-report.schema.json',
      'entry-meta.schema.json',
      'library-bundle.schema.json',
      'match-report.schema.json',
      'recipe.schema.json',
    ]);
  });

  for (const [name, text] of documents) {
    it(`${name} is current (run \`npm run schema\` after changing a zod schema)`, () => {
      const file = join(dir, name);
      expect(existsSync(file), `${name} is missing`).toBe(true);
      expect(readFileSync(file, 'utf8')).toBe(text);
    });
  }

  it('holds no stale files and every document is a draft 2020-12 schema with a title', () => {
    const stale = readdirSync(dir).filter((f) => f.endsWith('.schema.json') && !documents.has(f));
    expect(stale).toEqual([]);
    for (const text of documents.values()) {
      const doc = JSON.parse(text) as Record<string, unknown>;
      expect(doc.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
      expect(typeof doc.title).toBe('string');
    }
    const meta = JSON.parse(documents.get('entry-meta.schema.json')!) as {
      required: string[];
      properties: object;
    };
    expect(meta.required.sort()).toEqual(['id', 'name']);
    expect(Object.keys(meta.properties)).toContain('inchiKey');
  });
});

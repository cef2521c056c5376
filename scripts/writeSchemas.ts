// `npm run schema`: writes schema/*.schema.json from the zod schemas (a test checks the committed files are current).
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { schemaDocuments } from './schemaDocuments.js';

export interface WriteSchemasOptions {
  /** Print each file written.
   * @default false */
  verbose?: boolean;
}

/** Writes every schema document into `dir` (created if missing) and returns the file names. */
export function writeSchemas(dir: string, options: WriteSchemasOptions = {}): string[] {
  mkdirSync(dir, { recursive: true });
  const names: string[] = [];
  for (const [name, text] of schemaDocuments()) {
    writeFileSync(join(dir, name), text);
    names.push(name);
    if (options.verbose) process.stdout.write(`wrote ${join(dir, name)}\n`);
  }
  return names;
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  writeSchemas(resolve(process.argv[2] ?? 'schema'), { verbose: true });
}

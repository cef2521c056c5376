#!/usr/bin/env node
// The package's bin: runs the bundled CLI, building it first when a checkout has not been built yet.
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const bundle = join(root, 'dist', 'bandshelf.js');
if (!existsSync(bundle)) {
  const { buildAll } = await import('./build.mjs');
  await buildAll();
}
const { main } = await import(pathToFileURL(bundle).href);
process.exitCode = await main(process.argv.slice(2));

// Compiles scoreKernels.wat with wabt into the base64 module strings committed in src/match/scoreKernelsWasm.ts.
// Run `node src/match/wasm/compileScoreKernels.mjs` after editing the WAT; a test checks the committed bytes are current.

import { readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import wabt from 'wabt';

const here = dirname(fileURLToPath(import.meta.url));
const watPath = join(here, 'scoreKernels.wat');
const outPath = join(here, '..', 'scoreKernelsWasm.ts');
const unshared = '(import "env" "memory" (memory 1 65536))';
const shared = '(import "env" "memory" (memory 1 65536 shared))';

/** Both variants of the module as base64: `plain` imports an ordinary memory, `shared` a shared one. */
export async function compileScoreKernels() {
  const source = readFileSync(watPath, 'utf8');
  if (!source.includes(unshared)) throw new Error(`${watPath} must import its memory as ${unshared}`);
  const toolkit = await wabt();
  const compile = (text, name) => {
    const features = { simd: true, threads: true };
    const module = toolkit.parseWat(name, text, features);
    try {
      // validate() takes the feature set too, though wabt's typings omit the argument.
      module.validate(features);
      return Buffer.from(module.toBinary({ canonicalize_lebs: true }).buffer).toString('base64');
    } finally {
      module.destroy();
    }
  };
  return {
    plain: compile(source, 'scoreKernels.wat'),
    shared: compile(source.replace(unshared, shared), 'scoreKernels.shared.wat'),
  };
}

/** The TypeScript module text holding both variants. */
export function scoreKernelsModuleText(variants) {
  return [
    '// The score kernels of wasm/scoreKernels.wat as WebAssembly module bytes in base64 (generated: run',
    '// `node src/match/wasm/compileScoreKernels.mjs` after editing the WAT; a test checks these are current).',
    '',
    '/** `plain` imports an ordinary memory (any browser page); `shared` a shared one (Node worker threads). */',
    'export const scoreKernelsWasm = {',
    // Laid out as the formatter lays out a string too long for one line, so formatting leaves the file alone.
    '  plain:',
    `    '${variants.plain}',`,
    '  shared:',
    `    '${variants.shared}',`,
    '} as const;',
    '',
  ].join('\n');
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  writeFileSync(outPath, scoreKernelsModuleText(await compileScoreKernels()));
  console.log(`wrote ${outPath}`);
}

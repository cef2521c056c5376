// `npm run demo:data`: regenerates the synthetic demo files in library/ (the committed copies must match; a test checks).
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { generateDemoLibrary } from '../src/demo/generateDemoLibrary.js';

for (const file of generateDemoLibrary()) {
  const target = join('library', file.path);
  mkdirSync(dirname(target), { recursive: true });
  writeFileSync(target, file.content);
}
process.stdout.write('library/ regenerated\n');

// The committed demo collection is exactly what the seeded generator makes, and every entry says it is synthetic.
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { demoCompounds } from '../../src/demo/demoCompounds.js';
import { generateDemoLibrary } from '../../src/demo/generateDemoLibrary.js';
import { casCheckDigitValid } from '../../src/schema/casCheckDigitValid.js';
import { entryClasses } from '../../src/schema/meta.js';

const libraryDir = join(resolve(dirname(fileURLToPath(import.meta.url)), '..', '..'), 'library');

describe('generateDemoLibrary', () => {
  const files = generateDemoLibrary();

  it('reproduces the committed library/ byte for byte (run `npm run demo:data` after changing the generator)', () => {
    for (const file of files) {
      const target = join(libraryDir, file.path);
      expect(existsSync(target), file.path).toBe(true);
      expect(readFileSync(target, 'utf8') === file.content, file.path).toBe(true);
    }
  });

  it('is deterministic for a seed and changes with it', () => {
    const again = generateDemoLibrary();
    expect(again.map((f) => f.content)).toEqual(files.map((f) => f.content));
    const other = generateDemoLibrary({ seed: 7 });
    expect(other[0]!.content).not.toBe(files[0]!.content);
  });

  it('labels every sidecar synthetic', () => {
    const sidecars = files.filter((f) => f.path.endsWith('.meta.json'));
    expect(sidecars.length).toBeGreaterThanOrEqual(40);
    for (const s of sidecars) expect(JSON.parse(s.content).synthetic, s.path).toBe(true);
  });

  it('covers every class of the metadata schema but "other"', () => {
    const classes = new Set(
      files.filter((f) => f.path.endsWith('.meta.json')).map((f) => JSON.parse(f.content).class as string),
    );
    for (const c of entryClasses.filter((c) => c !== 'other')) {
      expect(classes.has(c), c).toBe(true);
    }
  });

  it('gives only CAS numbers whose check digit is right (check-digit rule published by the CAS registry)', () => {
    for (const c of demoCompounds)
      if (c.cas) expect(casCheckDigitValid(c.cas), `${c.id} ${c.cas}`).toBe(true);
  });
});

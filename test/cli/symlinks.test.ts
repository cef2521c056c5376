// Symbolic links inside an added folder are followed once (no loops, no file twice) or listed as skipped with the
// reason, through the real `bandshelf add`.
import { mkdirSync, symlinkSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bandsFor, bandshelf, parseJson, tempDir, writeSpectrumCsv } from './bandshelfCli.js';

describe('symbolic links in an added folder', () => {
  it.skipIf(process.platform === 'win32')(
    'follows links to files and folders once; lists loops, duplicates and dangling links',
    () => {
      const dir = tempDir();
      const lib = ['--library', join(dir, 'lib.sqlite')];
      expect(bandshelf(['init', ...lib]).code).toBe(0);
      const refs = join(dir, 'refs');
      const outside = join(dir, 'outside');
      mkdirSync(join(refs, 'sub'), { recursive: true });
      mkdirSync(outside);
      writeSpectrumCsv(join(refs, 'alpha.csv'), bandsFor(21));
      writeSpectrumCsv(join(outside, 'beta.csv'), bandsFor(22));
      writeSpectrumCsv(join(outside, 'gamma.csv'), bandsFor(23));
      symlinkSync(join(refs, 'alpha.csv'), join(refs, 'again.csv')); // the same file twice
      symlinkSync(refs, join(refs, 'sub', 'loop')); // back to an ancestor
      symlinkSync(join(dir, 'missing.csv'), join(refs, 'dangling.csv'));
      symlinkSync(outside, join(refs, 'linked')); // a folder elsewhere: followed
      symlinkSync(join(outside, 'gamma.csv'), join(refs, 'gamma-link.csv')); // a file elsewhere, already via linked/
      const add = bandshelf(['add', refs, ...lib, '--json']);
      expect(add.code, add.stderr).toBe(0);
      const out = parseJson<{ added: { id: string }[] }>(add.stdout);
      expect(out.added.map((a) => a.id).sort()).toEqual(['alpha', 'beta', 'gamma']);
      expect(add.stderr).toMatch(
        /again\.csv: skipped \(a symbolic link to the same file as alpha\.csv, which is added already\)/,
      );
      expect(add.stderr).toMatch(/loop: skipped \(a symbolic link back to a folder it is in \(a loop\)\)/);
      expect(add.stderr).toMatch(/dangling\.csv: skipped \(a symbolic link to nothing\)/);
      expect(add.stderr).toMatch(
        /gamma-link\.csv: skipped \(a symbolic link to the same file as linked\/gamma\.csv, which is added already\)/,
      );
    },
  );
});

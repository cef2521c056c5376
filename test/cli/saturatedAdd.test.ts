// A real file with a saturated band goes in with `add`, keeps its saturated points out of the processed vector, and
// passes `check`: what `add` accepts, `check` passes.
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bandshelf, ROOT } from './bandshelfCli.js';

const file = join(ROOT, '..', 'shared', 'real-spectra', 'jcamp', 'BRUKER1.JCM');

describe.skipIf(!existsSync(file))('add of a real file whose transmittance reaches 0 in a band', () => {
  it('stores it with the saturated cells not covered, and check passes', () => {
    // BRUKER1.JCM: jcamp-dx.org official test data (../shared/real-spectra/PROVENANCE.md); its %T dips to −0.29
    // (expected.json y_min), the noise of a saturated band.
    const library = join(mkdtempSync(join(tmpdir(), 'bandshelf-sat-')), 'lab.sqlite');
    expect(bandshelf(['init', '--library', library, '--grid', '4000:600:2']).code).toBe(0);
    const add = bandshelf([
      'add',
      file,
      '--id',
      'bruker-1',
      '--class',
      'other',
      '--library',
      library,
      '--json',
    ]);
    expect(add.code, add.stderr).toBe(0);
    expect(add.stderr + add.stdout).toMatch(/absorbance ceiling/);
    const show = bandshelf(['show', 'bruker-1', '--json', '--library', library]);
    expect(show.code, show.stderr).toBe(0);
    const check = bandshelf(['check', '--library', library]);
    expect(check.code, check.stdout + check.stderr).toBe(0);
  });
});

// buildRevisionInputs without the CLI: metadata merged in the documented order (flags > --meta file > sidecar >
// manifest > the file's own labels, as DEVELOPERS.md and the module header state), the id made from the file
// name, and a recipe naming an entry of the same add left for a later pass.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../../src/error.js';
import { buildRevisionInputs } from '../../../src/library/ingest/buildRevisionInputs.js';
import { prepareRevision } from '../../../src/library/ingest/prepareRevision.js';
import { waitsForAnotherEntry } from '../../../src/library/ingest/waitsForAnotherEntry.js';
import { bandsFor, writeSpectrumCsv } from '../../cli/bandshelfCli.js';
import { newLibrary } from '../libraryFixture.js';

describe('buildRevisionInputs', () => {
  it('merges flags over the sidecar over the manifest row, and slugs the id from the file name', () => {
    const { library, dir } = newLibrary();
    const data = join(dir, 'My Sample.csv');
    const sidecar = join(dir, 'My Sample.meta.json');
    writeSpectrumCsv(data, bandsFor(6));
    writeFileSync(sidecar, JSON.stringify({ name: 'From the sidecar', class: 'protein' }));
    const [input, ...more] = buildRevisionInputs(
      library,
      {
        label: 'My Sample.csv',
        dataPath: data,
        sidecarPath: sidecar,
        samplePaths: [],
        referencePaths: [],
        manifestMeta: { name: 'From the manifest', class: 'lipid', tags: ['manifest-row'] },
      },
      { flags: { name: 'From a flag' } },
    );
    expect(more).toEqual([]);
    expect(input!.meta).toMatchObject({
      id: 'my-sample',
      name: 'From a flag',
      class: 'protein',
      tags: ['manifest-row'],
    });
    expect(input!.label).toBe('My Sample.csv');
    expect(input!.files.map((f) => [f.role, f.name])).toEqual([['data', 'My Sample.csv']]);
    // The CSV is written from 4000 cm⁻¹ down; the input holds it ascending, as every reader returns it.
    const x = input!.original.wavenumber;
    expect(x[0]!).toBeLessThan(x[x.length - 1]!);
  });

  it('keeps a reference to an entry not yet added unpinned; preparing it then waits for that entry', () => {
    const { library, dir } = newLibrary();
    const data = join(dir, 'a-serum.csv');
    const sidecar = join(dir, 'a-serum.meta.json');
    writeSpectrumCsv(data, bandsFor(7));
    writeFileSync(sidecar, JSON.stringify({ recipe: { reference: { id: 'z-water' } } }));
    const [input] = buildRevisionInputs(library, {
      label: 'a-serum.csv',
      dataPath: data,
      sidecarPath: sidecar,
      samplePaths: [],
      referencePaths: [],
    });
    expect(input!.recipe.reference).toMatchObject({ id: 'z-water' });
    expect(input!.recipe.reference?.revision).toBeUndefined();
    let thrown: unknown;
    try {
      prepareRevision(library, input!);
    } catch (error) {
      thrown = error;
    }
    expect(thrown).toBeInstanceOf(BandshelfError);
    expect((thrown as BandshelfError).field).toBe('reference.id');
    expect(waitsForAnotherEntry(thrown)).toBe(true);
  });

  it('refuses a job that planning already found broken, with planning’s error', () => {
    const { library } = newLibrary();
    const error = new BandshelfError('IO_ERROR', 'no such file or folder', { file: 'gone.csv' });
    expect(() =>
      buildRevisionInputs(library, { label: 'gone.csv', samplePaths: [], referencePaths: [], error }),
    ).toThrow(error);
  });
});

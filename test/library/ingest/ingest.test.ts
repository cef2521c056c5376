// ingest() without the CLI: a sidecar's metadata lands, an atomic ingest with one bad file stores nothing, and a
// file whose recipe names an entry added later in the same call waits for it.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ingest } from '../../../src/library/ingest/ingest.js';
import { listEntries } from '../../../src/library/store/listEntries.js';
import { readEntry } from '../../../src/library/store/readEntry.js';
import { bandsFor, writeSpectrumCsv } from '../../cli/bandshelfCli.js';
import { newLibrary } from '../libraryFixture.js';

describe('ingest', () => {
  it('takes the entry name from the sidecar beside the file', () => {
    const { library, dir } = newLibrary();
    writeSpectrumCsv(join(dir, 'a.csv'), bandsFor(1), { seed: 3 });
    writeFileSync(join(dir, 'a.meta.json'), JSON.stringify({ name: 'Sidecar name', class: 'protein' }));
    const outcome = ingest(library, ['a.csv'], { cwd: dir, author: 't' });
    expect(outcome.failed).toEqual([]);
    expect(outcome.added.map((o) => o.id)).toEqual(['a']);
    expect(listEntries(library).find((e) => e.id === 'a')?.name).toBe('Sidecar name');
  });

  it('stores nothing when one file of an atomic ingest fails', () => {
    const { library, dir } = newLibrary();
    writeSpectrumCsv(join(dir, 'good.csv'), bandsFor(2), { seed: 4 });
    writeFileSync(join(dir, 'bad.csv'), 'wavenumber_cm-1,absorbance\nnot,numbers\n');
    const outcome = ingest(library, ['good.csv', 'bad.csv'], { cwd: dir, atomic: true, author: 't' });
    expect(outcome.failed.map((f) => f.file)).toEqual(['bad.csv']);
    expect(outcome.added).toEqual([]);
    expect(listEntries(library)).toEqual([]);
  });

  it('retries a file whose recipe subtracts an entry that comes later in the same ingest, and pins it', () => {
    const { library, dir } = newLibrary();
    writeSpectrumCsv(join(dir, 'a-serum.csv'), [
      { position: 1652, height: 0.6, fwhm: 30 },
      { position: 2100, height: 0.05, fwhm: 150 },
    ]);
    writeFileSync(
      join(dir, 'a-serum.meta.json'),
      JSON.stringify({ recipe: { reference: { id: 'z-water', window: { min: 1900, max: 2300 } } } }),
    );
    writeSpectrumCsv(join(dir, 'z-water.csv'), [
      { position: 2100, height: 0.1, fwhm: 150 },
      { position: 1643, height: 0.3, fwhm: 60 },
    ]);
    const seen: string[] = [];
    const outcome = ingest(library, ['a-serum.csv', 'z-water.csv'], {
      cwd: dir,
      author: 't',
      progress: (done, total, label) => seen.push(`${done}/${total} ${label}`),
    });
    expect(outcome.failed).toEqual([]);
    // z-water lands first; a-serum, tried first, waited and landed on the second pass.
    expect(outcome.added.map((o) => o.id)).toEqual(['z-water', 'a-serum']);
    expect(seen).toEqual(['1/2 z-water.csv', '2/2 a-serum.csv']);
    expect(readEntry(library, 'a-serum').recipe.reference).toMatchObject({ id: 'z-water', revision: 1 });
  });

  it('fails a waiting file once no pass adds what it waits for', () => {
    const { library, dir } = newLibrary();
    writeSpectrumCsv(join(dir, 'a-serum.csv'), bandsFor(8));
    writeFileSync(
      join(dir, 'a-serum.meta.json'),
      JSON.stringify({ recipe: { reference: { id: 'z-water' } } }),
    );
    const outcome = ingest(library, ['a-serum.csv'], { cwd: dir, author: 't' });
    expect(outcome.added).toEqual([]);
    expect(outcome.failed).toHaveLength(1);
    expect(outcome.failed[0]!.error).toMatch(/reference\.id: .*z-water.*\[NOT_FOUND\]$/);
  });
});

// ingest() without the CLI: a sidecar's metadata lands, and an atomic ingest with one bad file stores nothing.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ingest } from '../../../src/library/ingest/ingest.js';
import { listEntries } from '../../../src/library/store/listEntries.js';
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
});

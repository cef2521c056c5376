// An in-process library for the store's own tests: entries made from small Gaussian spectra, no CLI involved.
import { join } from 'node:path';
import type { RevisionInput } from '../../src/library/ingest/ingestTypes.js';
import { prepareRevision } from '../../src/library/ingest/prepareRevision.js';
import { commitRevisions } from '../../src/library/store/commitRevisions.js';
import { createRelease } from '../../src/library/store/createRelease.js';
import { initLibrary } from '../../src/library/store/initLibrary.js';
import type { Library } from '../../src/library/types.js';
import { type Band, syntheticSpectrum, tempDir } from '../cli/bandshelfCli.js';

export function newLibrary(): { library: Library; dir: string } {
  const dir = tempDir('bandshelf-lib-');
  return {
    library: initLibrary(join(dir, 'lib.sqlite'), { name: 'fixture', now: new Date('2026-01-02T03:04:05Z') }),
    dir,
  };
}

/** A revision input as `add` would build it from a CSV of these bands (`step`: its spacing, cm⁻¹). */
export function inputFor(library: Library, id: string, bands: Band[], seed = 1, step = 2): RevisionInput {
  const s = syntheticSpectrum(bands, { seed, step });
  const text = `wavenumber_cm-1,absorbance\n${s.x.map((x, i) => `${x},${s.y[i]!.toFixed(6)}`).join('\n')}\n`;
  const order = s.x.map((_, i) => s.x.length - 1 - i);
  return {
    label: `${id}.csv`,
    files: [{ role: 'data', name: `${id}.csv`, bytes: new TextEncoder().encode(text) }],
    read: {},
    original: {
      wavenumber: Float64Array.from(order, (i) => s.x[i]!),
      absorbance: Float64Array.from(order, (i) => Number(s.y[i]!.toFixed(6))),
    },
    meta: { id, name: id.toUpperCase(), class: 'other' },
    recipe: library.recipe,
    extras: {},
  };
}

export function addEntry(library: Library, id: string, bands: Band[], seed = 1) {
  const prepared = prepareRevision(library, inputFor(library, id, bands, seed), { force: true });
  return commitRevisions(library, [prepared], {
    author: 'fixture',
    now: new Date('2026-01-02T03:04:05Z'),
  })[0]!;
}

/**
 * Three entries added out of id order (carbo, amide, lipid: the state is sorted by id) and a release `r1` of
 * them, so a reader's working state and a frozen release can be compared.
 */
export function threeEntryLibrary(): Library {
  const { library } = newLibrary();
  addEntry(library, 'carbo', [
    { position: 1035, height: 0.9, fwhm: 25 },
    { position: 1150, height: 0.3, fwhm: 20 },
  ]);
  addEntry(library, 'amide', [
    { position: 1652, height: 0.8, fwhm: 30 },
    { position: 1545, height: 0.5, fwhm: 28 },
  ]);
  addEntry(library, 'lipid', [
    { position: 2922, height: 0.7, fwhm: 18 },
    { position: 2852, height: 0.5, fwhm: 14 },
    { position: 1740, height: 0.4, fwhm: 20 },
  ]);
  createRelease(library, 'r1', { now: new Date('2026-01-03T00:00:00Z') });
  return library;
}

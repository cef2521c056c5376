// The peak index of a state cached beside the library: a lazy read takes it from the file (without the peaks
// column, which lies behind the originals in each row), and a stale or damaged file is never used.
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { closeLibrary } from '../../../src/library/store/closeLibrary.js';
import { readSearchSet } from '../../../src/library/store/readSearchSet.js';
import type { Library, SearchSet } from '../../../src/library/types.js';
import { addEntry, threeEntryLibrary } from '../libraryFixture.js';

describe('the peaks cache', () => {
  let library: Library;
  beforeAll(() => {
    library = threeEntryLibrary();
  });
  afterAll(() => closeLibrary(library));

  const same = (a: SearchSet, b: SearchSet) => {
    expect(a.stateKey).toBe(b.stateKey);
    expect(a.entries).toEqual(b.entries);
    for (const k of ['entry', 'position', 'height', 'prominence'] as const)
      expect(Array.from(a.peaks[k])).toEqual(Array.from(b.peaks[k]));
  };
  const peakFiles = () => readdirSync(`${library.path}.cache`).filter((f) => /^peaks-.*\.bin$/.test(f));

  it('serves the second lazy read from the file, equal to the eager read, without selecting the peaks', () => {
    // The eager read (every column from SQLite) is the reference for what the file must give back.
    const eager = readSearchSet(library);
    same(readSearchSet(library, { lazy: true }), eager);
    expect(peakFiles()).toHaveLength(1);
    const sql: string[] = [];
    const prepare = library.db.prepare.bind(library.db);
    const spy = vi.spyOn(library.db, 'prepare').mockImplementation(((text: string) => {
      sql.push(text);
      return prepare(text);
    }) as typeof library.db.prepare);
    try {
      same(readSearchSet(library, { lazy: true }), eager);
    } finally {
      spy.mockRestore();
    }
    expect(sql.some((s) => /r\.peaks/.test(s))).toBe(false);
  });

  it('ignores a file whose bytes were flipped, and a file of another state', () => {
    const [name] = peakFiles();
    const path = `${library.path}.cache/${name}`;
    const bytes = readFileSync(path);
    bytes[bytes.length - 3]! ^= 0xff;
    writeFileSync(path, bytes);
    same(readSearchSet(library, { lazy: true }), readSearchSet(library));
    addEntry(library, 'zeta', [{ position: 1240, height: 0.5, fwhm: 20 }]);
    const after = readSearchSet(library, { lazy: true });
    expect(after.entries.map((e) => e.id)).toEqual(['amide', 'carbo', 'lipid', 'zeta']);
    same(after, readSearchSet(library));
  });
});

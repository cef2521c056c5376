// An add's near-duplicate check on the match kernels and search cache: the same notes as the plain-JS check, and
// the cache extended to the state the add leaves so the next match reads it instead of rebuilding it.
import { copyFileSync, mkdirSync, readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { ingest } from '../../src/library/ingest/ingest.js';
import { closeLibrary } from '../../src/library/store/closeLibrary.js';
import { initLibrary } from '../../src/library/store/initLibrary.js';
import { openLibrary } from '../../src/library/store/openLibrary.js';
import { readSearchSet } from '../../src/library/store/readSearchSet.js';
import { buildSearchMatrix } from '../../src/match/buildSearchMatrix.js';
import { libraryNearDuplicateIndex } from '../../src/match/libraryNearDuplicateIndex.js';
import { readCachedSearchMatrix } from '../../src/match/readCachedSearchMatrix.js';
import { searchLibrary } from '../../src/match/searchLibrary.js';
import { searchMatrixCachePath } from '../../src/match/searchMatrixCachePath.js';
import type { SearchMatrix } from '../../src/match/searchTypes.js';
import { bandsFor, tempDir, writeSpectrumCsv } from '../cli/bandshelfCli.js';

let dir: string;

beforeAll(() => {
  dir = tempDir('bandshelf-neardup-');
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** A folder of synthetic CSVs: entry k's bands (bandsFor) with noise seed `seed`, named `<id>.csv`. */
function folder(name: string, files: { id: string; k: number; seed: number }[]): string {
  const out = join(dir, name);
  mkdirSync(out, { recursive: true });
  for (const f of files) writeSpectrumCsv(join(out, `${f.id}.csv`), bandsFor(f.k), { seed: f.seed });
  return out;
}

/** The cached region of a matrix (status, mask, int8 figures, rows): what the disk cache stores. */
function cachedBytes(m: SearchMatrix): Uint8Array {
  return new Uint8Array(m.memory.buffer, m.layout.cached, m.layout.end - m.layout.cached);
}

describe('libraryNearDuplicateIndex', () => {
  it('gives the same near-duplicate notes as scoring every library vector in plain JS', () => {
    const base = join(dir, 'base.sqlite');
    const library = initLibrary(base, { name: 'synthetic near-duplicate fixture' });
    const start = folder(
      'start',
      Array.from({ length: 10 }, (_, k) => ({ id: `ref-${k}`, k, seed: k + 1 })),
    );
    ingest(library, [start], { force: true });
    closeLibrary(library);
    // Re-measurements (same bands, new noise) of ref-2 and ref-7, a pair of new entries alike to each other, a
    // new version of ref-4 under its own id, and an unrelated newcomer.
    const batch = folder('batch', [
      { id: 'again-2', k: 2, seed: 50 },
      { id: 'again-7', k: 7, seed: 51 },
      { id: 'new-a', k: 40, seed: 52 },
      { id: 'new-b', k: 40, seed: 53 },
      { id: 'ref-4', k: 4, seed: 54 },
      { id: 'other', k: 41, seed: 55 },
    ]);
    const notes = (index: boolean) => {
      const copy = join(dir, `copy-${index}.sqlite`);
      copyFileSync(base, copy);
      const lib = openLibrary(copy);
      try {
        const outcome = ingest(lib, [batch], {
          force: true,
          ...(index ? { nearDuplicateIndex: libraryNearDuplicateIndex } : {}),
        });
        expect(outcome.failed).toEqual([]);
        return outcome.notes.filter((n) => n.includes('near-duplicate'));
      } finally {
        closeLibrary(lib);
      }
    };
    const plain = notes(false);
    // The expected pairs follow from how the fixture was made (same bands, other noise); the r values themselves
    // are Pearson's r of the two stored vectors (common practice), computed the same exact way on both paths.
    expect(plain.some((n) => n.includes('again-2') && n.includes("entry 'ref-2'"))).toBe(true);
    expect(plain.some((n) => n.includes('again-7') && n.includes("entry 'ref-7'"))).toBe(true);
    expect(plain.some((n) => n.includes('new-b') && n.includes("entry 'new-a'"))).toBe(true);
    expect(plain.some((n) => n.includes("'other'"))).toBe(false);
    expect(notes(true)).toEqual(plain);
  });

  it('extends the search cache by the rows an add stores; the next match reads it without a rebuild', () => {
    const path = join(dir, 'grow.sqlite');
    const library = initLibrary(path, { name: 'synthetic cache fixture' });
    try {
      ingest(
        library,
        [
          folder(
            'grow-1',
            Array.from({ length: 8 }, (_, k) => ({ id: `e-${k}`, k, seed: 1 })),
          ),
        ],
        {
          force: true,
          nearDuplicateIndex: libraryNearDuplicateIndex,
        },
      );
      const first = readSearchSet(library);
      const query = Float64Array.from(first.processed.subarray(0, first.cols));
      const origins: string[] = [];
      searchLibrary(library, [query], { k: 3, reuse: false, onMatrix: (o) => origins.push(o) });
      expect(origins).toEqual(['built']);
      // A new entry sorting between the old ones, one sorting last, and a new revision of e-3.
      ingest(
        library,
        [
          folder('grow-2', [
            { id: 'e-25', k: 30, seed: 2 },
            { id: 'z-new', k: 31, seed: 2 },
            { id: 'e-3', k: 32, seed: 2 },
          ]),
        ],
        { force: true, nearDuplicateIndex: libraryNearDuplicateIndex },
      );
    } finally {
      closeLibrary(library);
    }
    const reopened = openLibrary(path, { readonly: true });
    try {
      const set = readSearchSet(reopened, { lazy: true });
      expect(set.entries.map((e) => e.id)).toEqual([
        'e-0',
        'e-1',
        'e-2',
        'e-25',
        'e-3',
        'e-4',
        'e-5',
        'e-6',
        'e-7',
        'z-new',
      ]);
      const bulk = vi.spyOn(set, 'processed', 'get');
      const origins: string[] = [];
      let used: SearchMatrix | undefined;
      const query = Float64Array.from(set.row!(3));
      const [hits] = searchLibrary(reopened, [query], {
        set,
        k: 3,
        reuse: false,
        onMatrix: (o, _key, m) => {
          origins.push(o);
          used = m;
        },
      });
      expect(origins).toEqual(['disk']);
      expect(bulk).not.toHaveBeenCalled();
      expect(hits![0]!.id).toBe('e-25');
      // The extended file holds exactly what a build from the library's stored vectors holds.
      const rebuilt = buildSearchMatrix(readSearchSet(reopened), {
        preparation: used!.preparation,
        mask: new Uint8Array(used!.memory.buffer, used!.layout.mask, used!.layout.cols).slice(),
      });
      expect(rebuilt.key).toBe(used!.key);
      const fromDisk = readCachedSearchMatrix(searchMatrixCachePath({ libraryPath: path, key: used!.key }), {
        key: used!.key,
        rows: 10,
        cols: used!.layout.cols,
      });
      expect(fromDisk).not.toBeNull();
      expect(Buffer.from(cachedBytes(fromDisk!)).equals(Buffer.from(cachedBytes(rebuilt)))).toBe(true);
      expect(readdirSync(`${path}.cache`).filter((f) => f.endsWith('.bin')).length).toBeGreaterThanOrEqual(2);
    } finally {
      closeLibrary(reopened);
    }
  });
});

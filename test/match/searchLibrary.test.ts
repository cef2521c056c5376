// The Node search of a real library file: built with the real CLI, matrices cached beside it and reused.
import { spawnSync } from 'node:child_process';
import {
  existsSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  rmSync,
  truncateSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { crc32 } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeLibrary } from '../../src/library/store/closeLibrary.js';
import { openLibrary } from '../../src/library/store/openLibrary.js';
import { readSearchSet } from '../../src/library/store/readSearchSet.js';
import type { Library } from '../../src/library/types.js';
import { buildSearchMatrix } from '../../src/match/buildSearchMatrix.js';
import { metricPreparation } from '../../src/match/metricPreparation.js';
import { readCachedSearchMatrix } from '../../src/match/readCachedSearchMatrix.js';
import { searchLibrary } from '../../src/match/searchLibrary.js';
import { searchMatrixCachePath } from '../../src/match/searchMatrixCachePath.js';
import { searchMatrixKey } from '../../src/match/searchMatrixKey.js';
import { verifySearchMatrixCache } from '../../src/match/verifySearchMatrixCache.js';
import { writeCachedSearchMatrix } from '../../src/match/writeCachedSearchMatrix.js';
import { seeded } from './searchFixtures.js';

const cli = fileURLToPath(new URL('../../src/cli/bandshelf.mjs', import.meta.url));
let dir: string;
let path: string;

function bandshelf(...args: string[]): string {
  const run = spawnSync(process.execPath, [cli, ...args, '--library', path], { cwd: dir, encoding: 'utf8' });
  if (run.status !== 0) throw new Error(`bandshelf ${args.join(' ')}: ${run.stderr}`);
  return run.stdout;
}

/** A synthetic (invented) reference: four Gaussian bands whose positions move with k, on 4000–600 cm⁻¹. */
function writeReference(name: string, k: number): void {
  const lines = ['wavenumber,absorbance'];
  for (let w = 600; w <= 4000; w += 2) {
    let a = 0.01;
    for (const [c, s, h] of [
      [1650 + 9 * k, 15, 1],
      [1540 - 7 * k, 12, 0.6],
      [2920 + 3 * k, 10, 0.4],
      [1080 + 11 * k, 20, 0.3],
    ] as const) {
      a += h * Math.exp(-0.5 * ((w - c) / s) ** 2);
    }
    lines.push(`${w},${a.toFixed(6)}`);
  }
  writeFileSync(join(dir, name), `${lines.join('\n')}\n`);
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'bandshelf-search-'));
  path = join(dir, 'lib.sqlite');
  for (let k = 0; k < 6; k++) writeReference(`synthetic-${k}.csv`, k);
  bandshelf('init');
  bandshelf('add', ...Array.from({ length: 6 }, (_, k) => `synthetic-${k}.csv`));
});

afterAll(() => {
  rmSync(dir, { recursive: true, force: true });
});

function withLibrary<T>(fn: (library: Library) => T): T {
  const library = openLibrary(path, { readonly: true });
  try {
    return fn(library);
  } finally {
    closeLibrary(library);
  }
}

/** Row `r` of the library's processed vectors with seeded noise: an unknown already on the grid. */
function unknownLike(library: Library, r: number): Float64Array {
  const set = readSearchSet(library);
  const random = seeded(r + 1);
  return Float64Array.from(set.processed.subarray(r * set.cols, (r + 1) * set.cols), (v) =>
    Number.isFinite(v) ? v + 0.002 * (random() - 0.5) : Number.NaN,
  );
}

describe('searchLibrary', () => {
  it('finds the source entry, writes the matrix cache, and reads it back on the next search', () => {
    withLibrary((library) => {
      const query = unknownLike(library, 3);
      const origins: string[] = [];
      const first = searchLibrary(library, [query], { k: 3, onMatrix: (o) => origins.push(o) })[0]!;
      expect(first[0]!.id).toBe('synthetic-3');
      expect(first[0]!.score).toBeGreaterThan(0.99);
      const folder = `${path}.cache`;
      expect(readdirSync(folder).filter((f) => /^search-.*\.bin$/.test(f))).toHaveLength(1);
      const again = searchLibrary(library, [query], {
        k: 3,
        reuse: false,
        onMatrix: (o) => origins.push(o),
      })[0]!;
      const memory = searchLibrary(library, [query], { k: 3, onMatrix: (o) => origins.push(o) })[0]!;
      expect(origins).toEqual(['built', 'disk', 'memory']);
      expect(again).toEqual(first);
      expect(memory).toEqual(first);
    });
  });

  it('reads the matrix an add extended to the new state (a new entry) instead of rebuilding it', () => {
    writeReference('synthetic-6.csv', 6);
    bandshelf('add', 'synthetic-6.csv');
    withLibrary((library) => {
      const origins: string[] = [];
      const hits = searchLibrary(library, [unknownLike(library, 6)], {
        k: 7,
        reuse: false,
        onMatrix: (o) => origins.push(o),
      })[0]!;
      expect(origins).toEqual(['disk']);
      expect(hits).toHaveLength(7);
      expect(hits[0]!.id).toBe('synthetic-6');
    });
  });

  it('gives every metric, and the same hits without the cache or workers', () => {
    withLibrary((library) => {
      const query = unknownLike(library, 1);
      for (const metric of ['pearson', 'derivative', 'cosine', 'euclidean'] as const) {
        const cached = searchLibrary(library, [query], { metric, k: 4 })[0]!;
        const plain = searchLibrary(library, [query], {
          metric,
          k: 4,
          cache: false,
          threads: 1,
          reuse: false,
        })[0]!;
        expect(cached[0]!.id).toBe('synthetic-1');
        expect(plain).toEqual(cached);
      }
    });
  });

  it('ignores a cache file that is truncated or made for another key', () => {
    withLibrary((library) => {
      const set = readSearchSet(library);
      const preparation = metricPreparation('pearson');
      const matrix = buildSearchMatrix(set, { preparation });
      const file = join(dir, 'probe.bin');
      expect(writeCachedSearchMatrix(file, matrix)).toBe(true);
      const expect0 = { key: matrix.key, rows: set.rows, cols: set.cols };
      const back = readCachedSearchMatrix(file, expect0)!;
      expect(
        new Uint8Array(back.memory.buffer, back.layout.cached, back.layout.end - back.layout.cached),
      ).toEqual(
        new Uint8Array(matrix.memory.buffer, matrix.layout.cached, matrix.layout.end - matrix.layout.cached),
      );
      expect(readCachedSearchMatrix(file, { ...expect0, key: `${matrix.key}x` })).toBeNull();
      truncateSync(file, 10_000);
      expect(readCachedSearchMatrix(file, expect0)).toBeNull();
      expect(readCachedSearchMatrix(join(dir, 'absent.bin'), expect0)).toBeNull();
      const key = searchMatrixKey({
        stateKey: set.stateKey,
        preparation,
        mask: new Uint8Array(set.cols).fill(1),
      });
      expect(searchMatrixCachePath({ libraryPath: path, key })).toMatch(
        /lib\.sqlite\.cache\/search-[0-9a-f]{32}\.bin$/,
      );
    });
  });

  it('rebuilds, with a warning, a cache file whose bytes were flipped in place, and check-side verify names it', () => {
    // CRC-32 check value of the ASCII string "123456789" is 0xCBF43926 (the published catalogue value of CRC-32/ISO-HDLC).
    expect(crc32(Buffer.from('123456789', 'ascii'))).toBe(0xcbf43926);
    withLibrary((library) => {
      const set = readSearchSet(library);
      const matrix = buildSearchMatrix(set, { preparation: metricPreparation('pearson') });
      const file = searchMatrixCachePath({ libraryPath: path, key: matrix.key });
      expect(writeCachedSearchMatrix(file, matrix)).toBe(true);
      expect(verifySearchMatrixCache(path).filter((p) => file.endsWith(p.where.split(' ')[2]!))).toEqual([]);
      const bytes = readFileSync(file);
      const at = bytes.length - 17;
      bytes[at] = bytes[at]! ^ 0xff;
      writeFileSync(file, bytes);
      const warnings: string[] = [];
      const expect0 = { key: matrix.key, rows: set.rows, cols: set.cols };
      expect(readCachedSearchMatrix(file, expect0, { onDamaged: (m) => warnings.push(m) })).toBeNull();
      expect(warnings).toHaveLength(1);
      expect(warnings[0]).toMatch(/checksum/);
      const found = verifySearchMatrixCache(path);
      expect(found.some((p) => file.endsWith(p.where.split(' ')[2]!) && /CRC-32/.test(p.problem))).toBe(true);
      rmSync(file);
    });
  });

  it('a cache folder that cannot be written does not fail the search', () => {
    const blocked = join(dir, 'blocked');
    writeFileSync(blocked, 'not a folder');
    withLibrary((library) => {
      const set = readSearchSet(library);
      const matrix = buildSearchMatrix(set);
      expect(writeCachedSearchMatrix(join(blocked, 'x.bin'), matrix)).toBe(false);
      expect(existsSync(join(blocked, 'x.bin'))).toBe(false);
    });
    // A library whose cache folder name is taken by a file still searches.
    const other = join(dir, 'other.sqlite');
    spawnSync(process.execPath, [cli, 'init', '--library', other], { cwd: dir });
    spawnSync(process.execPath, [cli, 'add', 'synthetic-2.csv', 'synthetic-4.csv', '--library', other], {
      cwd: dir,
    });
    // The add left a cache folder of its own (the peak index): replace it by a file.
    rmSync(`${other}.cache`, { recursive: true, force: true });
    writeFileSync(`${other}.cache`, 'not a folder');
    const library = openLibrary(other, { readonly: true });
    try {
      const hits = searchLibrary(library, [unknownLike(library, 1)], { k: 2, reuse: false })[0]!;
      expect(hits.map((h) => h.id)).toEqual(['synthetic-4', 'synthetic-2']);
    } finally {
      closeLibrary(library);
    }
  });
});

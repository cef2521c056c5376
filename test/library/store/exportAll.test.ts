// `export --all` in-process: a complete folder appears in one rename, and a failure part-way leaves no folder behind.
import * as fs from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { closeLibrary } from '../../../src/library/store/closeLibrary.js';
import { exportAll } from '../../../src/library/store/exportAll.js';
import type { Library } from '../../../src/library/types.js';
import { bandshelfErrorOf } from '../../bandshelfErrorOf.js';
import { tempDir } from '../../cli/bandshelfCli.js';
import { threeEntryLibrary } from '../libraryFixture.js';

// Writes left before writeFileSync reports a full disk (ENOSPC); Infinity keeps the real behaviour.
const disk = vi.hoisted(() => ({ writesLeft: Number.POSITIVE_INFINITY }));
vi.mock('node:fs', async (importOriginal) => {
  const real = await importOriginal<typeof import('node:fs')>();
  const writeFileSync: typeof real.writeFileSync = (...args) => {
    if (disk.writesLeft-- <= 0) {
      throw Object.assign(new Error('ENOSPC: no space left on device, write'), { code: 'ENOSPC' });
    }
    real.writeFileSync(...args);
  };
  return { ...real, default: { ...real, writeFileSync }, writeFileSync };
});

describe('exportAll', () => {
  let library: Library;
  beforeAll(() => {
    library = threeEntryLibrary();
  });
  afterAll(() => closeLibrary(library));

  it('writes every entry (data file + sidecar) into a new folder and leaves nothing beside it', () => {
    const root = tempDir('bandshelf-export-');
    const dir = join(root, 'nested', 'backup');
    const seen: string[] = [];
    const result = exportAll(library, dir, {
      progress: (done, total, id) => seen.push(`${done}/${total} ${id}`),
    });
    expect(result.entries).toBe(3);
    expect([...result.files].sort()).toEqual(
      ['amide', 'carbo', 'lipid'].flatMap((id) => [`${id}.csv`, `${id}.meta.json`]).sort(),
    );
    expect(fs.readdirSync(dir).sort()).toEqual([...result.files].sort());
    expect(fs.readdirSync(join(root, 'nested'))).toEqual(['backup']);
    expect(seen).toEqual(['1/3 amide', '2/3 carbo', '3/3 lipid']);
    const sidecar = JSON.parse(fs.readFileSync(join(dir, 'carbo.meta.json'), 'utf8')) as Record<
      string,
      unknown
    >;
    expect(sidecar).toMatchObject({ id: 'carbo', name: 'CARBO', class: 'other' });
  });

  it('fills an existing empty folder and refuses one that holds a file, leaving it untouched', () => {
    const root = tempDir('bandshelf-export-');
    const empty = join(root, 'empty');
    fs.mkdirSync(empty);
    expect(exportAll(library, empty).entries).toBe(3);
    expect(fs.readdirSync(empty)).toHaveLength(6);
    const full = join(root, 'full');
    fs.mkdirSync(full);
    fs.writeFileSync(join(full, 'notes.txt'), 'mine\n');
    expect(bandshelfErrorOf(() => exportAll(library, full)).code).toBe('OUT_NOT_EMPTY');
    expect(fs.readdirSync(full)).toEqual(['notes.txt']);
    expect(fs.readdirSync(root).sort()).toEqual(['empty', 'full']);
  });

  it('a write failing part-way (a full disk) leaves no folder, no partial sibling, no created parent', () => {
    const root = tempDir('bandshelf-export-');
    disk.writesLeft = 3; // amide's two files and carbo's data file, then the disk is full
    let error: ReturnType<typeof bandshelfErrorOf>;
    try {
      error = bandshelfErrorOf(() => exportAll(library, join(root, 'new-parent', 'backup')));
    } finally {
      disk.writesLeft = Number.POSITIVE_INFINITY;
    }
    expect(error.code).toBe('IO_ERROR');
    expect(error.message).toBe('cannot write: no space left on the device');
    expect(error.file).toBe(join(root, 'new-parent', 'backup', 'carbo.meta.json'));
    expect(fs.readdirSync(root)).toEqual([]);
  });

  it('an interruption part-way into an existing empty folder leaves it empty and nothing beside it', () => {
    const root = tempDir('bandshelf-export-');
    const dir = join(root, 'backup');
    fs.mkdirSync(dir);
    const interrupted = () =>
      exportAll(library, dir, {
        progress: (done) => {
          if (done === 2) throw new Error('interrupted');
        },
      });
    expect(interrupted).toThrow('interrupted');
    expect(fs.readdirSync(root)).toEqual(['backup']);
    expect(fs.readdirSync(dir)).toEqual([]);
  });
});

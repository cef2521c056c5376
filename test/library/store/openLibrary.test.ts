// Opening and creating library files: WAL, foreign keys, the layout version, and refusals with one clear error.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../../src/error.js';
import { checkLibrary } from '../../../src/library/store/checkLibrary.js';
import { closeLibrary } from '../../../src/library/store/closeLibrary.js';
import { initLibrary } from '../../../src/library/store/initLibrary.js';
import { LIBRARY_VERSION } from '../../../src/library/store/migrateLibrary.js';
import { openLibrary } from '../../../src/library/store/openLibrary.js';
import { tempDir } from '../../cli/bandshelfCli.js';
import { addEntry } from '../libraryFixture.js';

function codeOf(f: () => unknown): string | undefined {
  try {
    f();
  } catch (error) {
    return error instanceof BandshelfError ? error.code : `raw: ${String(error)}`;
  }
  return undefined;
}

describe('openLibrary / initLibrary', () => {
  it('creates a WAL library with its settings, foreign keys on and the current layout version', () => {
    const path = join(tempDir(), 'lib.sqlite');
    const library = initLibrary(path, { grid: { start: 600, stop: 4000, step: 4 }, name: 'Serum refs' });
    expect(library.db.pragma('journal_mode', { simple: true })).toBe('wal');
    expect(library.db.pragma('foreign_keys', { simple: true })).toBe(1);
    expect(library.db.pragma('user_version', { simple: true })).toBe(LIBRARY_VERSION);
    expect(library.grid).toEqual({ start: 600, stop: 4000, step: 4 });
    expect(library.recipe.exclude).toEqual([{ min: 2280, max: 2400 }]);
    closeLibrary(library);
    const again = openLibrary(path, { readonly: true });
    expect(again.name).toBe('Serum refs');
    expect(again.readonly).toBe(true);
    expect(checkLibrary(again)).toEqual([]);
    closeLibrary(again);
  });

  it('refuses a missing file, a non-SQLite file, a foreign SQLite file, a newer layout and an existing path', () => {
    const dir = tempDir();
    expect(codeOf(() => openLibrary(join(dir, 'missing.sqlite')))).toBe('NO_LIBRARY');
    writeFileSync(join(dir, 'text.sqlite'), 'not a database at all '.repeat(50));
    expect(codeOf(() => openLibrary(join(dir, 'text.sqlite')))).toBe('NO_LIBRARY');
    const foreign = new Database(join(dir, 'foreign.sqlite'));
    foreign.exec('CREATE TABLE t (x)');
    foreign.close();
    expect(codeOf(() => openLibrary(join(dir, 'foreign.sqlite')))).toBe('NO_LIBRARY');
    const path = join(dir, 'lib.sqlite');
    closeLibrary(initLibrary(path));
    const db = new Database(path);
    db.pragma(`user_version = ${LIBRARY_VERSION + 1}`);
    db.close();
    expect(codeOf(() => openLibrary(path))).toBe('NO_LIBRARY');
    expect(codeOf(() => initLibrary(path))).toBe('ALREADY_EXISTS');
    expect(
      codeOf(() => initLibrary(join(dir, 'g.sqlite'), { grid: { start: 4000, stop: 600, step: 3 } })),
    ).toBe('BAD_OPTION');
  });

  it('a read-only handle cannot write', () => {
    const path = join(tempDir(), 'lib.sqlite');
    closeLibrary(initLibrary(path));
    const ro = openLibrary(path, { readonly: true });
    expect(codeOf(() => addEntry(ro, 'x', [{ position: 1650, height: 0.5, fwhm: 20 }]))).toBe('IO_ERROR');
    closeLibrary(ro);
  });

  it('a writer that cannot get the lock within the busy timeout fails with one clear error, writing nothing', () => {
    const path = join(tempDir(), 'lib.sqlite');
    closeLibrary(initLibrary(path));
    const holder = new Database(path);
    holder.exec('BEGIN IMMEDIATE');
    const library = openLibrary(path, { busyTimeoutMs: 50 });
    try {
      addEntry(library, 'x', [{ position: 1650, height: 0.5, fwhm: 20 }]);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(BandshelfError);
      expect((error as BandshelfError).code).toBe('IO_ERROR');
      expect((error as BandshelfError).message).toContain('SQLITE_BUSY');
    }
    holder.exec('ROLLBACK');
    holder.close();
    expect(library.db.prepare('SELECT count(*) FROM revisions').pluck().get()).toBe(0);
    closeLibrary(library);
  });
});

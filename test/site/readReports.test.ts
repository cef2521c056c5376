// Reading the reports folder: JSON files only, each validated; the first problem names the file (and field).
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { readReports } from '../../src/site/readReports.js';
import { tempDir } from '../cli/bandshelfCli.js';

function failure(f: () => unknown): BandshelfError {
  try {
    f();
  } catch (error) {
    if (error instanceof BandshelfError) return error;
    throw error;
  }
  throw new Error('expected a BandshelfError');
}

describe('readReports', () => {
  it('skips files that are not JSON and an empty folder gives no reports', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'batch.csv'), 'file,top\n');
    mkdirSync(join(dir, 'old.json'));
    expect(readReports(dir)).toEqual([]);
  });

  it('names a file that is not JSON', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'broken.json'), '{ "kind": ');
    const e = failure(() => readReports(dir, { shownAs: 'reports' }));
    expect(e.code).toBe('BAD_REPORT');
    expect(e.file).toBe(join('reports', 'broken.json'));
  });

  it('names the file and the first failing field of a report that fails the schema', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'a.json'), JSON.stringify({ kind: 'bandshelf-match-report', version: 99 }));
    const e = failure(() => readReports(dir, { shownAs: 'reports' }));
    expect(e.code).toBe('BAD_REPORT');
    expect(e.file).toBe(join('reports', 'a.json'));
    expect(e.field).toBe('version');
    expect(e.oneLine()).toMatch(/^reports\/a\.json: version: .*\[BAD_REPORT\]$/);
  });

  it('refuses a folder that does not exist', () => {
    const e = failure(() => readReports(join(tempDir(), 'missing'), { shownAs: 'missing' }));
    expect(e.code).toBe('NOT_FOUND');
    expect(e.field).toBe('--reports');
  });
});

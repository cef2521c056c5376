// Reading the reports folder: JSON files only, each validated; the first problem names the file (and field).
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readReports } from '../../src/site/readReports.js';
import { bandshelfErrorOf } from '../bandshelfErrorOf.js';
import { tempDir } from '../cli/bandshelfCli.js';

describe('readReports', () => {
  it('skips files that are not JSON and an empty folder gives no reports', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'batch.csv'), 'file,top\n');
    mkdirSync(join(dir, 'old.json'));
    expect(readReports(dir)).toEqual({ reports: [], contrasts: [] });
  });

  it('names a file that is not JSON', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'broken.json'), '{ "kind": ');
    const e = bandshelfErrorOf(() => readReports(dir, { shownAs: 'reports' }));
    expect(e.code).toBe('BAD_REPORT');
    expect(e.file).toBe(join('reports', 'broken.json'));
  });

  it('names the file and the first failing field of a report that fails the schema', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'a.json'), JSON.stringify({ kind: 'bandshelf-match-report', version: 99 }));
    const e = bandshelfErrorOf(() => readReports(dir, { shownAs: 'reports' }));
    expect(e.code).toBe('BAD_REPORT');
    expect(e.file).toBe(join('reports', 'a.json'));
    expect(e.field).toBe('version');
    expect(e.oneLine()).toMatch(/^reports\/a\.json: version: .*\[BAD_REPORT\]$/);
  });

  it('refuses a folder that does not exist', () => {
    const e = bandshelfErrorOf(() => readReports(join(tempDir(), 'missing'), { shownAs: 'missing' }));
    expect(e.code).toBe('NOT_FOUND');
    expect(e.field).toBe('--reports');
  });
});

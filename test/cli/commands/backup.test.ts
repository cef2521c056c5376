// `backup` writes a copy that passes check; a damaged library file gets DAMAGED_LIBRARY (not an internal error) and
// `release` refuses it.
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { bandsFor, bandshelf, tempDir, writeSpectrumCsv } from '../bandshelfCli.js';

describe('backup and a damaged library', () => {
  const dir = tempDir();
  const lib = join(dir, 'lib.sqlite');

  beforeAll(() => {
    expect(bandshelf(['init', '--library', lib]).code).toBe(0);
    const data = join(dir, 'data');
    mkdirSync(data);
    for (let k = 0; k < 3; k++) writeSpectrumCsv(join(data, `s${k}.csv`), bandsFor(k + 4));
    expect(bandshelf(['add', data, '--library', lib]).code).toBe(0);
  });

  it('writes a copy that passes check and refuses to overwrite without --overwrite', () => {
    const copy = join(dir, 'copy.sqlite');
    const r = bandshelf(['backup', copy, '--library', lib]);
    expect(r.code, r.stderr).toBe(0);
    expect(existsSync(copy)).toBe(true);
    expect(bandshelf(['check', '--library', copy]).stdout).toContain('ok: 3 revisions verified');
    expect(bandshelf(['backup', copy, '--library', lib]).stderr).toMatch(/ALREADY_EXISTS/);
  });

  it('a damaged file: list, match, site, export name DAMAGED_LIBRARY with the way to verify and restore; release refuses it', () => {
    const damaged = join(dir, 'damaged.sqlite');
    expect(bandshelf(['backup', damaged, '--library', lib]).code).toBe(0);
    const bytes = readFileSync(damaged);
    // Overwrite the middle of the file (pages of rows; the header page stays) with garbage of the same size.
    const from = Math.floor(bytes.length / 3);
    for (let i = from; i < from + Math.floor(bytes.length / 3); i++) bytes[i] = 0xa5;
    writeFileSync(damaged, bytes);
    const unknown = writeSpectrumCsv(join(dir, 'unknown.csv'), bandsFor(5));
    for (const args of [
      ['list'],
      ['release', 'v1', '--message', 'x'],
      ['match', unknown],
      ['site', '--out', join(dir, 'site')],
      ['export', '--all', join(dir, 'export')],
    ]) {
      const r = bandshelf([...args, '--library', damaged]);
      expect(r.code, `${args[0]}: ${r.stderr}`).toBe(1);
      expect(r.stderr).toMatch(/DAMAGED_LIBRARY/);
      expect(r.stderr).toContain('damaged.sqlite');
      expect(r.stderr).toMatch(/bandshelf check/);
      expect(r.stderr).toMatch(/backup/);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
    }
  });
});

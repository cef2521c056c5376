// `bandshelf add` of a delimited file with one x column and several y columns: one entry per column, named by its
// header, or the one column --column picks; `check` re-reads each entry's column from the stored file.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { bandsFor, bandshelf, parseJson, syntheticSpectrum, tempDir } from '../bandshelfCli.js';

interface AddJson {
  added: { id: string }[];
  unchanged: { id: string }[];
}

let dir: string;
let lib: string[];
let study: string;
/** The columns as written, to compare with what the library stored. */
let columns: number[][];
let x: number[];

beforeAll(() => {
  dir = tempDir('bandshelf-add-columns-');
  lib = ['--library', join(dir, 'lib.sqlite')];
  expect(bandshelf(['init', ...lib]).code).toBe(0);
  // A study export (synthetic): two spectra with distinct seeded bands and their standard deviation.
  const a = syntheticSpectrum(bandsFor(1), { seed: 5 });
  const b = syntheticSpectrum(bandsFor(2), { seed: 6 });
  x = a.x;
  columns = [a.y.map((v) => Number(v.toFixed(6))), b.y.map((v) => Number(v.toFixed(6)))];
  const rows = x.map((w, i) => `${w},${columns[0]![i]},${columns[1]![i]},0.001`);
  study = join(dir, 'study.csv');
  writeFileSync(study, `wavenumber_cm-1,Serum A (absorbance),serum/B,sd\n${rows.join('\n')}\n`);
});

describe('bandshelf add: several y columns', () => {
  it('makes one entry per column, its id slugged from the header, and leaves the uncertainty column out', () => {
    const r = bandshelf(['add', study, ...lib, '--json']);
    expect(r.code, r.stderr).toBe(0);
    expect(parseJson<AddJson>(r.stdout).added.map((e) => e.id)).toEqual(['serum-a-absorbance', 'serum-b']);
    expect(r.stderr).toMatch(/"sd" looks like an uncertainty/);
    const shown = parseJson<{ meta: { name: string }; original: { y: number[] }; read: object }>(
      bandshelf(['show', 'serum-b', ...lib, '--json']).stdout,
    );
    expect(shown.meta.name).toBe('study: serum/B');
    expect(shown.read).toEqual({ column: 'serum/B' });
    // The stored original is the column as written (ascending, so reversed from the file's descending x).
    expect(shown.original.y).toEqual([...columns[1]!].reverse());
    // check re-reads each entry's own column from the one stored file.
    const check = bandshelf(['check', ...lib]);
    expect(check.code, check.stdout + check.stderr).toBe(0);
    // The same file again: both entries unchanged.
    const again = parseJson<AddJson>(bandshelf(['add', study, ...lib, '--json']).stdout);
    expect(again.unchanged.map((e) => e.id)).toEqual(['serum-a-absorbance', 'serum-b']);
  });

  it('takes one column with --column (by name or number), and asks for --column when one id is given', () => {
    const one = bandshelf(['add', study, '--column', '1', '--id', 'first-column', ...lib, '--json']);
    expect(one.code, one.stderr).toBe(0);
    expect(parseJson<AddJson>(one.stdout).added.map((e) => e.id)).toEqual(['first-column']);
    const named = bandshelf(['add', study, '--column', 'SERUM/B', '--id', 'second-column', ...lib, '--json']);
    expect(named.code, named.stderr).toBe(0);
    const refused = bandshelf(['add', study, '--id', 'one-id', ...lib]);
    expect(refused.code).not.toBe(0);
    expect(refused.stderr).toMatch(/holds 2 spectra.*--column/);
    const missing = bandshelf(['add', study, '--column', 'plasma', ...lib]);
    expect(missing.code).not.toBe(0);
    expect(missing.stderr).toMatch(/column "plasma" is not a y column.*"serum\/B"/);
  });

  it('export --all and a re-add into an empty library give each column entry its content hash again', () => {
    const out = join(dir, 'backup');
    const exported = bandshelf(['export', '--all', out, ...lib]);
    expect(exported.code, exported.stderr).toBe(0);
    const lib2 = ['--library', join(dir, 'lib2.sqlite')];
    expect(bandshelf(['init', ...lib2]).code).toBe(0);
    const add = bandshelf(['add', out, ...lib2]);
    expect(add.code, add.stderr).toBe(0);
    const hashes = (l: string[]) =>
      parseJson<{ id: string; hash: string }[]>(bandshelf(['list', ...l, '--json']).stdout).map((e) => [
        e.id,
        e.hash,
      ]);
    expect(hashes(lib).map(([id]) => id)).toEqual(
      expect.arrayContaining(['serum-a-absorbance', 'serum-b', 'first-column']),
    );
    expect(hashes(lib2)).toEqual(hashes(lib));
  });
});

// Export through the real CLI: an entry as JCAMP-DX or CSV re-adds to the same spectrum within 1e-6 relative, and
// `export --all` re-added to an empty library reproduces every content hash, time-domain entries included.
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { bandsFor, bandshelf, parseJson, tempDir, writeSpectrumCsv } from '../bandshelfCli.js';
import { writeTracePair } from './traceFiles.js';

interface ShowJson {
  hash: string;
  original: { x: number[]; y: number[] };
  processed: (number | null)[];
}

function expectSameSpectrum(a: ShowJson['original'], b: ShowJson['original']) {
  expect(b.x.length).toBe(a.x.length);
  for (let i = 0; i < a.x.length; i++) {
    expect(Math.abs(b.x[i]! - a.x[i]!)).toBeLessThanOrEqual(1e-6 * Math.abs(a.x[i]!));
    expect(Math.abs(b.y[i]! - a.y[i]!)).toBeLessThanOrEqual(1e-6 * Math.max(...a.y.map(Math.abs)));
  }
}

describe('bandshelf export', () => {
  const dir = tempDir();
  const lib = ['--library', join(dir, 'lib.sqlite')];

  beforeAll(() => {
    expect(bandshelf(['init', ...lib]).code).toBe(0);
    const data = join(dir, 'data');
    mkdirSync(data);
    for (let k = 0; k < 4; k++) writeSpectrumCsv(join(data, `entry-${k}.csv`), bandsFor(k), { seed: k + 1 });
    writeFileSync(
      join(data, 'entry-1.meta.json'),
      JSON.stringify({ name: 'Entry one', class: 'lipid', tags: ['x'] }),
    );
    // One percent-transmittance file read with an explicit unit, one time-domain pair with its sidecar.
    const pct = ['wavenumber,value'];
    for (let w = 3000; w >= 800; w -= 4)
      pct.push(`${w},${(100 * 10 ** -(0.1 + 0.5 * Math.exp(-(((w - 1700) / 20) ** 2)))).toFixed(6)}`);
    writeFileSync(join(dir, 'pct.txt'), `${pct.join('\n')}\n`);
    writeTracePair(join(data, 'td'), 'td-entry', { attenuation: 10 });
    let r = bandshelf(['add', data, ...lib, '--json']);
    expect(r.code, r.stderr).toBe(0);
    r = bandshelf([
      'add',
      join(dir, 'pct.txt'),
      '--y-unit',
      'percent-transmittance',
      '--x-unit',
      'cm-1',
      ...lib,
    ]);
    expect(r.code, r.stderr).toBe(0);
    expect(bandshelf(['edit', 'entry-2', ...lib, '--set', 'notes=edited once']).code).toBe(0);
  });

  it('an entry exported as JCAMP-DX (DIFDUP and AFFN) or CSV re-adds to the same spectrum within 1e-6', () => {
    const original = parseJson<ShowJson>(bandshelf(['show', 'entry-1', ...lib, '--json']).stdout).original;
    for (const [name, extra] of [
      ['e.jdx', ['--format', 'jcamp']],
      ['a.jdx', ['--format', 'jcamp', '--form', 'affn']],
      ['e.csv', ['--format', 'csv']],
    ] as const) {
      const out = join(dir, name);
      const r = bandshelf(['export', 'entry-1', '--out', out, ...extra, ...lib]);
      expect(r.code, r.stderr).toBe(0);
      const id = `re-${name.replace('.', '-')}`;
      const add = bandshelf(['add', out, '--id', id, ...lib]);
      expect(add.code, add.stderr).toBe(0);
      expectSameSpectrum(
        original,
        parseJson<ShowJson>(bandshelf(['show', id, ...lib, '--json']).stdout).original,
      );
    }
    expect(readFileSync(join(dir, 'e.jdx'), 'utf8')).toMatch(/^##TITLE=Entry one/);
    const refused = bandshelf(['export', 'entry-1', '--out', join(dir, 'e.csv'), ...lib]);
    expect(refused.code).toBe(1);
    expect(refused.stderr).toContain('ALREADY_EXISTS');
  });

  it('export --all then add on an empty library gives identical content hashes', () => {
    const out = join(dir, 'backup');
    const r = bandshelf(['export', '--all', out, ...lib, '--json']);
    expect(r.code, r.stderr).toBe(0);
    const files = readdirSync(out);
    expect(files).toContain('entry-1.meta.json');
    expect(files).toContain('td-entry.sample-1.csv');
    const sidecar = parseJson<Record<string, unknown>>(readFileSync(join(out, 'pct.meta.json'), 'utf8'));
    expect(sidecar.read).toEqual({ xUnit: 'cm-1', yUnit: 'percent-transmittance' });
    expect(sidecar.recipe).toBeTypeOf('object');

    const lib2 = ['--library', join(dir, 'lib2.sqlite')];
    expect(bandshelf(['init', ...lib2]).code).toBe(0);
    const add = bandshelf(['add', out, ...lib2, '--json']);
    expect(add.code, add.stderr).toBe(0);
    const hashes = (l: string[]) =>
      parseJson<{ id: string; hash: string }[]>(bandshelf(['list', ...l, '--json']).stdout).map((e) => [
        e.id,
        e.hash,
      ]);
    const before = hashes(lib);
    expect(before.length).toBeGreaterThanOrEqual(9);
    expect(hashes(lib2)).toEqual(before);
    // Exporting into a folder that already holds files is refused.
    const again = bandshelf(['export', '--all', out, ...lib]);
    expect(again.code).toBe(1);
    expect(again.stderr).toContain('OUT_NOT_EMPTY');
  });
});

// Every bad input to `add` gives one line naming the file and the problem, never a stack trace, and writes nothing:
// every table's row count stays the same and `check` still passes.
import { closeSync, existsSync, ftruncateSync, mkdirSync, openSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { beforeAll, describe, expect, it } from 'vitest';
import { bandsFor, bandshelf, parseJson, tempDir, writeSpectrumCsv } from './bandshelfCli.js';

const TABLES = ['entries', 'revisions', 'files', 'revision_files', 'reviews', 'releases', 'release_members'];

describe('bad input to add', () => {
  const dir = tempDir();
  const path = join(dir, 'lib.sqlite');
  const lib = ['--library', path];
  const counts = () => {
    const db = new Database(path, { readonly: true });
    const out = TABLES.map((t) => db.prepare(`SELECT count(*) FROM ${t}`).pluck().get() as number);
    db.close();
    return out;
  };
  let baseline: number[];

  beforeAll(() => {
    expect(bandshelf(['init', ...lib]).code).toBe(0);
    writeSpectrumCsv(join(dir, 'good.csv'), bandsFor(1));
    expect(bandshelf(['add', join(dir, 'good.csv'), ...lib]).code).toBe(0);
    baseline = counts();
  });

  const csv = (name: string, text: string) => {
    const file = join(dir, name);
    writeFileSync(file, text);
    return file;
  };
  const rows = (n: number, f: (i: number) => string) => Array.from({ length: n }, (_, i) => f(i)).join('\n');

  const cases: [string, () => { file: string; extra?: string[] }, RegExp][] = [
    ['an empty file', () => ({ file: csv('empty.csv', '') }), /EMPTY_FILE/],
    [
      'a single point',
      () => ({ file: csv('single.csv', 'wavenumber_cm-1,absorbance\n1650,0.5\n') }),
      /TOO_FEW_POINTS/,
    ],
    [
      'non-numeric values',
      () => ({
        file: csv(
          'words.csv',
          `wavenumber_cm-1,absorbance\n${rows(20, (i) => `${1000 + i},${i === 7 ? 'abc' : 0.1}`)}\n`,
        ),
      }),
      /NOT_NUMERIC/,
    ],
    [
      'NaN and Infinity',
      () => ({
        file: csv(
          'nan.csv',
          `wavenumber_cm-1,absorbance\n${rows(20, (i) => `${1000 + i},${i === 3 ? 'NaN' : 0.1}`)}\n`,
        ),
      }),
      /NOT_FINITE|NOT_NUMERIC/,
    ],
    [
      'an Infinity',
      () => ({
        file: csv(
          'inf.csv',
          `wavenumber_cm-1,absorbance\n${rows(20, (i) => `${1000 + i},${i === 5 ? '-Infinity' : 0.1}`)}\n`,
        ),
      }),
      /inf\.csv:7: y: .*NOT_FINITE/,
    ],
    [
      'a zig-zag x that cannot be sorted into one spectrum',
      () => ({
        file: csv(
          'zigzag.csv',
          `wavenumber_cm-1,absorbance\n${[1000, 1010, 1002, 1012, 1004, 1014, 1006].map((x) => `${x},0.1`).join('\n')}\n`,
        ),
      }),
      /zigzag\.csv:4: x: .*NOT_MONOTONIC/,
    ],
    [
      'a negative wavenumber',
      () => ({
        file: csv('negative.csv', `wavenumber_cm-1,absorbance\n${rows(20, (i) => `${-1000 + i},0.1`)}\n`),
      }),
      /negative\.csv:2: x: .*NOT_A_SPECTRUM/,
    ],
    [
      'a delimited header naming an x unit of another quantity',
      () => ({ file: csv('hertz.csv', `frequency_hz,absorbance\n${rows(20, (i) => `${1000 + i},0.1`)}\n`) }),
      /hertz\.csv:1: x: .*frequency.*UNKNOWN_UNIT/,
    ],
    [
      'a delimited header naming reflectance',
      () => ({
        file: csv('reflect.csv', `wavenumber_cm-1,reflectance\n${rows(20, (i) => `${1000 + i},0.1`)}\n`),
      }),
      /reflect\.csv:1: y: .*UNKNOWN_UNIT/,
    ],
    [
      'a spectrum that covers none of the library grid',
      () => ({
        file: writeSpectrumCsv(join(dir, 'far-infrared.csv'), [{ position: 300, height: 0.5, fwhm: 20 }], {
          start: 500,
          stop: 100,
        }),
      }),
      /far-infrared\.csv: .*run 100–500 \(read as cm⁻¹\) and cover none of the library grid 600–4000 cm⁻¹; check the file's x unit \(--x-unit\).*QC_FAILED/,
    ],
    [
      'a spectrum file given as a time-domain trace',
      () => {
        const file = writeSpectrumCsv(join(dir, 'not-a-trace.csv'), bandsFor(10));
        return { file, extra: ['--time-domain', '--reference', file] };
      },
      /not-a-trace\.csv:1: delay: .*not a time-domain trace.*UNKNOWN_UNIT/,
    ],
    [
      'a transmittance header over single-beam counts',
      () => ({
        file: csv(
          'counts-t.csv',
          `wavenumber_cm-1,%T\n${rows(20, (i) => `${1000 + i},${i === 4 ? 28000000 : 50000}`)}\n`,
        ),
      }),
      /single-beam/,
    ],
    [
      'an unknown unit',
      () => ({
        file: csv(
          'unit.jdx',
          `##TITLE=unit\n##JCAMP-DX=4.24\n##DATA TYPE=INFRARED SPECTRUM\n##XUNITS=HZ\n##YUNITS=ABSORBANCE\n##NPOINTS=20\n##XYPOINTS=(XY..XY)\n${rows(20, (i) => `${1000 + i},0.1`)}\n##END=\n`,
        ),
      }),
      /UNKNOWN_UNIT/,
    ],
    [
      'binary garbage',
      () => {
        const file = join(dir, 'garbage.csv');
        writeFileSync(file, Buffer.from(Array.from({ length: 512 }, (_, i) => (i * 73 + 11) % 256)));
        return { file };
      },
      /BINARY_DATA/,
    ],
    [
      'a file over the size limit',
      () => {
        const file = join(dir, 'huge.csv');
        const fd = openSync(file, 'w');
        ftruncateSync(fd, 201_000_000); // over the 200 MB default; sparse: no disk is spent
        closeSync(fd);
        return { file };
      },
      /FILE_TOO_LARGE/,
    ],
    [
      'a JCAMP-DX peak table',
      () => ({
        file: csv(
          'peaks.jdx',
          '##TITLE=peaks\n##JCAMP-DX=4.24\n##DATA TYPE=INFRARED PEAK TABLE\n##XUNITS=1/CM\n##YUNITS=ABSORBANCE\n##NPOINTS=2\n##PEAK TABLE=(XY..XY)\n1650,0.5 1550,0.3\n##END=\n',
        ),
      }),
      /NOT_A_SPECTRUM/,
    ],
    [
      'a sidecar that is not JSON',
      () => {
        const file = writeSpectrumCsv(join(dir, 'side1.csv'), bandsFor(2));
        writeFileSync(join(dir, 'side1.meta.json'), '{"name": "x",\n "class": }\n');
        return { file };
      },
      /side1\.meta\.json:2: .*BAD_METADATA/,
    ],
    [
      'a sidecar CAS number with a wrong check digit',
      () => {
        const file = writeSpectrumCsv(join(dir, 'side2.csv'), bandsFor(3));
        writeFileSync(join(dir, 'side2.meta.json'), JSON.stringify({ cas: '7732-18-4' }));
        return { file };
      },
      /side2\.meta\.json: cas: .*check digit.*BAD_METADATA/,
    ],
    [
      'a sidecar with an unknown field',
      () => {
        const file = writeSpectrumCsv(join(dir, 'side3.csv'), bandsFor(4));
        writeFileSync(join(dir, 'side3.meta.json'), JSON.stringify({ clas: 'protein' }));
        return { file };
      },
      /side3\.meta\.json: clas: unknown field \(did you mean "class"\?\)/,
    ],
    [
      'a sidecar id with ".."',
      () => {
        const file = writeSpectrumCsv(join(dir, 'side4.csv'), bandsFor(11));
        writeFileSync(join(dir, 'side4.meta.json'), JSON.stringify({ id: '..' }));
        return { file };
      },
      /side4\.meta\.json: id: .*BAD_METADATA/,
    ],
    [
      'a sidecar id with a path separator',
      () => {
        const file = writeSpectrumCsv(join(dir, 'side5.csv'), bandsFor(12));
        writeFileSync(join(dir, 'side5.meta.json'), JSON.stringify({ id: 'a/b' }));
        return { file };
      },
      /side5\.meta\.json: id: .*path separator.*BAD_METADATA/,
    ],
    [
      'an id of ".."',
      () => ({ file: writeSpectrumCsv(join(dir, 'dots.csv'), bandsFor(13)), extra: ['--id', '..'] }),
      /--id: .*BAD_OPTION/,
    ],
    [
      'an id with a path separator',
      () => ({ file: writeSpectrumCsv(join(dir, 'slash.csv'), bandsFor(5)), extra: ['--id', '../etc'] }),
      /--id: .*BAD_OPTION/,
    ],
    [
      'an unknown class',
      () => ({ file: writeSpectrumCsv(join(dir, 'cls.csv'), bandsFor(6)), extra: ['--class', 'mineral'] }),
      /--class: must be one of/,
    ],
    [
      'an invalid recipe file',
      () => {
        writeFileSync(join(dir, 'recipe.json'), JSON.stringify({ smooth: { window: 4, order: 2 } }));
        return {
          file: writeSpectrumCsv(join(dir, 'rec.csv'), bandsFor(7)),
          extra: ['--recipe', join(dir, 'recipe.json')],
        };
      },
      /recipe\.json: smooth\.window: .*odd.*BAD_RECIPE/,
    ],
    [
      'a recipe file with an unknown field',
      () => {
        writeFileSync(join(dir, 'recipe2.json'), JSON.stringify({ smoth: { window: 5, order: 2 } }));
        return {
          file: writeSpectrumCsv(join(dir, 'recipe2.csv'), bandsFor(14)),
          extra: ['--recipe', join(dir, 'recipe2.json')],
        };
      },
      /recipe2\.json: smoth: unknown field \(did you mean "smooth"\?\).*BAD_RECIPE/,
    ],
    [
      'a file that does not exist',
      () => ({ file: join(dir, 'missing.csv') }),
      /missing\.csv: no such file.*IO_ERROR/,
    ],
    [
      'a recipe file that does not exist',
      () => ({
        file: writeSpectrumCsv(join(dir, 'no-recipe.csv'), bandsFor(15)),
        extra: ['--recipe', join(dir, 'no-recipe.json')],
      }),
      /no-recipe\.json: cannot read: the file does not exist \[IO_ERROR\]$/,
    ],
    [
      'a folder given as the recipe file',
      () => {
        mkdirSync(join(dir, 'recipe-folder'), { recursive: true });
        return {
          file: writeSpectrumCsv(join(dir, 'recipe-folder.csv'), bandsFor(16)),
          extra: ['--recipe', join(dir, 'recipe-folder')],
        };
      },
      /recipe-folder: cannot read: it is a folder, not a file \[IO_ERROR\]$/,
    ],
    [
      'a --meta file that does not exist',
      () => ({
        file: writeSpectrumCsv(join(dir, 'no-meta.csv'), bandsFor(17)),
        extra: ['--meta', join(dir, 'no-meta.meta.json')],
      }),
      /no-meta\.meta\.json: cannot read: the file does not exist \[IO_ERROR\]$/,
    ],
  ];

  for (const [what, make, expected] of cases) {
    it(`${what}: one line naming the file, nothing written`, () => {
      const { file, extra = [] } = make();
      const r = bandshelf(['add', file, ...lib, ...extra]);
      expect(r.code, r.stdout).toBeGreaterThan(0);
      const lines = r.stderr.trim().split('\n');
      expect(lines, r.stderr).toHaveLength(1);
      expect(lines[0]).toMatch(/^bandshelf: /);
      expect(lines[0]).toMatch(expected);
      if (!extra.includes('--id') && !extra.includes('--class'))
        expect(lines[0]).toContain(
          file
            .split('/')
            .pop()!
            .replace(/\.(csv|jdx)$/, ''),
        );
      expect(r.stderr).not.toMatch(/\n\s+at |internal error/);
      expect(counts()).toEqual(baseline);
    });
  }

  it('with several files, the good ones are added, the bad one is reported in failed, and the exit code is 1', () => {
    const good = writeSpectrumCsv(join(dir, 'good-two.csv'), bandsFor(8));
    const r = bandshelf(['add', good, join(dir, 'inf.csv'), ...lib, '--json']);
    expect(r.code).toBe(1);
    const out = parseJson<{ added: { id: string }[]; failed: { file: string; error: string }[] }>(r.stdout);
    expect(out.added.map((a) => a.id)).toEqual(['good-two']);
    expect(out.failed).toHaveLength(1);
    expect(out.failed[0]!.file).toMatch(/inf\.csv$/);
    expect(out.failed[0]!.error).toMatch(/inf\.csv.*NOT_FINITE/);
  });

  it('--atomic stores nothing when one file of the batch is bad', () => {
    const before = counts();
    const good = writeSpectrumCsv(join(dir, 'good-three.csv'), bandsFor(9));
    const r = bandshelf(['add', good, join(dir, 'nan.csv'), ...lib, '--atomic']);
    expect(r.code).toBe(1);
    expect(r.stdout).toContain('nothing was stored');
    expect(counts()).toEqual(before);
  });

  it('a missing library and an unknown release are one line each', () => {
    const r = bandshelf(['list', '--library', join(dir, 'nope.sqlite')]);
    expect(r.code).toBe(1);
    expect(r.stderr.trim()).toMatch(/^bandshelf: .*nope\.sqlite: no library here .*\[NO_LIBRARY\]$/);
    const notDb = csv('not-a-db.sqlite', 'hello, I am text and not SQLite at all; '.repeat(40));
    const n = bandshelf(['list', '--library', notDb]);
    expect(n.code).toBe(1);
    expect(n.stderr.trim().split('\n')).toHaveLength(1);
    expect(n.stderr).toContain('NO_LIBRARY');
    const again = bandshelf(['init', ...lib]);
    expect(again.code).toBe(1);
    expect(again.stderr).toContain('ALREADY_EXISTS');
    expect(bandshelf(['list', ...lib, '--at', 'never']).stderr).toContain('UNKNOWN_RELEASE');
  });

  it('the library still passes check after all of it', () => {
    const r = bandshelf(['check', ...lib]);
    expect(r.code, r.stdout + r.stderr).toBe(0);
  });
});

describe('bad input to the other store commands', () => {
  const dir = tempDir();
  const path = join(dir, 'lib.sqlite');
  const lib = ['--library', path];
  const missing = ['--library', join(dir, 'absent.sqlite')];
  const plainFile = join(dir, 'plain.txt');
  let before = '';
  /** Every table's rows, so "nothing written" is checked on content, not only on counts. */
  const snapshot = () => {
    const db = new Database(path, { readonly: true });
    const out = TABLES.map((t) => JSON.stringify(db.prepare(`SELECT * FROM ${t}`).raw().all())).join('\n');
    db.close();
    return out;
  };

  beforeAll(() => {
    expect(bandshelf(['init', ...lib]).code).toBe(0);
    writeSpectrumCsv(join(dir, 'good.csv'), bandsFor(1));
    expect(bandshelf(['add', join(dir, 'good.csv'), ...lib]).code).toBe(0);
    expect(bandshelf(['release', 'v1', ...lib]).code).toBe(0);
    writeFileSync(plainFile, 'a file, not a folder\n');
    writeFileSync(
      join(dir, 'bad-recipe.json'),
      JSON.stringify({ baseline: { method: 'rubberband', p: 0.1 } }),
    );
    before = snapshot();
  });

  // [what, args, the line must match, a path that must not exist afterwards]
  const cases: [string, () => string[], RegExp, string?][] = [
    ['show of an unknown id', () => ['show', 'nosuch', ...lib], /id: no entry 'nosuch' .*\[NOT_FOUND\]$/],
    ['show of an id with ".."', () => ['show', '../good', ...lib], /id: no entry '\.\.\/good' .*NOT_FOUND/],
    [
      'show at an unknown release',
      () => ['show', 'good', '--at', 'v9', ...lib],
      /at: .*'v9'.*UNKNOWN_RELEASE/,
    ],
    ['list at an unknown release', () => ['list', '--at', 'v9', ...lib], /at: .*'v9'.*UNKNOWN_RELEASE/],
    ['diff against an unknown release', () => ['diff', 'v1', 'v9', ...lib], /'v9'.*UNKNOWN_RELEASE/],
    [
      'export at an unknown release',
      () => ['export', 'good', '--at', 'v9', '--out', join(dir, 'at.csv'), ...lib],
      /at: .*'v9'.*UNKNOWN_RELEASE/,
      join(dir, 'at.csv'),
    ],
    [
      'export of an unknown id',
      () => ['export', 'nosuch', '--out', join(dir, 'nosuch.csv'), ...lib],
      /id: no entry 'nosuch'.*NOT_FOUND/,
      join(dir, 'nosuch.csv'),
    ],
    [
      'export to a path inside a regular file (unwritable)',
      () => ['export', 'good', '--out', join(plainFile, 'x.csv'), ...lib],
      /plain\.txt\/x\.csv: cannot write: a part of the path is a file, not a folder \[IO_ERROR\]$/,
    ],
    [
      'export into a folder that does not exist',
      () => ['export', 'good', '--out', join(dir, 'no-folder', 'x.csv'), ...lib],
      /no-folder\/x\.csv: cannot write: the folder it goes in does not exist \[IO_ERROR\]$/,
      join(dir, 'no-folder'),
    ],
    [
      'edit with a folder given as --meta',
      () => ['edit', 'good', '--meta', dir, ...lib],
      /: cannot read: it is a folder, not a file \[IO_ERROR\]$/,
    ],
    [
      'export --all onto a regular file',
      () => ['export', '--all', plainFile, ...lib],
      /plain\.txt: .*not a folder.*\[IO_ERROR\]$/,
    ],
    [
      'show with a missing library',
      () => ['show', 'good', ...missing],
      /absent\.sqlite: no library here.*NO_LIBRARY/,
    ],
    [
      'add with a missing library',
      () => ['add', join(dir, 'good.csv'), ...missing],
      /absent\.sqlite: no library here.*NO_LIBRARY/,
      join(dir, 'absent.sqlite'),
    ],
    [
      'export with a missing library',
      () => ['export', 'good', '--out', join(dir, 'm.csv'), ...missing],
      /absent\.sqlite: no library here.*NO_LIBRARY/,
      join(dir, 'm.csv'),
    ],
    [
      'list of an unknown class',
      () => ['list', '--class', 'mineral', ...lib],
      /class: .*must be one of.*BAD_OPTION/,
    ],
    [
      'edit of an unknown field',
      () => ['edit', 'good', '--set', 'clas=protein', ...lib],
      /clas: unknown field/,
    ],
    [
      'release with a tag that is a path',
      () => ['release', '../v2', ...lib],
      /tag: bad release tag.*BAD_OPTION/,
    ],
    ['an unknown option', () => ['list', '--colour', ...lib], /^bandshelf: unknown option '--colour'$/],
    ['a missing argument', () => ['show', ...lib], /^bandshelf: missing required argument 'id'$/],
    ...([
      'abc',
      '4000:600',
      '4000:600:0',
      '4000:-600:2',
      '4000:600:3',
      '4000:600:0.0001',
      'Infinity:600:2',
    ].map((grid): [string, () => string[], RegExp, string] => [
      `init --grid ${grid}`,
      () => ['init', '--library', join(dir, 'grid.sqlite'), '--grid', grid],
      /^bandshelf: grid: .*\[BAD_OPTION\]$/,
      join(dir, 'grid.sqlite'),
    ]) as [string, () => string[], RegExp, string][]),
    [
      'init --recipe with a bad field',
      () => ['init', '--library', join(dir, 'recipe.sqlite'), '--recipe', join(dir, 'bad-recipe.json')],
      /bad-recipe\.json: baseline(\.p)?: .*\[BAD_RECIPE\]$/,
      join(dir, 'recipe.sqlite'),
    ],
  ];

  for (const [what, args, expected, mustNotExist] of cases) {
    it(`${what}: one line, a non-zero exit, nothing written`, () => {
      const r = bandshelf(args());
      expect(r.code, r.stdout).toBeGreaterThan(0);
      const lines = r.stderr.trim().split('\n');
      expect(lines, r.stderr).toHaveLength(1);
      expect(lines[0]).toMatch(/^bandshelf: /);
      expect(lines[0]).toMatch(expected);
      expect(r.stderr).not.toMatch(/\n\s+at |internal error/);
      if (mustNotExist) expect(existsSync(mustNotExist), mustNotExist).toBe(false);
      expect(snapshot()).toBe(before);
    });
  }
});

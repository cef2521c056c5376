// `bandshelf add` through the real CLI on a real library file: folders with sidecars and manifests, units, JCAMP-DX
// blocks, unchanged re-adds, near-duplicates, QC blocking and recipe references.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { writeJcampDx } from '../../../src/formats/writeJcampDx.js';
import {
  bandsFor,
  bandshelf,
  parseJson,
  syntheticSpectrum,
  tempDir,
  writeSpectrumCsv,
} from '../bandshelfCli.js';

interface AddJson {
  added: { id: string; revision: number; hash: string }[];
  unchanged: { id: string; revision: number; hash: string }[];
  failed: { file: string; error: string }[];
}

interface ShowJson {
  meta: Record<string, unknown>;
  revision: number;
  original: { x: number[]; y: number[] };
  grid: { start: number; stop: number; step: number };
  processed: (number | null)[];
  peaks: { position: number; height: number; prominence: number; fwhm: number }[];
  qc: { code: string; level: string }[];
  recipe: Record<string, unknown>;
}

function fresh(): { dir: string; lib: string[] } {
  const dir = tempDir();
  const lib = ['--library', join(dir, 'lib.sqlite')];
  expect(bandshelf(['init', ...lib]).code).toBe(0);
  return { dir, lib };
}

describe('bandshelf add', () => {
  let dir: string;
  let lib: string[];
  let first: AddJson;
  beforeAll(() => {
    ({ dir, lib } = fresh());
    const data = join(dir, 'refs');
    mkdirSync(join(data, 'sub'), { recursive: true });
    writeSpectrumCsv(join(data, 'albumin.csv'), [
      { position: 1652, height: 0.8, fwhm: 30 },
      { position: 1545, height: 0.5, fwhm: 28 },
      { position: 2960, height: 0.2, fwhm: 20 },
    ]);
    writeFileSync(
      join(data, 'albumin.meta.json'),
      JSON.stringify({ name: 'Serum albumin (test)', class: 'protein', tags: ['test'], synthetic: true }),
    );
    writeSpectrumCsv(join(data, 'sub', 'glucose.csv'), [
      { position: 1035, height: 0.9, fwhm: 25 },
      { position: 1080, height: 0.5, fwhm: 20 },
      { position: 1150, height: 0.3, fwhm: 18 },
    ]);
    writeFileSync(
      join(data, 'manifest.csv'),
      'file,name,class,cas\nsub/glucose.csv,D-Glucose (test),carbohydrate,50-99-7\n',
    );
    writeFileSync(join(data, 'README.md'), 'not a spectrum');
    writeFileSync(join(data, 'unknowns-are-not-here.json'), '{}');
    mkdirSync(join(data, 'unknowns'));
    writeSpectrumCsv(join(data, 'unknowns', 'query.csv'), bandsFor(3));
    const r = bandshelf(['add', data, ...lib, '--json']);
    expect(r.code, r.stderr).toBe(0);
    first = parseJson<AddJson>(r.stdout);
  });

  it('takes every spectrum file of a folder with its sidecar and manifest row, skipping sidecars and unknowns', () => {
    expect(Object.keys(first).sort()).toEqual(['added', 'failed', 'unchanged']);
    expect(first.added.map((a) => a.id).sort()).toEqual(['albumin', 'glucose']);
    expect(first.failed).toEqual([]);
    for (const a of first.added) {
      expect(Object.keys(a).sort()).toEqual(['hash', 'id', 'revision']);
      expect(a.revision).toBe(1);
      expect(a.hash).toMatch(/^[0-9a-f]{64}$/);
    }
    const list = parseJson<{ id: string; revision: number; name: string; class: string }[]>(
      bandshelf(['list', ...lib, '--json']).stdout,
    );
    expect(list.map((e) => [e.id, e.revision, e.name, e.class])).toEqual([
      ['albumin', 1, 'Serum albumin (test)', 'protein'],
      ['glucose', 1, 'D-Glucose (test)', 'carbohydrate'],
    ]);
    const glucose = parseJson<ShowJson>(bandshelf(['show', 'glucose', ...lib, '--json']).stdout);
    // 50-99-7 is D-glucose's CAS number (common practice); the manifest carried it.
    expect(glucose.meta.cas).toBe('50-99-7');
  });

  it('re-adding identical content is a no-op that says so', () => {
    const again = bandshelf(['add', join(dir, 'refs'), ...lib, '--json']);
    expect(again.code).toBe(0);
    const parsed = parseJson<AddJson>(again.stdout);
    expect(parsed.added).toEqual([]);
    expect(parsed.unchanged.map((u) => [u.id, u.revision, u.hash]).sort()).toEqual(
      first.added.map((a) => [a.id, a.revision, a.hash]).sort(),
    );
    const text = bandshelf(['add', join(dir, 'refs', 'albumin.csv'), ...lib]);
    expect(text.stdout).toMatch(/unchanged\s+albumin\s+r1/);
    expect(text.stdout).toContain('0 added, 1 unchanged, 0 failed');
  });

  it('show --json gives the contract fields: ascending original, grid, processed with null where not covered, peaks', () => {
    const show = parseJson<ShowJson>(bandshelf(['show', 'albumin', ...lib, '--json']).stdout);
    expect(show.revision).toBe(1);
    expect(show.grid).toEqual({ start: 4000, stop: 600, step: 2 });
    expect(show.original.x.length).toBe(1701);
    for (let i = 1; i < show.original.x.length; i++)
      expect(show.original.x[i]!).toBeGreaterThan(show.original.x[i - 1]!);
    expect(show.processed.length).toBe(1701);
    // Grid index i is 600 + 2i cm⁻¹; the default recipe excludes the CO₂ window 2280–2400 cm⁻¹ (not covered).
    expect(show.processed[(2340 - 600) / 2]).toBeNull();
    expect(show.processed[(1652 - 600) / 2]).not.toBeNull();
    const strongest = [...show.peaks].sort((a, b) => b.height - a.height)[0]!;
    expect(Math.abs(strongest.position - 1652)).toBeLessThan(1);
    for (const p of show.peaks)
      expect(Object.keys(p).sort()).toEqual(['fwhm', 'height', 'position', 'prominence']);
  });

  it('converts %T and micrometre files (A = 2 − log10 %T; 10 µm is 1000 cm⁻¹, common practice)', () => {
    const percent = join(dir, 'pct.csv');
    const lines = ['wavenumber_cm-1,%T'];
    for (let w = 1800; w >= 900; w -= 4) lines.push(`${w},${w === 1200 ? 10 : 50}`);
    writeFileSync(percent, `${lines.join('\n')}\n`);
    const micrometre = join(dir, 'um.csv');
    const um = ['wavelength_um,absorbance'];
    for (let i = 0; i <= 200; i++) um.push(`${(8 + i * 0.02).toFixed(4)},${i === 100 ? 0.9 : 0.1}`);
    writeFileSync(micrometre, `${um.join('\n')}\n`);
    const r = bandshelf(['add', percent, micrometre, ...lib, '--json', '--force']);
    expect(r.code, r.stderr).toBe(0);
    const p = parseJson<ShowJson>(bandshelf(['show', 'pct', ...lib, '--json']).stdout);
    const at1200 = p.original.x.indexOf(1200);
    expect(p.original.y[at1200]).toBeCloseTo(1, 9); // %T = 10 → A = 1
    expect(p.original.y[p.original.x.indexOf(1000)]).toBeCloseTo(2 - Math.log10(50), 9);
    const u = parseJson<ShowJson>(bandshelf(['show', 'um', ...lib, '--json']).stdout);
    const peak = u.original.y.indexOf(Math.max(...u.original.y));
    expect(u.original.x[peak]).toBeCloseTo(1000, 6); // 10 µm
  });

  it('splits a multi-block JCAMP-DX file into one entry per block, or takes one with --block', () => {
    const a = syntheticSpectrum([{ position: 1700, height: 0.6, fwhm: 20 }], { seed: 5 });
    const b = syntheticSpectrum([{ position: 1100, height: 0.7, fwhm: 30 }], { seed: 6 });
    const asc = (s: { x: number[]; y: number[] }) => ({
      wavenumber: Float64Array.from(s.x).reverse(),
      absorbance: Float64Array.from(s.y).reverse(),
    });
    const file = join(dir, 'two-blocks.jdx');
    writeFileSync(
      file,
      writeJcampDx(asc(a), { form: 'affn', title: 'Block One' }) +
        writeJcampDx(asc(b), { form: 'dif', title: 'Block Two' }),
    );
    const r = bandshelf(['add', file, ...lib, '--json']);
    expect(r.code, r.stderr).toBe(0);
    expect(
      parseJson<AddJson>(r.stdout)
        .added.map((x) => x.id)
        .sort(),
    ).toEqual(['block-one', 'block-two']);
    const two = parseJson<ShowJson & { read: { block?: number } }>(
      bandshelf(['show', 'block-two', ...lib, '--json']).stdout,
    );
    expect(two.meta.name).toBe('Block Two');
    expect(two.read.block).toBe(2);
    const top = [...two.peaks].sort((p, q) => q.height - p.height)[0]!;
    expect(Math.abs(top.position - 1100)).toBeLessThan(1);
    const one = bandshelf(['add', file, '--block', '2', '--id', 'second-only', ...lib, '--json']);
    expect(one.code, one.stderr).toBe(0);
    expect(parseJson<AddJson>(one.stdout).added.map((x) => x.id)).toEqual(['second-only']);
    const refused = bandshelf(['add', file, '--id', 'both', ...lib]);
    expect(refused.code).toBe(1);
    expect(refused.stderr).toContain('two-blocks.jdx');
    expect(refused.stderr).toContain('--block');
  });

  it('flags a near-duplicate of an existing entry as a stored warning', () => {
    const copy = join(dir, 'albumin-again.csv');
    writeSpectrumCsv(
      copy,
      [
        { position: 1652, height: 0.8, fwhm: 30 },
        { position: 1545, height: 0.5, fwhm: 28 },
        { position: 2960, height: 0.2, fwhm: 20 },
      ],
      { seed: 2 },
    );
    const r = bandshelf(['add', copy, ...lib]);
    expect(r.code).toBe(0);
    expect(r.stderr).toMatch(/near-duplicate.*'albumin'/);
    const show = parseJson<ShowJson>(bandshelf(['show', 'albumin-again', ...lib, '--json']).stdout);
    expect(show.qc.some((f) => f.code === 'near-duplicate' && f.level === 'warning')).toBe(true);
  });

  it('reads a ";"-separated manifest and class names in any case', () => {
    const { dir, lib } = fresh();
    const folder = join(dir, 'eu');
    mkdirSync(folder);
    writeSpectrumCsv(join(folder, 'pool.csv'), bandsFor(3));
    // As a spreadsheet set to a decimal comma saves a table: ";" between cells, a list cell quoted.
    writeFileSync(
      join(folder, 'manifest.csv'),
      'file;name;class;tags\npool.csv;Pooled serum;Biofluid;"serum;pooled"\n',
    );
    const r = bandshelf(['add', folder, ...lib, '--json']);
    expect(r.code, r.stderr).toBe(0);
    const shown = parseJson<ShowJson>(bandshelf(['show', 'pool', ...lib, '--json']).stdout);
    expect(shown.meta).toMatchObject({ name: 'Pooled serum', class: 'biofluid', tags: ['serum', 'pooled'] });
    const flag = bandshelf([
      'add',
      join(folder, 'pool.csv'),
      '--id',
      'pool-2',
      '--class',
      'BioFluid',
      ...lib,
    ]);
    expect(flag.code, flag.stderr).toBe(0);
  });

  it('a spectrum that misses the grid names its x range and the grid, and suggests the likely unit, not --force', () => {
    const { dir, lib } = fresh();
    // Wavelengths 2.5–25 µm under a wavenumber header (λ = 10⁴ / ν̃, common practice: 2.5 µm is 4000 cm⁻¹).
    const { x, y } = syntheticSpectrum([{ position: 1650, height: 0.5, fwhm: 30 }], { step: 4 });
    const rows = x.map((w, i) => `${Number((1e4 / w).toPrecision(10))},${y[i]!.toFixed(6)}`);
    const file = join(dir, 'mislabelled.csv');
    writeFileSync(file, `wavenumber_cm-1,absorbance\n${rows.join('\n')}\n`);
    const refused = bandshelf(['add', file, ...lib]);
    expect(refused.code).toBe(1);
    expect(refused.stderr).toMatch(
      /its x values run 2\.5–16\.67 \(read as cm⁻¹\) and cover none of the library grid 600–4000 cm⁻¹; values 2\.5–16\.67 look like µm: try --x-unit um \[QC_FAILED\]/,
    );
    expect(refused.stderr).not.toContain('--force');
    const fixed = bandshelf(['add', file, '--x-unit', 'um', ...lib]);
    expect(fixed.code, fixed.stderr).toBe(0);
  });

  it('an error-level QC flag blocks the add unless --force, and nothing is written', () => {
    // A spectrum wholly above the grid's 4000 cm⁻¹ end covers none of it: an error-level flag.
    const saturated = join(dir, 'outside.csv');
    writeSpectrumCsv(saturated, [{ position: 4300, height: 0.5, fwhm: 40 }], { start: 4500, stop: 4100 });
    const before = parseJson<unknown[]>(bandshelf(['list', ...lib, '--json']).stdout).length;
    const blocked = bandshelf(['add', saturated, ...lib, '--json']);
    expect(blocked.code).toBe(1);
    const out = parseJson<AddJson>(blocked.stdout);
    expect(out.added).toEqual([]);
    expect(out.failed).toHaveLength(1);
    expect(out.failed[0]!.file).toContain('outside.csv');
    expect(out.failed[0]!.error).toContain('QC_FAILED');
    expect(parseJson<unknown[]>(bandshelf(['list', ...lib, '--json']).stdout).length).toBe(before);
    const forced = bandshelf(['add', saturated, ...lib, '--force', '--json']);
    expect(forced.code).toBe(0);
    const show = parseJson<ShowJson>(bandshelf(['show', 'outside', ...lib, '--json']).stdout);
    expect(show.qc.some((f) => f.code === 'narrow-coverage' && f.level === 'error')).toBe(true);
  });

  it('pins a recipe reference to its revision, waiting for the referenced entry when it comes later in the folder', () => {
    const { dir: d2, lib: lib2 } = fresh();
    const folder = join(d2, 'pair');
    mkdirSync(folder);
    // "a-serum" sorts before "z-water", so the first pass cannot find the reference yet.
    writeSpectrumCsv(join(folder, 'a-serum.csv'), [
      { position: 1652, height: 0.6, fwhm: 30 },
      { position: 2100, height: 0.05, fwhm: 150 },
    ]);
    writeFileSync(
      join(folder, 'a-serum.meta.json'),
      JSON.stringify({ recipe: { reference: { id: 'z-water', window: { min: 1900, max: 2300 } } } }),
    );
    writeSpectrumCsv(join(folder, 'z-water.csv'), [
      { position: 2100, height: 0.1, fwhm: 150 },
      { position: 1643, height: 0.3, fwhm: 60 },
    ]);
    const r = bandshelf(['add', folder, ...lib2, '--json']);
    expect(r.code, r.stderr).toBe(0);
    expect(
      parseJson<AddJson>(r.stdout)
        .added.map((a) => a.id)
        .sort(),
    ).toEqual(['a-serum', 'z-water']);
    const serum = parseJson<ShowJson & { extras: { referenceScale?: number } }>(
      bandshelf(['show', 'a-serum', ...lib2, '--json']).stdout,
    );
    expect(serum.recipe.reference).toMatchObject({ id: 'z-water', revision: 1 });
    expect(typeof serum.extras.referenceScale).toBe('number');
    expect(bandshelf(['check', ...lib2]).code).toBe(0);
  });

  it('every command shows a worked example in --help', () => {
    for (const command of [
      'init',
      'add',
      'list',
      'show',
      'history',
      'edit',
      'retire',
      'review',
      'release',
      'diff',
      'check',
      'export',
      'assignments',
    ]) {
      const help = bandshelf([command, '--help']);
      expect(help.code, command).toBe(0);
      expect(help.stdout, command).toMatch(/Example:\n\s+bandshelf /);
    }
  });
});

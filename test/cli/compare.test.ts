// `bandshelf compare` end to end: files and library entries on the library grid, the matrix, an SVG overlay.
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import {
  type Band,
  bandshelf,
  parseJson,
  syntheticSpectrum,
  tempDir,
  writeSpectrumCsv,
} from './bandshelfCli.js';

// Invented (synthetic) compounds.
const PROTEIN: Band[] = [
  { position: 1652, height: 1, fwhm: 30 },
  { position: 1545, height: 0.6, fwhm: 30 },
];
const LIPID: Band[] = [
  { position: 2922, height: 1, fwhm: 16 },
  { position: 1740, height: 0.6, fwhm: 18 },
];

let dir: string;

beforeAll(() => {
  dir = tempDir('bandshelf-compare-');
  writeSpectrumCsv(join(dir, 'protein.csv'), PROTEIN, { seed: 1 });
  writeSpectrumCsv(join(dir, 'lipid.csv'), LIPID, { seed: 2 });
  writeSpectrumCsv(join(dir, 'protein-again.csv'), PROTEIN, { seed: 3, offset: 0.1 });
  // protein.csv's own values as a header-less %T file: %T = 100 · 10^(−A) (Beer–Lambert, common practice).
  const { x, y } = syntheticSpectrum(PROTEIN, { seed: 1 });
  writeFileSync(
    join(dir, 'protein-t.txt'),
    x.map((w, i) => `${w}\t${(100 * 10 ** -y[i]!).toPrecision(12)}`).join('\n'),
  );
  expect(bandshelf(['init', '--library', 'lib.sqlite'], { cwd: dir }).code).toBe(0);
  const add = bandshelf(['add', 'protein.csv', 'lipid.csv', '--class', 'other', '--library', 'lib.sqlite'], {
    cwd: dir,
  });
  expect(add.code).toBe(0);
});

const run = (args: string[]) => bandshelf([...args, '--library', 'lib.sqlite'], { cwd: dir });

describe('bandshelf compare', () => {
  it('prints the correlation matrix of entries and a file: the same compound correlates, different ones do not', () => {
    const r = run(['compare', 'protein', 'lipid@1', 'protein-again.csv', '--json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const out = parseJson<{ spectra: { name: string }[]; matrix: number[][]; basis: string }>(r.stdout);
    expect(out.spectra.map((s) => s.name)).toEqual(['protein@1', 'lipid@1', 'protein-again.csv']);
    expect(out.basis).toBe('processed');
    // Same bands, different noise and offset: processed alike, r near 1 (by construction).
    expect(out.matrix[0]![2]).toBeGreaterThan(0.99);
    expect(out.matrix[0]![1]).toBeLessThan(0.5);
    expect(out.matrix[1]![0]).toBe(out.matrix[0]![1]);
  });

  it('prints a table and writes an SVG overlay with --plot', () => {
    const r = run(['compare', 'protein', 'lipid', '--plot', 'overlay.svg']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^Pearson r over the points both cover \(processed/);
    expect(r.stdout).toMatch(/#1 protein@1 +1\.0000/);
    expect(r.stderr).toMatch(/plot written to overlay\.svg/);
    const svg = readFileSync(join(dir, 'overlay.svg'), 'utf8');
    expect(svg.startsWith('<svg')).toBe(true);
    expect(svg).toContain('protein@1');
    expect(svg).toContain('wavenumber / cm⁻¹');
  });

  it('compares the originals with --original and refuses a single spectrum', () => {
    const r = run(['compare', 'protein', 'protein-again.csv', '--original', '--json']);
    expect(parseJson<{ basis: string }>(r.stdout).basis).toBe('original');
    const one = run(['compare', 'protein']);
    expect(one.code).toBe(2);
    expect(one.stderr).toMatch(/at least two spectra/);
  });

  it('takes the reading options for its files, and refuses a trace pair in one line', () => {
    const r = run(['compare', 'protein', 'protein-t.txt', '--y-unit', 'percent-transmittance', '--json']);
    expect(r.code, r.stderr).toBe(0);
    const out = parseJson<{ matrix: number[][] }>(r.stdout);
    // The entry and its own values written as %T: the same processed vector, r = 1 to the %T file's 12 digits.
    expect(out.matrix[0]![1]).toBeCloseTo(1, 6);
    const pair = run(['compare', 'protein', 'protein.csv', '--time-domain', '--reference', 'lipid.csv']);
    expect(pair.code).toBe(2);
    expect(pair.stderr.trim().split('\n')).toHaveLength(1);
    expect(pair.stderr).toMatch(/compare reads spectrum files and entries, not trace pairs.*\[BAD_OPTION\]/);
  });
});

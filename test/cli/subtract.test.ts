// `bandshelf subtract` end to end: a fitted and a given scale, CSV and JCAMP-DX output, a library entry as reference.
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { readDelimited } from '../../src/formats/readDelimited.js';
import { readJcampDx } from '../../src/formats/readJcampDx.js';
import {
  type Band,
  bandshelf,
  parseJson,
  syntheticSpectrum,
  tempDir,
  writeSpectrumCsv,
} from './bandshelfCli.js';

// Invented (synthetic) liquid water: the combination band near 2130 cm⁻¹, the bend near 1640, the stretch.
const WATER: Band[] = [
  { position: 3400, height: 1.2, fwhm: 400 },
  { position: 2130, height: 0.1, fwhm: 250 },
  { position: 1640, height: 0.5, fwhm: 70 },
];
const SOLUTE: Band[] = [{ position: 1450, height: 0.05, fwhm: 16 }];

let dir: string;

beforeAll(() => {
  dir = tempDir('bandshelf-subtract-');
  writeSpectrumCsv(join(dir, 'water.csv'), WATER, { noise: 0.0001, seed: 2, offset: 0 });
  writeSpectrumCsv(
    join(dir, 'plasma.csv'),
    [...WATER.map((b) => ({ ...b, height: 0.8 * b.height })), ...SOLUTE],
    { noise: 0.0002, seed: 3, offset: 0.01 },
  );
  // water.csv's and plasma.csv's own values with x in µm (λ = 10⁴ / ν̃, common practice) and no header.
  const water = syntheticSpectrum(WATER, { noise: 0.0001, seed: 2, offset: 0 });
  const plasma = syntheticSpectrum([...WATER.map((b) => ({ ...b, height: 0.8 * b.height })), ...SOLUTE], {
    noise: 0.0002,
    seed: 3,
    offset: 0.01,
  });
  for (const [name, { x, y }] of [
    ['water-um.txt', water],
    ['plasma-um.txt', plasma],
  ] as const) {
    writeFileSync(join(dir, name), x.map((w, i) => `${(1e4 / w).toPrecision(12)}\t${y[i]}`).join('\n'));
  }
  expect(bandshelf(['init', '--library', 'lib.sqlite'], { cwd: dir }).code).toBe(0);
  const add = bandshelf(
    ['add', 'water.csv', '--id', 'water-liquid', '--class', 'solvent', '--library', 'lib.sqlite'],
    {
      cwd: dir,
    },
  );
  expect(add.stderr).not.toMatch(/error/i);
});

const run = (args: string[]) => bandshelf(args, { cwd: dir });

describe('bandshelf subtract', () => {
  it('fits the water scale with its standard error and writes JCAMP-DX with the operation in the header', () => {
    const r = run(['subtract', 'plasma.csv', 'water.csv', '--out', 'dry.jdx', '--json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const out = parseJson<{ scale: number; standardError: number; points: number; format: string }>(r.stdout);
    // By construction the plasma holds 0.8 × the water spectrum.
    expect(Math.abs(out.scale - 0.8)).toBeLessThan(Math.max(5 * out.standardError, 0.005));
    expect(out.standardError).toBeGreaterThan(0);
    expect(out.points).toBe(201); // 2300–1900 cm⁻¹ at 2 cm⁻¹ steps
    expect(out.format).toBe('jcamp-dx');
    const text = readFileSync(join(dir, 'dry.jdx'), 'utf8');
    expect(text).toMatch(/^\$\$ bandshelf subtract: plasma\.csv − scale × water\.csv$/m);
    expect(text).toMatch(/^\$\$ scale 0\.\d+ ± /m);
    const [read] = readJcampDx(text);
    const x = read!.spectrum.wavenumber;
    const y = read!.spectrum.absorbance;
    const at = (v: number) => y[x.findIndex((w) => Math.abs(w - v) < 0.5)]!;
    // What is left: the solute band (0.05) on the offset 0.01, and the water bend gone.
    expect(at(1450) - at(1500)).toBeCloseTo(0.05, 2);
    expect(Math.abs(at(1640) - at(1800))).toBeLessThan(0.005);
  });

  it('subtracts a given scale and prints CSV with the operation as # lines', () => {
    const r = run(['subtract', 'plasma.csv', 'water.csv', '--scale', '0.5']);
    expect(r.code).toBe(0);
    expect(r.stderr).toMatch(/^scale 0\.5 \(given\)/);
    expect(r.stdout.split('\n')[0]).toBe('# bandshelf subtract: plasma.csv − scale × water.csv');
    const [read] = readDelimited(r.stdout);
    expect(read!.spectrum.wavenumber.length).toBe(1701); // 4000–600 cm⁻¹ at 2 cm⁻¹ steps
  });

  it('reads its files with the reading options', () => {
    const um = parseJson<{ scale: number }>(
      run(['subtract', 'plasma-um.txt', 'water-um.txt', '--x-unit', 'um', '--json']).stdout,
    );
    const cm = parseJson<{ scale: number }>(run(['subtract', 'plasma.csv', 'water.csv', '--json']).stdout);
    // The same values on the same wavenumbers to 12 digits (a window edge point may fall either side): the same
    // fitted scale, and by construction the plasma holds 0.8 × the water spectrum.
    expect(um.scale).toBeCloseTo(cm.scale, 3);
    expect(um.scale).toBeCloseTo(0.8, 2);
  });

  it('takes a library entry as the reference', () => {
    const r = run(['subtract', 'plasma.csv', 'water-liquid', '--library', 'lib.sqlite', '--json']);
    expect(r.code).toBe(0);
    const out = parseJson<{ scale: number; reference: { name: string } }>(r.stdout);
    expect(out.reference.name).toBe('water-liquid@1');
    expect(out.scale).toBeCloseTo(0.8, 2);
  });

  it('refuses a bad window, a bad scale and a reference that is neither file nor entry', () => {
    expect(run(['subtract', 'plasma.csv', 'water.csv', '--window', '2300']).code).toBe(2);
    expect(run(['subtract', 'plasma.csv', 'water.csv', '--scale', 'big']).code).toBe(2);
    const r = run(['subtract', 'plasma.csv', 'nothing-here', '--library', 'lib.sqlite']);
    expect(r.code).not.toBe(0);
    expect(r.stderr).toMatch(/NOT_FOUND/);
  });
});

// A real file with a saturated band goes in with `add`, keeps its saturated points out of the processed vector, and
// passes `check`: what `add` accepts, `check` passes. Saturation is a warning unless nothing usable is left.
import { existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bandshelf, ROOT } from './bandshelfCli.js';

const file = join(ROOT, '..', 'shared', 'real-spectra', 'jcamp', 'BRUKER1.JCM');

describe.skipIf(!existsSync(file))('add of a real file whose transmittance reaches 0 in a band', () => {
  it('stores it with the saturated cells not covered, and check passes', () => {
    // BRUKER1.JCM: jcamp-dx.org official test data (../shared/real-spectra/PROVENANCE.md); its %T dips to −0.29
    // (expected.json y_min), the noise of a saturated band.
    const library = join(mkdtempSync(join(tmpdir(), 'bandshelf-sat-')), 'lab.sqlite');
    expect(bandshelf(['init', '--library', library, '--grid', '4000:600:2']).code).toBe(0);
    const add = bandshelf([
      'add',
      file,
      '--id',
      'bruker-1',
      '--class',
      'other',
      '--library',
      library,
      '--json',
    ]);
    expect(add.code, add.stderr).toBe(0);
    expect(add.stderr + add.stdout).toMatch(/absorbance ceiling/);
    const show = bandshelf(['show', 'bruker-1', '--json', '--library', library]);
    expect(show.code, show.stderr).toBe(0);
    const check = bandshelf(['check', '--library', library]);
    expect(check.code, check.stdout + check.stderr).toBe(0);
  });
});

describe('add of a synthetic %T file with a saturated band', () => {
  // Invented %T files on 4000–600 cm⁻¹ at 2 cm⁻¹; %T ≤ 0.01 is A ≥ 4, the absorbance ceiling (A = −log10 T,
  // Beer–Lambert, common practice); the dips below 0 are the noise a saturated band shows.
  const dir = mkdtempSync(join(tmpdir(), 'bandshelf-sat-synthetic-'));
  const library = join(dir, 'lab.sqlite');
  const write = (name: string, percent: (w: number, i: number) => number) => {
    const rows = Array.from(
      { length: 1701 },
      (_, i) => `${4000 - 2 * i},${percent(4000 - 2 * i, i).toFixed(4)}`,
    );
    writeFileSync(join(dir, name), `wavenumber_cm-1,%T\n${rows.join('\n')}\n`);
  };
  const noise = (i: number) => (i % 2 === 0 ? -0.02 : 0.005);
  write('band.csv', (w, i) =>
    Math.abs(w - 1450) <= 20 ? noise(i) : 60 + 20 * Math.exp(-((w - 2900) ** 2) / 400),
  );
  write('all.csv', (_w, i) => noise(i));

  it('stores a file saturated in one band with a warning naming the count and range, the band not covered', () => {
    expect(bandshelf(['init', '--library', library]).code).toBe(0);
    const add = bandshelf(['add', join(dir, 'band.csv'), '--class', 'other', '--library', library]);
    expect(add.code, add.stderr).toBe(0);
    // 1430–1470 cm⁻¹ at 2 cm⁻¹: 21 points.
    expect(add.stderr).toMatch(
      /21 points at or beyond the absorbance ceiling 4 \(transmittance ≤ 0\.0001.*: 1430–1470 cm⁻¹/,
    );
    const show = bandshelf(['show', 'band', '--json', '--library', library]);
    const entry = JSON.parse(show.stdout) as { peaks: { position: number }[] };
    expect(entry.peaks.some((p) => Math.abs(p.position - 1450) < 25)).toBe(false);
  });

  it('refuses a file with nothing usable left, naming the range, and stores nothing', () => {
    const add = bandshelf(['add', join(dir, 'all.csv'), '--class', 'other', '--library', library]);
    expect(add.code).toBe(1);
    expect(add.stderr).toMatch(
      /all\.csv: .*nothing usable is left inside the recipe's range 4000–600 cm⁻¹: 1701 of its 1701 points there are saturated.*\[QC_FAILED\]/,
    );
    expect(add.stderr).not.toMatch(/force|x-unit/);
    const list = bandshelf(['list', '--json', '--library', library]);
    expect(list.stdout).not.toContain('"all"');
  });
});

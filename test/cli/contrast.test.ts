// `bandshelf contrast` end to end: a real library, two folders of synthetic serum-film spectra, the real CLI.
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { seededRandom } from '../../src/demo/seededRandom.js';
import { type ContrastReport, contrastReportSchema } from '../../src/schema/contrastReport.js';
import { type Band, bandshelf, parseJson, tempDir, writeSpectrumCsv } from './bandshelfCli.js';
import { buildMatchFixture, type MatchFixture } from './matchFixture.js';

/** An invented (synthetic) dried serum film: protein, lipid and carbohydrate bands. */
const FILM: Band[] = [
  { position: 3300, height: 0.3, fwhm: 150 },
  { position: 2960, height: 0.15, fwhm: 20 },
  { position: 2922, height: 0.3, fwhm: 16 },
  { position: 2852, height: 0.2, fwhm: 14 },
  { position: 1740, height: 0.18, fwhm: 18 },
  { position: 1652, height: 1, fwhm: 30 },
  { position: 1545, height: 0.6, fwhm: 30 },
  { position: 1240, height: 0.2, fwhm: 40 },
  { position: 1080, height: 0.3, fwhm: 30 },
];

let fx: MatchFixture;

/** `n` films with 10 % variation per band; in `raised` films the 1740 cm⁻¹ band is up by 3 of those SDs. */
function writeGroup(folder: string, n: number, seed: number, raised: boolean): void {
  mkdirSync(join(fx.dir, folder), { recursive: true });
  const rng = seededRandom(seed);
  for (let i = 0; i < n; i++) {
    const bands = FILM.map((b) => ({
      ...b,
      height: b.height * (1 + 0.1 * rng.normal() + (raised && b.position === 1740 ? 0.3 : 0)),
    }));
    writeSpectrumCsv(join(fx.dir, folder, `film-${String(i + 1).padStart(2, '0')}.csv`), bands, {
      noise: 0.001,
      seed: seed * 100 + i,
      offset: 0.02 + 0.01 * rng.normal(),
    });
  }
}

beforeAll(() => {
  fx = buildMatchFixture(tempDir('bandshelf-contrast-'));
  writeGroup('cases', 12, 3, true);
  writeGroup('controls', 12, 4, false);
  writeGroup('pair', 2, 5, false);
  writeGroup('mixed', 8, 6, false);
  // One film of the group carries a strong foreign band (a contaminant): an outlier after processing.
  writeSpectrumCsv(
    join(fx.dir, 'mixed', 'film-03.csv'),
    [...FILM, { position: 1100, height: 1.5, fwhm: 20 }],
    {
      noise: 0.001,
      seed: 77,
    },
  );
  // A group given as a CSV list of files, relative to the CSV's folder.
  writeFileSync(
    join(fx.dir, 'controls.csv'),
    ['file', ...readdirSync(join(fx.dir, 'controls')).map((f) => `controls/${f}`)].join('\n'),
  );
});

function run(args: string[]) {
  return bandshelf([...args, '--library', fx.library], { cwd: fx.dir });
}

describe('bandshelf contrast', () => {
  it('finds the raised ester C=O band, higher in the cases, with triolein among its library candidates', () => {
    const r = run(['contrast', '--group-a', 'cases', '--group-b', 'controls.csv', '--json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const report: ContrastReport = contrastReportSchema.parse(parseJson(r.stdout));
    expect(report.groups.a).toMatchObject({ label: 'cases', read: 12, n: 12 });
    expect(report.groups.b).toMatchObject({ label: 'controls', read: 12, n: 12 });
    const strongest = [...report.bands].sort((x, y) => x.smallestQ - y.smallestQ)[0]!;
    expect(strongest.sign).toBe('higher');
    expect(Math.abs(strongest.position - 1740)).toBeLessThanOrEqual(4);
    // Ester C=O stretch 1730–1750 cm⁻¹ (Movasaghi et al., Appl. Spectrosc. Rev. 43:134, 2008; a shipped table row).
    expect(strongest.assignments[0]!.label).toBe('ester C=O stretch');
    // The fixture's triolein has its C=O band at 1740 cm⁻¹ (test/cli/matchFixture.ts).
    expect(strongest.candidates.map((c) => c.id)).toContain('triolein');
    expect(report.search.higher![0]!.id).toBe('triolein');
    expect(report.library!.name).toBeTruthy();
  });

  it('prints a table with the band, the method and the caution, and writes --report', () => {
    const r = run([
      'contrast',
      '--group-a',
      'cases',
      '--group-b',
      'controls',
      '--label-a',
      'dosed',
      '--label-b',
      'baseline',
      '--report',
      'out',
    ]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/contrast of dosed \(12 of 12 spectra\) with baseline \(12 of 12\)/);
    expect(r.stdout).toMatch(/^ *17\d\d +17\d\d–17\d\d +higher .*ester C=O stretch \(lipid\)/m);
    expect(r.stdout).toMatch(/Welch's unequal-variance t-test/);
    expect(r.stdout).toMatch(
      /Research use only: a difference between groups is an association, not a diagnosis/,
    );
    expect(r.stderr).toMatch(/report written to out\/contrast-dosed-vs-baseline\.json/);
    const written = contrastReportSchema.parse(
      JSON.parse(readFileSync(join(fx.dir, 'out', 'contrast-dosed-vs-baseline.json'), 'utf8')),
    );
    expect(written.groups.a.label).toBe('dosed');
  });

  it('tests a --band-window named in advance at band level, and prints the band-level table', () => {
    const r = run([
      'contrast',
      '--group-a',
      'cases',
      '--group-b',
      'controls',
      '--band-window',
      '1770:1710',
      '--json',
    ]);
    expect(r.code, r.stderr).toBe(0);
    const report = contrastReportSchema.parse(parseJson(r.stdout));
    expect(report.settings.bandWindows).toEqual([{ min: 1710, max: 1770 }]);
    expect(report.bandTests).toHaveLength(1);
    expect(report.bandTests[0]).toMatchObject({ origin: 'given', min: 1710, max: 1770, significant: true });
    expect(report.bandTests[0]!.difference).toBeGreaterThan(0);
    const text = run(['contrast', '--group-a', 'cases', '--group-b', 'controls']);
    expect(text.stdout).toMatch(
      /band-level test \(integrated areas, Welch, Benjamini–Hochberg over \d+ windows\): [1-9]\d* pass/,
    );
    expect(text.stdout).toMatch(/higher in cases +ester C=O stretch/);
  });

  it('refuses a group of fewer than 3 spectra with one line and a non-zero exit', () => {
    const r = run(['contrast', '--group-a', 'pair', '--group-b', 'controls']);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/group 'pair' has 2 spectra .* at least 3 per group \[BAD_OPTION\]/);
  });

  it('lists an outlier and leaves it out only with --drop-outliers', () => {
    const kept = parseJson<ContrastReport>(
      run(['contrast', '--group-a', 'mixed', '--group-b', 'controls', '--json']).stdout,
    );
    const flagged = kept.spectra.filter((s) => s.group === 'a' && s.outlier).map((s) => s.file);
    expect(flagged).toEqual(['film-03.csv']);
    expect(kept.groups.a).toMatchObject({ read: 8, n: 8, outliers: 1 });
    const r = run(['contrast', '--group-a', 'mixed', '--group-b', 'controls', '--drop-outliers']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/contrast of mixed \(7 of 8 spectra\)/);
    expect(r.stdout).toMatch(/outliers \(left out\): film-03\.csv \(mixed, z \d+\.\d\)/);
  });

  it('tests only inside --range and still searches the library with the difference', () => {
    const r = run([
      'contrast',
      '--group-a',
      'cases',
      '--group-b',
      'controls',
      '--range',
      '1800:1700',
      '--json',
    ]);
    expect(r.code).toBe(0);
    const report = parseJson<ContrastReport>(r.stdout);
    // 1700–1800 cm⁻¹ on the default 2 cm⁻¹ grid: 51 points.
    expect(report.tested).toBe(51);
    expect(report.bands.map((band) => band.sign)).toEqual(['higher']);
    expect(report.search.higher![0]!.id).toBe('triolein');
  });

  it('refuses a q outside (0, 1)', () => {
    const r = run(['contrast', '--group-a', 'cases', '--group-b', 'controls', '--q', '1.5']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/q must lie between 0 and 1/);
  });
});

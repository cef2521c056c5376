// `bandshelf bands` end to end on a real library: ranking, strengths, --require-all, bad band lists, and the band
// search from a spectrum file (`--from`) with the reading options.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { bandshelf, parseJson, syntheticSpectrum, tempDir } from './bandshelfCli.js';
import { buildMatchFixture, COMPOUNDS, type MatchFixture } from './matchFixture.js';

let fx: MatchFixture;

beforeAll(() => {
  fx = buildMatchFixture(tempDir('bandshelf-bands-'));
});

interface BandsJson {
  query: { from?: string; bands: { position: number; strength?: string }[] };
  hits: { id: string; revision: number; matched: number; score: number; meanError: number }[];
  library: { entries: number; peaks: number };
}

function bands(args: string[]) {
  return bandshelf(['bands', ...args, '--library', fx.library], { cwd: fx.dir });
}

describe('bandshelf bands', () => {
  it('ranks entries by bands matched, then position agreement', () => {
    const r = bands(['1652', '1545', '1238', '--json']);
    expect(r.code).toBe(0);
    const out = parseJson<BandsJson>(r.stdout);
    expect(out.library.entries).toBe(7);
    expect(out.hits[0]).toMatchObject({ id: 'albumin', revision: 1, matched: 3 });
    expect(out.hits[0]!.score).toBeGreaterThan(0.9);
    // albumin's 1240 and rna's 1236 are both 2 cm⁻¹ from 1238; rna matches that band only.
    const rna = out.hits.find((h) => h.id === 'rna')!;
    expect(rna.matched).toBe(1);
    // score = (1 − 2 / (2 × 4)) / 3 for one of three bands at 2 cm⁻¹.
    expect(rna.score).toBeCloseTo(0.75 / 3, 2);
    for (let i = 1; i < out.hits.length; i++) {
      expect(out.hits[i - 1]!.matched).toBeGreaterThanOrEqual(out.hits[i]!.matched);
    }
  });

  it('uses strengths and --require-all', () => {
    const all = parseJson<BandsJson>(bands(['1080', '1236', '--require-all', '--json']).stdout);
    expect(all.hits.map((h) => h.id)).toEqual(['rna']);
    // 1080:w against glycogen's strongest band (s) scores below the same query with :s.
    const weak = parseJson<BandsJson>(bands(['1080:w', '--json']).stdout).hits.find(
      (h) => h.id === 'glycogen',
    )!;
    const strong = parseJson<BandsJson>(bands(['1080:s', '--json']).stdout).hits.find(
      (h) => h.id === 'glycogen',
    )!;
    expect(strong.score).toBeGreaterThan(weak.score);
    const table = bands(['1652', '1545']);
    expect(table.code).toBe(0);
    expect(table.stdout).toMatch(/^1\s+albumin\s+1\s+albumin\s+other\s+2\/2/m);
    expect(table.stdout).toMatch(/Research use only/);
  });

  it('refuses non-numbers, positions outside the grid and an empty library with one line', () => {
    const cases: [string[], RegExp, number][] = [
      [['1652', 'amide'], /'amide' is not a band position.*\[BAD_OPTION\]$/, 2],
      [['1652:x'], /'1652:x' is not a band position.*\[BAD_OPTION\]$/, 2],
      [['5200'], /band 5200 cm⁻¹ lies outside the library grid \(4000–600 cm⁻¹\) \[BAD_OPTION\]$/, 2],
      [['1652', '--tolerance', '0'], /--tolerance must be a positive number.*\[BAD_OPTION\]$/, 2],
      [['1652', '--at', 'v7'], /no release is tagged 'v7' \[UNKNOWN_RELEASE\]$/, 1],
    ];
    for (const [args, message, code] of cases) {
      const r = bands(args);
      expect(r.code, args.join(' ')).toBe(code);
      expect(r.stdout).toBe('');
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(r.stderr.trim()).toMatch(message);
    }
    const empty = tempDir('bandshelf-bands-empty-');
    bandshelf(['init', '--library', join(empty, 'e.sqlite')]);
    const r = bandshelf(['bands', '1652', '--library', join(empty, 'e.sqlite')]);
    expect(r.code).toBe(1);
    expect(r.stderr.trim()).toMatch(/no entries to search \[EMPTY_LIBRARY\]$/);
  });
});

describe('bandshelf bands --from FILE', () => {
  beforeAll(() => {
    // The fixture's urea bands (invented, synthetic) written as %T = 100 · 10^(−A) without a header, x in µm
    // (λ = 10⁴ / ν̃; Beer–Lambert's decadic absorbance; common practice).
    const { x, y } = syntheticSpectrum(COMPOUNDS.urea!, { noise: 0.0005, seed: 99, offset: 0.05 });
    writeFileSync(
      join(fx.dir, 'urea-t-um.txt'),
      x.map((w, i) => `${(1e4 / w).toPrecision(12)}\t${(100 * 10 ** -y[i]!).toPrecision(12)}`).join('\n'),
    );
    // The same urea film made five times thicker and measured as %T with a noise floor near 0 %: its strongest band
    // (1468 cm⁻¹, A ≈ 5) reads T ≤ 0 in places, as real saturated bands do.
    writeFileSync(
      join(fx.dir, 'urea-thick.csv'),
      `wavenumber_cm-1,%T\n${x.map((w, i) => `${w},${(100 * 10 ** (-5 * y[i]!) + (i % 2 === 0 ? -0.01 : 0.01)).toFixed(6)}`).join('\n')}\n`,
    );
  });

  it('reads the file’s own bands and finds the entry they come from, as the same positions typed in would', () => {
    const r = bands(['--from', fx.unknowns.urea, '--json']);
    expect(r.code, r.stderr).toBe(0);
    const out = parseJson<BandsJson>(r.stdout);
    expect(out.query.from).toBe('urea-film.csv');
    // The fixture's urea bands (matchFixture.ts, invented): 3440, 1620, 1468, 1160 cm⁻¹, 1468 the strongest.
    const positions = out.query.bands.map((b) => b.position);
    for (const c of [3440, 1620, 1468, 1160])
      expect(
        positions.some((p) => Math.abs(p - c) < 2),
        `${c}`,
      ).toBe(true);
    expect(out.query.bands.find((b) => Math.abs(b.position - 1468) < 2)!.strength).toBe('s');
    expect(out.hits[0]).toMatchObject({ id: 'urea', matched: out.query.bands.length });
    // The bands it read, typed as positions with strengths: the same ranked hits.
    const typed = bands([...out.query.bands.map((b) => `${b.position}:${b.strength}`), '--json']);
    expect(parseJson<BandsJson>(typed.stdout).hits).toEqual(out.hits);
    const table = bands(['--from', fx.unknowns.urea]);
    expect(table.stdout).toMatch(/^Bands of urea-film\.csv: /);
    expect(table.stdout).toMatch(/^1\s+urea\s+1\s+urea\s+other\s+4\/4/m);
    expect(table.stdout).toMatch(/Research use only/);
  });

  it('takes the reading options: a header-less %T file in µm gives the bands of its absorbance twin', () => {
    const twin = parseJson<BandsJson>(bands(['--from', fx.unknowns.urea, '--json']).stdout);
    const r = bands(['--from', 'urea-t-um.txt', '--x-unit', 'micron', '--y-unit', '%T', '--json']);
    expect(r.code, r.stderr).toBe(0);
    const out = parseJson<BandsJson>(r.stdout);
    expect(out.query.bands.map((b) => b.strength)).toEqual(twin.query.bands.map((b) => b.strength));
    out.query.bands.forEach((b, i) => {
      expect(b.position).toBeCloseTo(twin.query.bands[i]!.position, 1);
    });
    expect(out.hits.map((h) => h.id)).toEqual(twin.hits.map((h) => h.id));
  });

  it('reads no band where the file is saturated, and says so', () => {
    const r = bands(['--from', 'urea-thick.csv', '--json']);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stderr).toMatch(/urea-thick\.csv: .*absorbance ceiling 4/);
    const out = parseJson<BandsJson>(r.stdout);
    expect(out.query.bands.some((b) => Math.abs(b.position - 1468) < 10)).toBe(false);
    // Its unsaturated bands (1620, 1160 cm⁻¹) are still read.
    for (const c of [1620, 1160])
      expect(
        out.query.bands.some((b) => Math.abs(b.position - c) < 2),
        `${c}`,
      ).toBe(true);
  });

  it('refuses positions and --from together, and reading options without --from, with one line', () => {
    const cases: [string[], RegExp][] = [
      [['1652', '--from', fx.unknowns.urea], /give band positions or --from FILE, not both \[BAD_OPTION\]$/],
      [['1652', '--y-unit', '%T'], /the reading options are for --from FILE \[BAD_OPTION\]$/],
      [['--from', fx.unknowns.urea, '--max-bands', '0'], /--max-bands must be a positive whole number/],
      [['--from', fx.unknowns.urea, '--time-domain'], /--time-domain needs --reference/],
    ];
    for (const [args, message] of cases) {
      const r = bands(args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(r.stderr.trim()).toMatch(message);
    }
    const garbage = bands(['--from', fx.unknowns.garbage]);
    expect(garbage.code).toBe(1);
    expect(garbage.stderr.trim().split('\n')).toHaveLength(1);
    expect(garbage.stderr).toMatch(/garbage\.csv/);
  });
});

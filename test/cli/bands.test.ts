// `bandshelf bands` end to end on a real library: ranking, strengths, --require-all and bad band lists.
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { bandshelf, parseJson, tempDir } from './bandshelfCli.js';
import { buildMatchFixture, type MatchFixture } from './matchFixture.js';

let fx: MatchFixture;

beforeAll(() => {
  fx = buildMatchFixture(tempDir('bandshelf-bands-'));
});

interface BandsJson {
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

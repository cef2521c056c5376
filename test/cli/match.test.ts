// `bandshelf match` end to end: a real library built with the real CLI, single and batch unknowns, bad input.
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { type MatchReport, matchReportSchema } from '../../src/schema/matchReport.js';
import { bandshelf, parseJson, tempDir } from './bandshelfCli.js';
import { buildMatchFixture, type MatchFixture, MIXTURE_SHARES } from './matchFixture.js';

let fx: MatchFixture;
let without: MatchFixture;

beforeAll(() => {
  const dir = tempDir('bandshelf-match-');
  fx = buildMatchFixture(dir);
  without = buildMatchFixture(dir, { name: 'no-lactate.sqlite', leaveOut: ['lactate'] });
});

function run(args: string[], library = fx.library) {
  return bandshelf([...args, '--library', library], { cwd: fx.dir });
}

function report(args: string[], library = fx.library): MatchReport {
  const r = run([...args, '--json'], library);
  expect(r.stderr).toBe('');
  expect(r.code).toBe(0);
  return matchReportSchema.parse(parseJson(r.stdout));
}

describe('bandshelf match', () => {
  it('ranks the right entry first and prints a valid report with --json', () => {
    const r = report(['match', fx.unknowns.urea]);
    expect(r.hits[0]).toMatchObject({ id: 'urea', revision: 1, rank: 1 });
    expect(r.hits[0]!.score).toBeGreaterThan(0.99);
    expect(r.hits.length).toBe(7);
    // The fixture library is small: no wrong hit reaches the score, so p sits at its floor 1/(n + 1) > 0.01.
    expect(r.standing.verdict).toBe('ambiguous');
    expect(r.standing.text).toMatch(/no wrong hit in the library scores this high/);
    expect(r.hits[0]!.pValue).toBeCloseTo(1 / (1 + r.confidence!.nullSize), 12);
    expect(r.query.hash).toMatch(/^[0-9a-f]{64}$/);
    expect(r.query.recipeSource).toBe('library');
    expect(r.library.revisions).toHaveLength(7);
    expect(r.mixture).toBeNull();
    expect(r.caution).toMatch(/^Research use only: candidates, not identifications/);
  });

  it('explains each pearson hit by region with --explain; the shares add up to its r', () => {
    const r = bandshelf(['match', fx.unknowns.urea, '--library', fx.library, '--json'], { cwd: fx.dir });
    const report = parseJson<MatchReport>(r.stdout);
    for (const h of report.hits) {
      // Issue 12 §3: the region shares are the pieces of Pearson r itself.
      expect(h.contributions!.reduce((s, c) => s + c.share, 0)).toBeCloseTo(h.rawScore, 4);
    }
    const text = bandshelf(['match', fx.unknowns.urea, '--library', fx.library, '--explain'], {
      cwd: fx.dir,
    });
    expect(text.stdout).toMatch(/why #1 \S+: r [\d.]+ = .+ [+-]\d\.\d{3}/);
    // Regions of one's own: two that cover the grid split r in two (the same sum of products, regrouped).
    const own = bandshelf(
      [
        ...['match', fx.unknowns.urea, '--library', fx.library, '--json'],
        ...['--explain-region', 'high=4000:1500', '--explain-region', 'low=1500:600'],
      ],
      { cwd: fx.dir },
    );
    expect(own.code, own.stderr).toBe(0);
    for (const h of parseJson<MatchReport>(own.stdout).hits) {
      expect(h.contributions!.map((c) => c.label)).toEqual(['high', 'low']);
      expect(h.contributions!.reduce((s, c) => s + c.share, 0)).toBeCloseTo(h.rawScore, 4);
    }
    const bad = bandshelf(
      ['match', fx.unknowns.urea, '--library', fx.library, '--explain-region', '1800:1700'],
      {
        cwd: fx.dir,
      },
    );
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/--explain-region wants LABEL=HIGH:LOW/);
  });

  it('prints a readable table with the standing and the caution line by default', () => {
    const r = run(['match', fx.unknowns.urea, '--top', '3']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/#\s+ID\s+REV\s+NAME\s+CLASS\s+SCORE/);
    expect(r.stdout).toMatch(/^1\s+urea\s+1/m);
    expect(r.stdout).toMatch(/Standing \(pearson\): AMBIGUOUS: .*p = /);
    expect(r.stdout.trim().split('\n').at(-1)).toBe(
      'Research use only: candidates, not identifications; confirm by orthogonal methods; defer to local ' +
        'regulations and licensed clinical practice.',
    );
  });

  it('finds the 5 % spiked compound of the 4-component mixture with --mixture', () => {
    const r = report(['match', fx.unknowns.mixture, '--mixture']);
    const m = r.mixture!;
    expect(m.components.map((c) => c.id).sort()).toEqual(['albumin', 'glycogen', 'lactate', 'triolein']);
    for (const c of m.components) expect(Math.abs(c.share - MIXTURE_SHARES[c.id]!)).toBeLessThan(0.02);
    expect(m.r2).toBeGreaterThan(0.999);
    expect(m.residualBands).toEqual([]);
    expect(m.criterion).toMatch(/HAC.*rejects 0 at α = 0\.01/);
    // The single best hit of a mixture is weak: the report says so.
    expect(r.standing.verdict).not.toBe('distinct');
  });

  it('lists the left-out compound’s main band among the unexplained bands', () => {
    const r = report(['match', without.unknowns.mixture, '--mixture'], without.library);
    const m = r.mixture!;
    expect(m.components.map((c) => c.id)).not.toContain('lactate');
    // Lactate's strongest band (1417 cm⁻¹, COO⁻ symmetric stretch) is what nothing else explains.
    expect(m.residualBands.some((b) => Math.abs(b.position - 1417) <= 4)).toBe(true);
    const band = r.bands.find((b) => Math.abs(b.position - 1417) <= 4)!;
    expect(band.explained).toBe(false);
  });

  it('forces --with entries into the fit and honours --max-components', () => {
    const r = report(['match', fx.unknowns.mixture, '--mixture', '--with', 'dmso', '--max-components', '2']);
    const m = r.mixture!;
    expect(m.components.length).toBeLessThanOrEqual(2);
    expect(m.components.find((c) => c.id === 'dmso')?.forced).toBe(true);
    expect(r.settings.with).toEqual(['dmso']);
  });

  it('scores a partial-coverage unknown over the overlap and honours --range and --metric all', () => {
    const r = report(['match', fx.unknowns.lactateQcl, '--metric', 'all']);
    expect(r.query.coverage).toMatchObject({ min: 1000, max: 1750, overlap: 750 });
    expect(r.metrics).toEqual(['pearson', 'derivative', 'cosine', 'euclidean']);
    for (const metric of r.metrics) expect(r.hitsByMetric[metric]![0]!.id).toBe('lactate');
    expect(r.hitsByMetric.euclidean![0]!.score).toBeLessThan(0.2);
    const ranged = report(['match', fx.unknowns.urea, '--range', '1300:1800', '--range', '3000:3600']);
    expect(ranged.query.ranges).toEqual([
      { min: 1300, max: 1800 },
      { min: 3000, max: 3600 },
    ]);
    expect(ranged.hits[0]!.id).toBe('urea');
    expect(ranged.hits[0]!.overlap).toBeLessThanOrEqual(1100);
  });

  it('writes one JSON report per unknown and one CSV row per unknown in batch mode', () => {
    const r = run([
      'match',
      fx.unknowns.folder,
      fx.unknowns.garbage,
      '--report',
      'reports',
      '--csv',
      'out.csv',
    ]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/garbage\.csv.*\[NOT_NUMERIC\]/);
    const files = readdirSync(join(fx.dir, 'reports')).sort();
    expect(files).toEqual(['lactate-qcl.match.json', 'serum-mix.match.json', 'urea-film.match.json']);
    for (const f of files)
      matchReportSchema.parse(JSON.parse(readFileSync(join(fx.dir, 'reports', f), 'utf8')));
    const csv = readFileSync(join(fx.dir, 'out.csv'), 'utf8').trim().split('\n');
    expect(csv).toHaveLength(5);
    expect(csv[0]).toMatch(/^file,block,column,status,hit1_id/);
    expect(csv.find((l) => l.startsWith('unknowns/urea-film.csv'))).toMatch(/,ok,urea,1,/);
    expect(csv.find((l) => l.startsWith('garbage.csv'))).toMatch(/,failed,/);
    // Without --csv, a batch prints the CSV itself.
    const plain = run(['match', fx.unknowns.folder]);
    expect(plain.code).toBe(0);
    expect(plain.stdout.trim().split('\n')).toHaveLength(4);
    const json = run(['match', fx.unknowns.folder, '--json']);
    const batch = parseJson<{ reports: unknown[]; failed: unknown[] }>(json.stdout);
    expect(batch.reports).toHaveLength(3);
    expect(batch.failed).toEqual([]);
  });

  it('gives one clear line and a non-zero exit for each kind of bad input', () => {
    const cases: [string[], RegExp, number][] = [
      [['match', fx.unknowns.garbage], /^bandshelf: garbage\.csv:\d+: .*\[NOT_NUMERIC\]$/, 1],
      [['match', 'missing.csv'], /^bandshelf: missing\.csv: no such file or folder \[IO_ERROR\]$/, 1],
      [['match', fx.unknowns.narrow], /covers only 100 cm⁻¹.*at least 200 cm⁻¹.*\[SMALL_OVERLAP\]$/, 1],
      [['match', fx.unknowns.urea, '--at', 'v9'], /no release is tagged 'v9' \[UNKNOWN_RELEASE\]$/, 1],
      [['match', fx.unknowns.urea, '--mixture', '--with', 'nope'], /'nope'.*\[NOT_FOUND\]$/, 1],
      [
        ['match', fx.unknowns.urea, '--range', '1800:x'],
        /--range takes two different wavenumbers.*\[BAD_OPTION\]$/,
        2,
      ],
      [['match', fx.unknowns.urea, '--metric', 'manhattan'], /--metric must be one of.*\[BAD_OPTION\]$/, 2],
    ];
    for (const [args, message, code] of cases) {
      const r = run(args);
      expect(r.code, args.join(' ')).toBe(code);
      expect(r.stdout).toBe('');
      expect(r.stderr.trim().split('\n'), args.join(' ')).toHaveLength(1);
      expect(r.stderr.trim()).toMatch(message);
    }
    const empty = tempDir('bandshelf-empty-');
    expect(bandshelf(['init', '--library', 'e.sqlite'], { cwd: empty }).code).toBe(0);
    const r = bandshelf(['match', join(fx.dir, fx.unknowns.urea), '--library', 'e.sqlite'], { cwd: empty });
    expect(r.code).toBe(1);
    expect(r.stderr.trim()).toMatch(/no entries to match against .*\[EMPTY_LIBRARY\]$/);
    expect(existsSync(join(empty, 'e.sqlite'))).toBe(true);
  });

  it('matches against a release with --at', () => {
    expect(run(['release', 'v1']).code).toBe(0);
    const r = report(['match', fx.unknowns.urea, '--at', 'v1']);
    expect(r.library.release).toBe('v1');
    expect(r.hits[0]!.id).toBe('urea');
  });
});

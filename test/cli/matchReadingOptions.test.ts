// The reading options on `match`, `identify` and `bands --from` through the real CLI: a header-less %T unknown given its unit
// matches like its absorbance twin, and field-resolved sample and reference traces match as one unknown.
import { cpSync, existsSync, mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { type MatchReport, matchReportSchema } from '../../src/schema/matchReport.js';
import { bandshelf, parseJson, ROOT, syntheticSpectrum, tempDir } from './bandshelfCli.js';
import { buildMatchFixture, COMPOUNDS, type MatchFixture } from './matchFixture.js';

let fx: MatchFixture;

function report(command: string, args: string[], library = fx.library): MatchReport {
  const r = bandshelf([command, ...args, '--library', library, '--json'], { cwd: fx.dir });
  expect(r.code, r.stderr).toBe(0);
  return matchReportSchema.parse(parseJson(r.stdout));
}

beforeAll(() => {
  fx = buildMatchFixture(tempDir('bandshelf-match-reading-'));
  // A protein-like unknown (the fixture's albumin bands, other noise), written twice without any header: as
  // absorbance, and as %T = 100 · 10^(−A) (Beer–Lambert's decadic absorbance, common practice).
  const { x, y } = syntheticSpectrum(COMPOUNDS.albumin!, { noise: 0.001, seed: 321, offset: 0.05 });
  writeFileSync(join(fx.dir, 'protein-a.txt'), x.map((w, i) => `${w}\t${y[i]!.toFixed(6)}`).join('\n'));
  writeFileSync(
    join(fx.dir, 'protein-t.txt'),
    x.map((w, i) => `${w}\t${(100 * 10 ** -y[i]!).toPrecision(12)}`).join('\n'),
  );
  // The same twin with x as wavelength in µm (λ = 10⁴ / ν̃, common practice).
  writeFileSync(
    join(fx.dir, 'protein-t-um.txt'),
    x.map((w, i) => `${(1e4 / w).toPrecision(12)}\t${(100 * 10 ** -y[i]!).toPrecision(12)}`).join('\n'),
  );
  // The protein measured by ATR: weighted by Harrick's penetration depth, d_p ∝ λ ∝ 1/ν̃ (Harrick 1967), taken
  // equal to transmission at 1000 cm⁻¹ as the ATR step assumes.
  writeFileSync(
    join(fx.dir, 'protein-atr.txt'),
    x.map((w, i) => `${w}\t${((y[i]! * 1000) / w).toFixed(6)}`).join('\n'),
  );
  // Two unknowns side by side in one file, as a study's spreadsheet export holds them.
  const urea = syntheticSpectrum(COMPOUNDS.urea!, { noise: 0.001, seed: 322, offset: 0.03 });
  writeFileSync(
    join(fx.dir, 'two-films.csv'),
    `wavenumber_cm-1,protein film,urea film\n${x.map((w, i) => `${w},${y[i]!.toFixed(6)},${urea.y[i]!.toFixed(6)}`).join('\n')}\n`,
  );
}, 120_000);

describe('match and identify with the reading options', () => {
  it('matches each y column of a multi-column file, as a batch, or the one --column picks', () => {
    const r = bandshelf(['match', 'two-films.csv', '--library', fx.library, '--json'], { cwd: fx.dir });
    expect(r.code, r.stderr).toBe(0);
    const batch = parseJson<{ reports: unknown[]; failed: unknown[] }>(r.stdout);
    const reports = batch.reports.map((x) => matchReportSchema.parse(x));
    expect(reports.map((x) => [x.query.column, x.hits[0]!.id])).toEqual([
      ['protein film', 'albumin'],
      ['urea film', 'urea'],
    ]);
    const csv = bandshelf(['match', 'two-films.csv', '--library', fx.library], { cwd: fx.dir });
    expect(csv.stdout.split('\n')[2]).toMatch(/^two-films\.csv,,urea film,ok,urea,/);
    const written = bandshelf(['match', 'two-films.csv', '--report', 'reports', '--library', fx.library], {
      cwd: fx.dir,
    });
    expect(written.code, written.stderr).toBe(0);
    expect(readdirSync(join(fx.dir, 'reports')).sort()).toEqual([
      'two-films-protein-film.match.json',
      'two-films-urea-film.match.json',
    ]);
    const one = report('match', ['two-films.csv', '--column', 'Urea Film']);
    expect(one.query.column).toBe('urea film');
    expect(one.hits[0]!.id).toBe('urea');
  });

  it('matches a header-less %T unknown given --y-unit percent-transmittance like its absorbance twin', () => {
    const twin = report('match', ['protein-a.txt', '--metric', 'all']);
    const percent = report('match', [
      'protein-t.txt',
      '--metric',
      'all',
      '--y-unit',
      'percent-transmittance',
    ]);
    expect(twin.hits[0]!.id).toBe('albumin');
    for (const metric of ['pearson', 'derivative', 'cosine', 'euclidean'] as const) {
      const a = twin.hitsByMetric[metric]!;
      const t = percent.hitsByMetric[metric]!;
      expect(t.map((h) => h.id)).toEqual(a.map((h) => h.id));
      // %T written to 12 significant digits: the scores agree far beyond what ranks them.
      t.forEach((h, i) => {
        expect(h.score).toBeCloseTo(a[i]!.score, 4);
      });
    }
    // Written as people write it, in µm as well: the same hits.
    const short = report('match', ['protein-t-um.txt', '--x-unit', 'µm', '--y-unit', '%T']);
    expect(short.hits.map((h) => h.id)).toEqual(twin.hitsByMetric.pearson!.map((h) => h.id));
    // Without the unit the %T file is read as absorbance (and warned about): a different, wrong answer.
    const guessed = bandshelf(['match', 'protein-t.txt', '--library', fx.library, '--json'], { cwd: fx.dir });
    expect(guessed.stderr).toMatch(/look like %T/);
    expect(matchReportSchema.parse(parseJson(guessed.stdout)).hits[0]!.id).not.toBe('albumin');
  });

  it('identifies the same bands of the %T twin as of the absorbance one', () => {
    const twin = report('identify', ['protein-a.txt']);
    const percent = report('identify', ['protein-t.txt', '--y-unit', '%T']);
    expect(percent.bands.length).toBe(twin.bands.length);
    expect(percent.bands.length).toBeGreaterThanOrEqual(4);
    percent.bands.forEach((b, i) => {
      expect(b.position).toBeCloseTo(twin.bands[i]!.position, 2);
    });
  });

  it('corrects an ATR unknown given --technique atr as ATR entries are, back to its transmission twin', () => {
    const twin = report('match', ['protein-a.txt']);
    const asIs = report('match', ['protein-atr.txt']);
    const corrected = report('match', ['protein-atr.txt', '--technique', 'atr']);
    expect(asIs.query.recipe.atr).toBeUndefined();
    expect(corrected.query.recipe.atr).toMatchObject({ crystal: 'diamond', angle: 45, sampleIndex: 1.5 });
    expect(corrected.hits[0]!.id).toBe(twin.hits[0]!.id);
    // The weighting divided out again, the unknown scores as its transmission twin does (to the file's rounding).
    expect(corrected.hits[0]!.score).toBeCloseTo(twin.hits[0]!.score, 3);
    expect(corrected.hits[0]!.score).toBeGreaterThan(asIs.hits[0]!.score);
  });

  it('refuses a unit it does not know with one line naming the flag', () => {
    const r = bandshelf(['match', 'protein-t.txt', '--y-unit', 'furlongs', '--library', fx.library], {
      cwd: fx.dir,
    });
    expect(r.code).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/--y-unit "furlongs" is not a unit.*\[BAD_OPTION\]/);
    const t = bandshelf(['match', 'protein-t.txt', '--technique', 'sonar', '--library', fx.library], {
      cwd: fx.dir,
    });
    expect(t.code).toBe(2);
    expect(t.stderr.trim().split('\n')).toHaveLength(1);
    expect(t.stderr).toMatch(/--technique must be one of atr, transmission.*not 'sonar'.*\[BAD_OPTION\]/);
  });
});

describe('match --time-domain', () => {
  const demo = join(ROOT, 'library');
  const traces = join(demo, 'time-domain');
  let lib: string;

  beforeAll(() => {
    // Demo FTIR references (synthetic) and the demo's glucose field-resolved entry.
    const refs = join(fx.dir, 'demo-refs');
    mkdirSync(refs, { recursive: true });
    const stems = ['13-glucose', '14-fructose', '16-sucrose', '21-sodium-lactate', '29-paracetamol'];
    stems.push('30-ibuprofen', '31-caffeine', '32-aspirin');
    for (const stem of stems) {
      // Each demo compound is in one of two file styles, with its sidecar.
      for (const ext of ['.jdx', '.csv', '.meta.json']) {
        const from = join(demo, `${stem}${ext}`);
        if (existsSync(from)) cpSync(from, join(refs, `${stem}${ext}`));
      }
    }
    lib = 'demo.sqlite';
    expect(bandshelf(['init', '--library', lib], { cwd: fx.dir }).code).toBe(0);
    const add = bandshelf(['add', refs, join(traces, 'glucose-field-resolved.meta.json'), '--library', lib], {
      cwd: fx.dir,
    });
    expect(add.code, add.stderr).toBe(0);
  }, 120_000);

  it('matches a sample and reference trace pair to the same compound measured on an FTIR bench', () => {
    const r = report(
      'match',
      [
        '--time-domain',
        '--reference',
        join(traces, 'paracetamol-field-resolved-reference.csv'),
        join(traces, 'paracetamol-field-resolved-sample.csv'),
      ],
      lib,
    );
    expect(r.query.file).toBe('paracetamol-field-resolved-sample.csv');
    expect(r.hits[0]!.id).toBe('paracetamol');
    // The record length sets the unknown's resolution: the traces span 0–8190 fs, so 1/(c·T) = 4.07 cm⁻¹
    // (standard Fourier pair, common practice), coarser than two steps of the 2 cm⁻¹ grid, and said so. The FTIR
    // entry (4 cm⁻¹) is within the like-with-like tolerance of it, so its score is not recomputed.
    expect(r.query.warnings.some((w) => w.includes('1/(c·T) is 4.07 cm⁻¹'))).toBe(true);
    expect(r.query.warnings.some((w) => /^hit 'paracetamol' .*compared at the coarser/.test(w))).toBe(false);
  });

  it('matches repeated glucose traces to their own library entry first, the FTIR glucose next', () => {
    const r = report(
      'match',
      [
        '--time-domain',
        '--reference',
        join(traces, 'glucose-field-resolved-reference-1.csv'),
        '--reference',
        join(traces, 'glucose-field-resolved-reference-2.csv'),
        join(traces, 'glucose-field-resolved-sample-1.csv'),
        join(traces, 'glucose-field-resolved-sample-2.csv'),
      ],
      lib,
    );
    expect(r.hits.slice(0, 2).map((h) => h.id)).toEqual(['glucose-field-resolved', 'glucose']);
  });

  it('identifies the bands of a trace pair, and of repeated traces, like match matches them', () => {
    const pair = report(
      'identify',
      [
        '--time-domain',
        '--reference',
        join(traces, 'paracetamol-field-resolved-reference.csv'),
        join(traces, 'paracetamol-field-resolved-sample.csv'),
      ],
      lib,
    );
    expect(pair.query.file).toBe('paracetamol-field-resolved-sample.csv');
    expect(pair.hits[0]!.id).toBe('paracetamol');
    // The demo's paracetamol bands (src/demo/demoCompounds.ts, invented from recalled positions: 1654, 1507 cm⁻¹).
    for (const c of [1654, 1507]) {
      expect(
        pair.bands.some((b) => Math.abs(b.position - c) < 4),
        `${c}`,
      ).toBe(true);
    }
    const repeated = report(
      'identify',
      [
        '--time-domain',
        '--reference',
        join(traces, 'glucose-field-resolved-reference-1.csv'),
        '--reference',
        join(traces, 'glucose-field-resolved-reference-2.csv'),
        join(traces, 'glucose-field-resolved-sample-1.csv'),
        join(traces, 'glucose-field-resolved-sample-2.csv'),
      ],
      lib,
    );
    expect(repeated.hits.slice(0, 2).map((h) => h.id)).toEqual(['glucose-field-resolved', 'glucose']);
    // Several files are sample traces only with --time-domain.
    const two = bandshelf(['identify', 'protein-a.txt', 'protein-t.txt', '--library', fx.library], {
      cwd: fx.dir,
    });
    expect(two.code).toBe(2);
    expect(two.stderr.trim()).toMatch(/identify takes one spectrum file.*\[BAD_OPTION\]$/);
  });

  it('searches the bands of a trace pair with bands --from', () => {
    const r = bandshelf(
      [
        'bands',
        '--from',
        join(traces, 'paracetamol-field-resolved-sample.csv'),
        '--time-domain',
        '--reference',
        join(traces, 'paracetamol-field-resolved-reference.csv'),
        '--library',
        lib,
        '--json',
      ],
      { cwd: fx.dir },
    );
    expect(r.code, r.stderr).toBe(0);
    const out = parseJson<{ query: { from: string }; hits: { id: string }[] }>(r.stdout);
    expect(out.query.from).toBe('paracetamol-field-resolved-sample.csv');
    expect(out.hits[0]!.id).toBe('paracetamol');
  });

  it('refuses --time-domain without --reference on match and identify alike', () => {
    for (const command of ['match', 'identify']) {
      const r = bandshelf(
        [command, join(traces, 'paracetamol-field-resolved-sample.csv'), '--time-domain', '--library', lib],
        { cwd: fx.dir },
      );
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(/--time-domain needs --reference/);
    }
  });
});

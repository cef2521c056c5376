// Like with like across resolutions through `bandshelf match`: a hit coarser than the unknown is scored again with
// the unknown degraded to the hit's resolution, and marked.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { type MatchReport, matchReportSchema } from '../../src/schema/matchReport.js';
import { type Band, bandshelf, parseJson, tempDir, writeSpectrumCsv } from './bandshelfCli.js';

// Invented narrow bands (a crystalline solid), Gaussian as the helper writes them.
const SHARP: Band[] = [
  { position: 1700, height: 0.9, fwhm: 6 },
  { position: 1600, height: 0.6, fwhm: 5 },
  { position: 1510, height: 0.7, fwhm: 6 },
  { position: 1240, height: 0.5, fwhm: 8 },
  { position: 1030, height: 0.4, fwhm: 7 },
];
const INSTRUMENT = 16;

/**
 * The same bands as a 16 cm⁻¹ Gaussian instrument records them: a Gaussian of FWHM w convolved with one of FWHM R
 * is a Gaussian of FWHM √(w² + R²) (widths add in quadrature; common practice) with the same area, so its height
 * falls by w / √(w² + R²).
 */
const COARSE: Band[] = SHARP.map((b) => {
  const fwhm = Math.hypot(b.fwhm, INSTRUMENT);
  return { position: b.position, fwhm, height: (b.height * b.fwhm) / fwhm };
});
// A different invented compound whose bands happen to be as narrow as the unknown's, near but not at its positions.
const LOOKALIKE: Band[] = SHARP.map((b, i) => ({ ...b, position: b.position + (i % 2 === 0 ? 9 : -9) }));

let dir: string;
let lib: string[];

beforeAll(() => {
  dir = tempDir('bandshelf-like-with-like-');
  lib = ['--library', join(dir, 'lib.sqlite')];
  expect(bandshelf(['init', ...lib]).code).toBe(0);
  writeSpectrumCsv(join(dir, 'coarse.csv'), COARSE, { step: 8 });
  writeFileSync(
    join(dir, 'coarse.meta.json'),
    JSON.stringify({ id: 'coarse', name: 'Coarse', resolution: 16 }),
  );
  writeSpectrumCsv(join(dir, 'lookalike.csv'), LOOKALIKE, { step: 1 });
  writeFileSync(
    join(dir, 'lookalike.meta.json'),
    JSON.stringify({ id: 'lookalike', name: 'Lookalike', resolution: 2 }),
  );
  writeSpectrumCsv(join(dir, 'sharp.csv'), SHARP, { step: 1, seed: 3 });
  writeFileSync(join(dir, 'sharp.meta.json'), JSON.stringify({ id: 'sharp', name: 'Sharp', resolution: 2 }));
  const add = bandshelf([
    'add',
    join(dir, 'coarse.csv'),
    join(dir, 'lookalike.csv'),
    join(dir, 'sharp.csv'),
    ...lib,
    '--force',
  ]);
  expect(add.code, add.stderr).toBe(0);
});

describe('match compares like with like across resolutions', () => {
  it('scores the coarse entry with the unknown degraded to 16 cm⁻¹, above the lookalike, and says so', () => {
    // 1 cm⁻¹ spacing: two spacings, 2 cm⁻¹, is the unknown's estimated resolution (resolutionOf).
    const unknown = writeSpectrumCsv(join(dir, 'unknown.csv'), SHARP, { step: 1, seed: 7 });
    const r = bandshelf(['match', unknown, ...lib, '--json']);
    expect(r.code, r.stderr).toBe(0);
    const report: MatchReport = matchReportSchema.parse(parseJson(r.stdout));
    const coarse = report.hits.find((h) => h.id === 'coarse')!;
    const lookalike = report.hits.find((h) => h.id === 'lookalike')!;
    expect(coarse.rank).toBeLessThan(lookalike.rank);
    // Degraded to the entry's resolution the two are the same bands up to noise (kernel √(16² − 2²) against the
    // entry's 16: the widths differ by < 0.5 %), so r is near 1.
    expect(coarse.rawScore).toBeGreaterThan(0.995);
    const note = report.query.warnings.find((w) => w.startsWith("hit 'coarse'"));
    expect(note).toMatch(/compared at the coarser 16 cm⁻¹: pearson (0\.\d+) → 0\.99\d/);
    const before = Number(/pearson (0\.\d+) →/.exec(note!)![1]);
    expect(before).toBeLessThan(coarse.rawScore);
    // The lookalike shares the unknown's resolution (2 cm⁻¹, stated vs estimated): it is not compared again.
    expect(report.query.warnings.some((w) => w.startsWith("hit 'lookalike'"))).toBe(false);
    expect(report.hits.map((h) => h.rank)).toEqual(report.hits.map((_, i) => i + 1));
  });

  it("degrades the sharper entry's original to a coarse unknown's resolution", () => {
    // 8 cm⁻¹ spacing: the unknown's estimated resolution is 16 cm⁻¹ (two spacings), the 'sharp' entry states 2.
    const unknown = writeSpectrumCsv(join(dir, 'coarse-unknown.csv'), COARSE, { step: 8, seed: 11 });
    const r = bandshelf(['match', unknown, ...lib, '--json']);
    expect(r.code, r.stderr).toBe(0);
    const report: MatchReport = matchReportSchema.parse(parseJson(r.stdout));
    const sharp = report.hits.find((h) => h.id === 'sharp')!;
    // Entry convolved with √(16² − 2²): its bands reach the unknown's √(w² + 16²) within 0.5 % (quadrature).
    expect(sharp.rawScore).toBeGreaterThan(0.995);
    expect(report.query.warnings.find((w) => w.startsWith("hit 'sharp'"))).toMatch(
      /resolution 2 cm⁻¹\) and the unknown \(16 cm⁻¹\) compared at the coarser 16 cm⁻¹/,
    );
    // The coarse entry shares the unknown's resolution: scored as the pipeline scored it, no note.
    expect(report.query.warnings.some((w) => w.startsWith("hit 'coarse'"))).toBe(false);
  });
});

// Resolution matching end to end through the CLI: a preset library, entries of stated resolutions, check, and match.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { type MatchReport, matchReportSchema } from '../../src/schema/matchReport.js';
import { type Band, bandshelf, parseJson, tempDir, writeSpectrumCsv } from './bandshelfCli.js';

// Invented band sets: a protein-like one with amide I (the dried-film preset normalises on 1700–1600 cm⁻¹) and a
// second with its amide I shifted and other bands, so the two are told apart.
const PROTEIN: Band[] = [
  { position: 1652, height: 0.8, fwhm: 22 },
  { position: 1545, height: 0.5, fwhm: 24 },
  { position: 1240, height: 0.2, fwhm: 30 },
];
const OTHER: Band[] = [
  { position: 1630, height: 0.6, fwhm: 16 },
  { position: 1080, height: 0.7, fwhm: 20 },
  { position: 2920, height: 0.4, fwhm: 14 },
];

interface ShowJson {
  qc: { code: string }[];
  recipe: { resolution?: { target: number; own?: number; estimated?: boolean } };
  extras: { resolution?: { value: number; estimated: boolean } };
}

let dir: string;
let lib: string[];

beforeAll(() => {
  dir = tempDir('bandshelf-resolution-');
  lib = ['--library', join(dir, 'lib.sqlite')];
  expect(bandshelf(['init', ...lib, '--preset', 'dried-film']).code).toBe(0);
  writeSpectrumCsv(join(dir, 'sharp.csv'), PROTEIN, { step: 0.5 });
  writeFileSync(join(dir, 'sharp.meta.json'), JSON.stringify({ id: 'sharp', name: 'Sharp', resolution: 1 }));
  writeSpectrumCsv(join(dir, 'coarse.csv'), OTHER, { step: 2 });
  writeFileSync(
    join(dir, 'coarse.meta.json'),
    JSON.stringify({ id: 'coarse', name: 'Coarse', resolution: 8 }),
  );
  const r = bandshelf(['add', join(dir, 'sharp.csv'), join(dir, 'coarse.csv'), ...lib, '--json']);
  expect(r.code, r.stderr).toBe(0);
});

describe('resolution matching through the CLI', () => {
  it('records each stated resolution, pins it into the preset recipe and notes the entry coarser than 4 cm⁻¹', () => {
    const sharp = parseJson<ShowJson>(bandshelf(['show', 'sharp', ...lib, '--json']).stdout);
    expect(sharp.extras.resolution).toEqual({ value: 1, estimated: false });
    expect(sharp.recipe.resolution).toMatchObject({ target: 4, own: 1, estimated: false });
    expect(sharp.qc.map((f) => f.code)).not.toContain('coarse-resolution');
    const coarse = parseJson<ShowJson>(bandshelf(['show', 'coarse', ...lib, '--json']).stdout);
    expect(coarse.extras.resolution).toEqual({ value: 8, estimated: false });
    expect(coarse.qc.map((f) => f.code)).toContain('coarse-resolution');
  });

  it('check recomputes the resolution-matched vectors identically', () => {
    const r = bandshelf(['check', ...lib]);
    expect(r.code, r.stdout + r.stderr).toBe(0);
  });

  it("matches an unknown with its own resolution estimated from its spacing and recorded in the report's recipe", () => {
    const unknown = writeSpectrumCsv(join(dir, 'unknown.csv'), PROTEIN, { step: 0.5, seed: 9 });
    const r = bandshelf(['match', unknown, ...lib, '--json']);
    expect(r.code, r.stderr).toBe(0);
    const report: MatchReport = matchReportSchema.parse(parseJson(r.stdout));
    expect(report.hits[0]!.id).toBe('sharp');
    // Two point spacings of 0.5 cm⁻¹ (resolutionOf's Nyquist estimate).
    expect(report.query.recipe.resolution).toMatchObject({ target: 4, own: 1, estimated: true });
  });
});

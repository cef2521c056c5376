// `edit --set resolution=…` through the CLI: the recipe's pinned `own` follows the metadata and `check` passes.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { type Band, bandshelf, parseJson, tempDir, writeSpectrumCsv } from '../bandshelfCli.js';

// An invented protein-like band set; the 0.5 cm⁻¹ spacing makes the estimate (two spacings) 1 cm⁻¹.
const PROTEIN: Band[] = [
  { position: 1652, height: 0.8, fwhm: 6 },
  { position: 1545, height: 0.5, fwhm: 8 },
  { position: 1240, height: 0.2, fwhm: 12 },
];

interface ShowJson {
  kind: string;
  processed: (number | null)[];
  recipe: { resolution?: { target: number; own?: number; estimated?: boolean } };
  extras: { resolution?: { value: number; estimated: boolean } };
}

let dir: string;
let lib: string[];
const show = (id: string) => parseJson<ShowJson>(bandshelf(['show', id, ...lib, '--json']).stdout);

beforeAll(() => {
  dir = tempDir('bandshelf-edit-resolution-');
  lib = ['--library', join(dir, 'lib.sqlite')];
  expect(bandshelf(['init', ...lib, '--preset', 'dried-film']).code).toBe(0);
  writeSpectrumCsv(join(dir, 'film.csv'), PROTEIN, { step: 0.5 });
  writeFileSync(join(dir, 'film.meta.json'), JSON.stringify({ id: 'film', name: 'Film', resolution: 1 }));
  writeSpectrumCsv(join(dir, 'film3.csv'), PROTEIN, { step: 0.5 });
  writeFileSync(join(dir, 'film3.meta.json'), JSON.stringify({ id: 'film-3', name: 'Film', resolution: 3 }));
  const r = bandshelf(['add', join(dir, 'film.csv'), ...lib]);
  expect(r.code, r.stderr).toBe(0);
});

describe('edit of the resolution metadata', () => {
  it('re-pins own in the recipe and processes again as a fresh add of that resolution would', () => {
    expect(show('film').recipe.resolution).toMatchObject({ own: 1, estimated: false });
    const edit = bandshelf(['edit', 'film', '--set', 'resolution=3', ...lib, '--json']);
    expect(edit.code, edit.stderr).toBe(0);
    expect(parseJson<{ kind: string }>(edit.stdout).kind).toBe('data');
    const edited = show('film');
    expect(edited.recipe.resolution).toMatchObject({ target: 4, own: 3, estimated: false });
    expect(edited.extras.resolution).toEqual({ value: 3, estimated: false });
    // The same file added with resolution 3 from the start: kernel FWHM √(4² − 3²) either way (Gaussian widths add
    // in quadrature; common practice), so the two stored vectors are the same.
    const fresh = bandshelf(['add', join(dir, 'film3.csv'), ...lib]);
    expect(fresh.code, fresh.stderr).toBe(0);
    expect(edited.processed).toEqual(show('film-3').processed);
    const check = bandshelf(['check', ...lib]);
    expect(check.code, check.stdout + check.stderr).toBe(0);
  });

  it('removing the resolution pins the estimate from the spacing, flagged estimated', () => {
    const edit = bandshelf(['edit', 'film', '--set', 'resolution=', ...lib]);
    expect(edit.code, edit.stderr).toBe(0);
    expect(edit.stdout).toMatch(/resolution re-pinned/);
    // Two point spacings of 0.5 cm⁻¹ (resolutionOf's Nyquist estimate).
    expect(show('film').recipe.resolution).toMatchObject({ own: 1, estimated: true });
    expect(bandshelf(['check', ...lib]).code).toBe(0);
  });

  it('an edit that leaves the resolution alone stays a metadata revision with the same vector', () => {
    const before = show('film');
    const edit = bandshelf([
      'edit',
      'film',
      '--set',
      'notes=re-measured on the same bench',
      ...lib,
      '--json',
    ]);
    expect(edit.code, edit.stderr).toBe(0);
    expect(parseJson<{ kind: string }>(edit.stdout).kind).toBe('metadata');
    expect(show('film').processed).toEqual(before.processed);
  });

  it('without a resolution step only the recorded resolution follows the metadata', () => {
    const plain = ['--library', join(dir, 'plain.sqlite')];
    expect(bandshelf(['init', ...plain]).code).toBe(0);
    expect(bandshelf(['add', join(dir, 'film.csv'), ...plain]).code).toBe(0);
    const edit = bandshelf(['edit', 'film', '--set', 'resolution=8', ...plain, '--json']);
    expect(parseJson<{ kind: string }>(edit.stdout).kind).toBe('metadata');
    const shown = parseJson<ShowJson>(bandshelf(['show', 'film', ...plain, '--json']).stdout);
    expect(shown.extras.resolution).toEqual({ value: 8, estimated: false });
    expect(shown.recipe.resolution).toBeUndefined();
    expect(bandshelf(['check', ...plain]).code).toBe(0);
  });
});

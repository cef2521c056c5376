// The in-browser matcher, run here in Node on the published binary matrix: it reads a dropped file with the
// project's reader, processes it with the library recipe and ranks with the project's kernels, so its hits equal
// those of searchSpectra on the unquantised vectors.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { writeCsv } from '../../src/formats/writeCsv.js';
import { readOriginals } from '../../src/library/store/readOriginals.js';
import { searchSpectra } from '../../src/match/searchSpectra.js';
import { recipeSchema, timeDomainSchema } from '../../src/schema/recipe.js';
import { matchSpectrumFile, type PublishedSearchSet } from '../../src/site/browser/matchSpectrumFile.js';
import { decodeSearchMatrix } from '../../src/site/decodeSearchMatrix.js';
import { encodeSearchMatrix } from '../../src/site/encodeSearchMatrix.js';
import { pinNoiseFloor } from '../../src/spectrum/trace/pinNoiseFloor.js';
import { ROOT } from '../cli/bandshelfCli.js';
import { detail, GRID } from './fixtureObjects.js';

const library = [
  detail(
    'albumin',
    [
      [1652, 0.8, 30],
      [1545, 0.5, 30],
      [3300, 0.3, 150],
    ],
    { name: 'Albumin', class: 'protein' },
    1,
  ),
  detail(
    'glucose',
    [
      [1152, 0.35, 20],
      [1107, 0.45, 18],
      [1080, 0.5, 20],
      [1035, 0.8, 22],
    ],
    { name: 'Glucose', class: 'carbohydrate' },
    2,
  ),
  detail(
    'lipid',
    [
      [2922, 0.8, 22],
      [2852, 0.55, 18],
      [1740, 0.6, 20],
    ],
    { name: 'Lipid', class: 'lipid' },
    3,
  ),
  detail(
    'water',
    [
      [3404, 0.9, 300],
      [1643, 0.3, 70],
    ],
    { name: 'Water', class: 'solvent' },
    4,
  ),
];
const rows = library.length;
const cols = library[0]!.processed.length;
const processed = new Float32Array(rows * cols);
for (const [r, d] of library.entries()) processed.set(d.processed, r * cols);
const recipe = recipeSchema.parse({});
const entries = library.map((d) => ({
  id: d.summary.id,
  revision: 1,
  name: d.summary.name,
  class: d.summary.class,
  path: `entries/${d.summary.id}/`,
}));
const published: PublishedSearchSet = {
  grid: GRID,
  recipe,
  stateKey: 'test',
  entries,
  processed: decodeSearchMatrix(encodeSearchMatrix({ processed, rows, cols })).matrix,
  references: {},
};

describe('matchSpectrumFile', () => {
  it('ranks a noisy glucose spectrum from a CSV file first as glucose, with the scores searchSpectra gives', async () => {
    const unknown = detail(
      'u',
      [
        [1152, 0.3, 21],
        [1107, 0.4, 19],
        [1080, 0.45, 20],
        [1035, 0.7, 23],
      ],
      {},
      77,
    );
    const bytes = new TextEncoder().encode(writeCsv(unknown.original));
    const result = await matchSpectrumFile(bytes, 'unknown.csv', published, { k: 4 });
    expect(result.title).toBe('unknown.csv');
    expect(result.hits[0]!.id).toBe('glucose');
    expect(result.hits[0]!.path).toBe('entries/glucose/');
    const [exact] = searchSpectra(
      { grid: GRID, recipe, stateKey: 'exact', entries, processed },
      [unknown.processed],
      { k: 4, precision: 'exact' },
    );
    expect(result.hits.map((h) => h.id)).toEqual(exact!.map((h) => h.id));
    for (let i = 0; i < 4; i++) expect(Math.abs(result.hits[i]!.score - exact![i]!.score)).toBeLessThan(1e-4);
  });

  it('reads a header-less %T file given its unit to the hits of its absorbance twin', async () => {
    const unknown = detail(
      'u',
      [
        [1652, 0.7, 31],
        [1545, 0.45, 29],
        [3300, 0.25, 140],
      ],
      {},
      78,
    );
    const { wavenumber, absorbance } = unknown.original;
    const rowsOf = (f: (a: number) => number) =>
      new TextEncoder().encode(Array.from(wavenumber, (w, i) => `${w}\t${f(absorbance[i]!)}`).join('\n'));
    // %T = 100 · 10^(−A) (decadic absorbance, common practice).
    const twin = await matchSpectrumFile(
      rowsOf((a) => a),
      'a.txt',
      published,
      { k: 4 },
    );
    const percent = await matchSpectrumFile(
      rowsOf((a) => 100 * 10 ** -a),
      't.txt',
      published,
      {
        k: 4,
        read: { yUnit: 'percent-transmittance' },
      },
    );
    expect(twin.hits[0]!.id).toBe('albumin');
    expect(percent.hits.map((h) => h.id)).toEqual(twin.hits.map((h) => h.id));
    for (let i = 0; i < 4; i++) expect(percent.hits[i]!.score).toBeCloseTo(twin.hits[i]!.score, 6);
  });

  it('reports a file that is not a spectrum as the reader’s typed error', async () => {
    try {
      await matchSpectrumFile(new TextEncoder().encode('hello\nworld\n'), 'notes.csv', published);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(BandshelfError);
      expect((error as BandshelfError).file).toBe('notes.csv');
      expect((error as BandshelfError).oneLine()).toMatch(/^notes\.csv(:\d+)?: .*\[[A-Z_]+\]$/);
    }
  });

  it('matches a time-domain sample and reference trace pair as `match --time-domain --reference` reads it', async () => {
    // The demo's synthetic field-resolved glucose traces (src/demo; glucose band positions from memory).
    const folder = join(ROOT, 'library', 'time-domain');
    const sample = readFileSync(join(folder, 'glucose-field-resolved-sample-1.csv'));
    const reference = {
      name: 'glucose-field-resolved-reference-1.csv',
      bytes: readFileSync(join(folder, 'glucose-field-resolved-reference-1.csv')),
    };
    const result = await matchSpectrumFile(sample, 'glucose-field-resolved-sample-1.csv', published, {
      k: 4,
      timeDomain: { references: [reference] },
    });
    expect(result.hits[0]!.id).toBe('glucose');
    expect(result.report.query.file).toBe('glucose-field-resolved-sample-1.csv');
    // The CLI's reading of the same pair (readOriginals, as add and match --time-domain read it), written out as a
    // spectrum file: the same hits and scores.
    const [converted] = readOriginals({
      files: [
        { role: 'sample-trace', name: 'glucose-field-resolved-sample-1.csv', bytes: sample },
        { role: 'reference-trace', name: reference.name, bytes: reference.bytes },
      ],
      read: {},
      recipe: { ...recipe, timeDomain: pinNoiseFloor(timeDomainSchema.parse({})) },
    });
    const asFile = await matchSpectrumFile(
      new TextEncoder().encode(writeCsv(converted!.spectrum)),
      'converted.csv',
      published,
      { k: 4, mixture: true },
    );
    expect(result.hits.map((h) => h.id)).toEqual(asFile.hits.map((h) => h.id));
    for (let i = 0; i < 4; i++) expect(result.hits[i]!.score).toBeCloseTo(asFile.hits[i]!.score, 4);
  });
});

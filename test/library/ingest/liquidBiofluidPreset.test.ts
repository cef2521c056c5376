// The liquid-biofluid preset end to end in the store: water fitted and subtracted before the baseline, its scale and
// standard error recorded, and `check` recomputing the vectors.
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { prepareRevision } from '../../../src/library/ingest/prepareRevision.js';
import { checkLibrary } from '../../../src/library/store/checkLibrary.js';
import { commitRevisions } from '../../../src/library/store/commitRevisions.js';
import { initLibrary } from '../../../src/library/store/initLibrary.js';
import { RECIPE_PRESETS } from '../../../src/schema/recipePresets.js';
import { tempDir } from '../../cli/bandshelfCli.js';
import { inputFor } from '../libraryFixture.js';

// Liquid water's bands (common practice): O–H stretch ~3400, bend ~1640, combination band ~2125 cm⁻¹.
const WATER = [
  { position: 3400, height: 1.0, fwhm: 350 },
  { position: 1640, height: 0.4, fwhm: 70 },
  { position: 2125, height: 0.08, fwhm: 250 },
];
const PROTEIN = [
  { position: 1652, height: 0.05, fwhm: 40 },
  { position: 1545, height: 0.03, fwhm: 40 },
];

describe('liquid-biofluid preset', () => {
  it('fits 3 × water under a protein, records the scale with its standard error, and check passes', () => {
    const dir = tempDir('bandshelf-preset-');
    const library = initLibrary(join(dir, 'lib.sqlite'), {
      name: 'preset',
      recipe: RECIPE_PRESETS['liquid-biofluid'],
      now: new Date('2026-01-02T03:04:05Z'),
    });
    const commit = (id: string, bands: typeof WATER, seed: number) =>
      commitRevisions(
        library,
        [prepareRevision(library, inputFor(library, id, bands, seed), { force: true })],
        {
          author: 'test',
          now: new Date('2026-01-02T03:04:05Z'),
        },
      );
    // The water entry is not subtracted from itself.
    commit('water-liquid', WATER, 1);
    const serumBands = [...WATER.map((b) => ({ ...b, height: 3 * b.height })), ...PROTEIN];
    const prepared = prepareRevision(library, inputFor(library, 'serum', serumBands, 2), { force: true });
    const fitted = prepared.extras.subtracted!;
    expect(fitted).toHaveLength(1);
    expect(fitted[0]!.id).toBe('water-liquid');
    // By construction the serum holds 3 × the water; both files carry noise 5·10⁻⁴, so allow 4 standard errors
    // plus the water file's own noise share.
    expect(Math.abs(fitted[0]!.scale - 3)).toBeLessThan(0.05);
    expect(fitted[0]!.standardError).toBeGreaterThan(0);
    expect(prepared.recipe.subtract?.references[0]?.revision).toBe(1);
    commitRevisions(library, [prepared], { author: 'test', now: new Date('2026-01-02T03:04:05Z') });
    expect(checkLibrary(library)).toEqual([]);
    library.db.close();
  });
});

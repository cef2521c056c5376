// What a prepared revision records about the spectrum's resolution.
import { describe, expect, it } from 'vitest';
import { prepareRevision } from '../../../src/library/ingest/prepareRevision.js';
import { inputFor, newLibrary } from '../libraryFixture.js';

describe('prepareRevision resolution', () => {
  it('records the stated resolution, else two point spacings marked estimated (the fixture samples every 2 cm⁻¹)', () => {
    const { library } = newLibrary();
    const bands = [{ position: 1650, height: 0.5, fwhm: 20 }];
    const estimated = prepareRevision(library, inputFor(library, 'a', bands), { force: true });
    expect(estimated.extras.resolution).toEqual({ value: 4, estimated: true });
    const input = inputFor(library, 'b', bands);
    const stated = prepareRevision(
      library,
      { ...input, meta: { ...input.meta, resolution: 8 } },
      { force: true },
    );
    expect(stated.extras.resolution).toEqual({ value: 8, estimated: false });
    // No resolution step in the default recipe: nothing pinned and no note.
    expect(stated.recipe.resolution).toBeUndefined();
    expect(stated.qc.map((f) => f.code)).not.toContain('coarse-resolution');
    library.db.close();
  });

  it('pins the resolution into a resolution step and notes a spectrum coarser than the target', () => {
    const { library } = newLibrary();
    const input = inputFor(library, 'c', [{ position: 1650, height: 0.5, fwhm: 20 }]);
    const recipe = { ...library.recipe, resolution: { target: 4, lineShape: 'gaussian' as const } };
    const coarse = prepareRevision(
      library,
      { ...input, recipe, meta: { ...input.meta, resolution: 8 } },
      { force: true },
    );
    expect(coarse.recipe.resolution).toEqual({ target: 4, lineShape: 'gaussian', own: 8, estimated: false });
    const flag = coarse.qc.find((f) => f.code === 'coarse-resolution');
    expect(flag).toMatchObject({ level: 'warning', value: 8 });
    const sharp = prepareRevision(
      library,
      { ...input, recipe, meta: { ...input.meta, resolution: 2 } },
      { force: true },
    );
    expect(sharp.qc.map((f) => f.code)).not.toContain('coarse-resolution');
    library.db.close();
  });
});

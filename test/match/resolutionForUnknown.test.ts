// An unknown's resolution pinned into the recipe it is processed with.
import { describe, expect, it } from 'vitest';
import { resolutionForUnknown } from '../../src/match/resolutionForUnknown.js';
import { recipeSchema } from '../../src/schema/recipe.js';

const spectrum = {
  wavenumber: Float64Array.from({ length: 11 }, (_, i) => 1000 + i),
  absorbance: new Float64Array(11),
};

describe('resolutionForUnknown', () => {
  it('returns the same recipe when it has no resolution step', () => {
    const recipe = recipeSchema.parse({});
    const out = resolutionForUnknown(spectrum, recipe, { stated: 2 });
    expect(out.recipe).toBe(recipe);
    expect(out.warnings).toEqual([]);
  });

  it("pins the file's stated resolution, else two spacings, and notes an unknown coarser than the target", () => {
    const recipe = recipeSchema.parse({ resolution: { target: 4 } });
    expect(resolutionForUnknown(spectrum, recipe).recipe.resolution).toMatchObject({
      own: 2,
      estimated: true,
    });
    const coarse = resolutionForUnknown(spectrum, recipe, { stated: 8 });
    expect(coarse.recipe.resolution).toMatchObject({ own: 8, estimated: false });
    expect(coarse.warnings).toHaveLength(1);
    expect(coarse.warnings[0]).toContain('coarser');
  });
});

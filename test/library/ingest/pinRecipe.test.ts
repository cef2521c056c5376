// The technique-aware ATR default, pinned at ingest.
import { describe, expect, it } from 'vitest';
import { pinRecipe } from '../../../src/library/ingest/pinRecipe.js';
import { newLibrary } from '../libraryFixture.js';

describe('pinRecipe ATR default', () => {
  it('pins the diamond preset for an ATR entry, nothing for other techniques, and keeps what the recipe says', () => {
    const { library } = newLibrary();
    const recipe = library.recipe;
    // Diamond at 45°, sample index 1.5: the presets documented in the recipe schema (Harrick 1967 indices).
    expect(pinRecipe(library, recipe, { technique: 'atr' }).atr).toEqual({
      crystal: 'diamond',
      sampleIndex: 1.5,
      angle: 45,
      referenceWavenumber: 1000,
    });
    expect('atr' in pinRecipe(library, recipe, { technique: 'transmission' })).toBe(false);
    expect('atr' in pinRecipe(library, { ...recipe, atr: 'auto' })).toBe(false);
    expect(pinRecipe(library, { ...recipe, atr: null }, { technique: 'atr' }).atr).toBeNull();
    const ge = { crystal: 'ge' as const, sampleIndex: 1.4, angle: 45, referenceWavenumber: 1000 };
    expect(pinRecipe(library, { ...recipe, atr: ge }, { technique: 'transmission' }).atr).toEqual(ge);
    library.db.close();
  });
});

describe('pinRecipe resolution', () => {
  it("pins the entry's resolution into a resolution step, and leaves recipes without one alone", () => {
    const { library } = newLibrary();
    const recipe = library.recipe;
    const resolution = { value: 2, estimated: false };
    expect('resolution' in pinRecipe(library, recipe, { resolution })).toBe(false);
    const step = { target: 4, lineShape: 'gaussian' as const };
    expect(pinRecipe(library, { ...recipe, resolution: step }, { resolution }).resolution).toEqual({
      ...step,
      own: 2,
      estimated: false,
    });
    // A recipe that already names its own resolution keeps it.
    const given = { ...step, own: 1, estimated: false };
    expect(pinRecipe(library, { ...recipe, resolution: given }, { resolution }).resolution).toEqual(given);
    library.db.close();
  });
});

// The technique-aware ATR default, shared by ingest (entries) and the match pipeline (unknowns).
import { describe, expect, it } from 'vitest';
import { recipeSchema } from '../../src/schema/recipe.js';
import { pinAtr } from '../../src/spectrum/pinAtr.js';

describe('pinAtr', () => {
  const auto = recipeSchema.parse({ atr: 'auto' });

  it('gives an ATR spectrum the diamond preset at 45° and any other technique no step', () => {
    // Diamond at 45°, sample index 1.5: the usual single-reflection ATR accessory (common practice).
    expect(pinAtr(auto, { technique: 'atr' }).atr).toEqual({
      crystal: 'diamond',
      sampleIndex: 1.5,
      angle: 45,
      referenceWavenumber: 1000,
    });
    expect(pinAtr(auto, { technique: 'ATR' }).atr).toEqual(pinAtr(auto, { technique: 'atr' }).atr);
    expect('atr' in pinAtr(auto, { technique: 'transmission' })).toBe(false);
    expect('atr' in pinAtr(auto)).toBe(false);
  });

  it('keeps an explicit step and null as the recipe says, and does not modify the recipe', () => {
    const ge = recipeSchema.parse({ atr: { crystal: 'ge' } });
    expect(pinAtr(ge, { technique: 'transmission' })).toBe(ge);
    const never = recipeSchema.parse({ atr: null });
    expect(pinAtr(never, { technique: 'atr' })).toBe(never);
    pinAtr(auto, { technique: 'atr' });
    expect(auto.atr).toBe('auto');
  });
});

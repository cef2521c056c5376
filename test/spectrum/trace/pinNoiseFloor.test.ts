// pinNoiseFloor: the default factor k = 3 for new time-domain steps; a stated factor or null kept.
import { describe, expect, it } from 'vitest';
import { NOISE_FLOOR_FACTOR_DEFAULT, timeDomainSchema } from '../../../src/schema/recipe.js';
import { pinNoiseFloor } from '../../../src/spectrum/trace/pinNoiseFloor.js';

describe('pinNoiseFloor', () => {
  it('pins k = 3 into a step without the key (the 3σ detection criterion; common practice)', () => {
    const step = timeDomainSchema.parse({});
    expect(NOISE_FLOOR_FACTOR_DEFAULT).toBe(3);
    expect(pinNoiseFloor(step).noiseFloorFactor).toBe(3);
    expect(step.noiseFloorFactor).toBeUndefined(); // input not mutated
  });

  it('keeps a stated factor and an explicit null (the test turned off)', () => {
    expect(pinNoiseFloor(timeDomainSchema.parse({ noiseFloorFactor: 5 })).noiseFloorFactor).toBe(5);
    expect(pinNoiseFloor(timeDomainSchema.parse({ noiseFloorFactor: null })).noiseFloorFactor).toBeNull();
    expect(pinNoiseFloor(timeDomainSchema.parse({}), { factor: 2 }).noiseFloorFactor).toBe(2);
  });
});

// The library grid's schema: the default 4000:600:2 grid, and the grids `init --grid` must refuse.
import { describe, expect, it } from 'vitest';
import { gridSchema } from '../../src/schema/recipe.js';
import { gridLength } from '../../src/spectrum/gridLength.js';

const issue = (grid: unknown) => {
  const r = gridSchema.safeParse(grid);
  return r.success ? undefined : r.error.issues[0]?.message;
};

describe('gridSchema', () => {
  it('accepts the default mid-infrared grid 4000–600 cm⁻¹ at 2 cm⁻¹ in either order', () => {
    // (4000 − 600) / 2 + 1 = 1701 points, by hand.
    for (const g of [
      { start: 4000, stop: 600, step: 2 },
      { start: 600, stop: 4000, step: 2 },
    ]) {
      expect(issue(g)).toBeUndefined();
      expect(gridLength(gridSchema.parse(g))).toBe(1701);
    }
  });

  it('refuses a step that is not positive, naming the step', () => {
    expect(issue({ start: 4000, stop: 600, step: 0 })).toBe('the step must be > 0');
    expect(issue({ start: 4000, stop: 600, step: -2 })).toBe('the step must be > 0');
  });

  it('refuses wavenumbers at or below zero', () => {
    expect(issue({ start: 4000, stop: -600, step: 2 })).toMatch(/> 0 cm⁻¹/);
    expect(issue({ start: 0, stop: 600, step: 2 })).toMatch(/> 0 cm⁻¹/);
  });

  it('refuses a grid no library could hold, but not a fine one', () => {
    // 0.0001 cm⁻¹ over 3400 cm⁻¹ would be 34,000,001 points per vector.
    expect(issue({ start: 4000, stop: 600, step: 0.0001 })).toMatch(/more than 1,000,001 points/);
    // 0.01 cm⁻¹ over the same range is 340,001 points: fine-spaced, and allowed.
    expect(issue({ start: 4000, stop: 600, step: 0.01 })).toBeUndefined();
  });

  it('refuses a span shorter than one step or not a whole number of steps, and unknown fields', () => {
    expect(issue({ start: 600, stop: 600, step: 2 })).toMatch(/at least one step/);
    expect(issue({ start: 4000, stop: 600, step: 3 })).toMatch(/whole number of steps/);
    expect(gridSchema.safeParse({ start: 4000, stop: 600, step: 2, points: 1701 }).success).toBe(false);
  });
});

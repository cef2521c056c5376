// Tests of the baseline step: dispatch on the recipe's method with its parameters and defaults.
import { describe, expect, it } from 'vitest';
import { recipeSchema } from '../../src/schema/recipe.js';
import { airplsBaseline } from '../../src/spectrum/airplsBaseline.js';
import { alsBaseline } from '../../src/spectrum/alsBaseline.js';
import { rubberbandBaseline } from '../../src/spectrum/rubberbandBaseline.js';
import { subtractBaseline } from '../../src/spectrum/subtractBaseline.js';

const wavenumber = Float64Array.from({ length: 120 }, (_, i) => 1000 + 5 * i);
const absorbance = wavenumber.map((x) => 0.1 + 1e-4 * (x - 1000) + Math.exp(-(((x - 1300) / 25) ** 2)));
const spectrum = { wavenumber, absorbance };

describe('subtractBaseline', () => {
  it('dispatches on the recipe step with the recipe’s parameters', () => {
    const steps = recipeSchema.parse({}).baseline;
    expect(steps).toEqual({ method: 'rubberband' });
    const cases = [
      [{ method: 'rubberband' }, rubberbandBaseline(spectrum)],
      [
        { method: 'als', lambda: 1e4, p: 0.05, iterations: 5 },
        alsBaseline(spectrum, { lambda: 1e4, p: 0.05, iterations: 5 }),
      ],
      [
        { method: 'airpls', lambda: 30, iterations: 7 },
        airplsBaseline(spectrum, { lambda: 30, iterations: 7 }),
      ],
    ] as const;
    for (const [step, baseline] of cases) {
      const out = subtractBaseline(spectrum, step);
      for (let i = 0; i < wavenumber.length; i++)
        expect(out.absorbance[i]).toBe(absorbance[i]! - baseline[i]!);
    }
  });

  it('fills recipe defaults for ALS and airPLS', () => {
    const als = recipeSchema.parse({ baseline: { method: 'als' } }).baseline;
    expect(subtractBaseline(spectrum, als).absorbance).toEqual(
      absorbance.map((v, i) => v - alsBaseline(spectrum, { lambda: 1e5, p: 0.01, iterations: 10 })[i]!),
    );
  });

  it('returns a copy for "none" and never touches the input', () => {
    const before = absorbance.slice();
    const out = subtractBaseline(spectrum, { method: 'none' });
    expect(out.absorbance).toEqual(absorbance);
    expect(out.absorbance).not.toBe(absorbance);
    expect(out.wavenumber).not.toBe(wavenumber);
    subtractBaseline(spectrum, { method: 'rubberband' });
    expect(absorbance).toEqual(before);
  });

  it('leaves the rubberband-corrected spectrum non-negative with zeros at both ends', () => {
    const out = subtractBaseline(spectrum, { method: 'rubberband' });
    expect(Math.min(...out.absorbance)).toBeGreaterThanOrEqual(0);
    expect(out.absorbance[0]).toBe(0);
    expect(out.absorbance.at(-1)).toBe(0);
  });
});

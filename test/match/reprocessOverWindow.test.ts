// Processing a reference again over a partial unknown's span: the same points give the same vector.
import { describe, expect, it } from 'vitest';
import { reprocessOverWindow } from '../../src/match/reprocessOverWindow.js';
import { spectrumExtent } from '../../src/match/spectrumExtent.js';
import { type Grid, recipeSchema } from '../../src/schema/recipe.js';
import { gridAxis } from '../../src/spectrum/gridAxis.js';
import { processSpectrum } from '../../src/spectrum/processSpectrum.js';
import type { Spectrum } from '../../src/spectrum/types.js';

const grid: Grid = { start: 4000, stop: 600, step: 2 };
// The library default: CO₂ window excluded, rubberband baseline, vector normalisation.
const recipe = recipeSchema.parse({});

/** Gaussian bands [position, height, FWHM] on a sloped line, every 1 cm⁻¹ from `lo` to `hi`. */
function spectrum(lo: number, hi: number, bands: [number, number, number][]): Spectrum {
  const wavenumber = Float64Array.from({ length: hi - lo + 1 }, (_, i) => lo + i);
  const absorbance = wavenumber.map((x) => {
    let y = 0.05 + 0.00002 * (x - 600);
    for (const [p, h, w] of bands) y += h * Math.exp(-4 * Math.LN2 * ((x - p) / w) ** 2);
    return y;
  });
  return { wavenumber, absorbance };
}

function crop(s: Spectrum, lo: number, hi: number): Spectrum {
  const keep = Array.from(s.wavenumber, (x, i) => (x >= lo && x <= hi ? i : -1)).filter((i) => i >= 0);
  return {
    wavenumber: Float64Array.from(keep, (i) => s.wavenumber[i]!),
    absorbance: Float64Array.from(keep, (i) => s.absorbance[i]!),
  };
}

// A strong band at 1754 cm⁻¹, just past the 1750 cm⁻¹ end of a tunable-laser-like span, and one inside it.
const reference = spectrum(600, 4000, [
  [1754, 1, 14],
  [1300, 0.5, 12],
]);
const window = { min: 1000, max: 1750 };
const axis = gridAxis(grid);
const at1750 = axis.indexOf(1750);

describe('reprocessOverWindow', () => {
  it('gives exactly the vector the unknown gets when it holds the same points', () => {
    const unknown = processSpectrum(crop(reference, 1000, 1750), recipe, grid).processed;
    const again = reprocessOverWindow(reference, recipe, grid, window);
    expect(again).not.toBeNull();
    for (let i = 0; i < axis.length; i++) {
      if (Number.isNaN(unknown[i]!)) expect(again![i]).toBeNaN();
      else expect(Math.abs(again![i]! - unknown[i]!)).toBeLessThan(1e-12);
    }
  });

  it('differs in shape from the vector stored over the full range, which a scale alone cannot fix', () => {
    const stored = processSpectrum(reference, recipe, grid).processed;
    const again = reprocessOverWindow(reference, recipe, grid, window)!;
    // A rubberband hull passes through both end points of the span it is given (common practice), so on the
    // short span the 1754 band's tail at 1750 cm⁻¹ is cut down to about nothing; over the full range the hull is
    // the sloped line and leaves that tail, exp(−4 ln 2 (4/14)²) ≈ 0.80 of the 1754 band's height, i.e. about
    // 1.6 × the 0.5 band at 1300 (the 2 cm⁻¹ bins average it a little).
    const at1300 = axis.indexOf(1300);
    expect(stored[at1750]! / stored[at1300]!).toBeCloseTo(2 * Math.exp(-4 * Math.LN2 * (4 / 14) ** 2), 1);
    expect(again[at1750]! / again[at1300]!).toBeLessThan(0.05);
  });

  it('returns null when the reference reaches no further than the span, or misses it', () => {
    expect(reprocessOverWindow(reference, recipe, grid, { min: 600, max: 4000 })).toBeNull();
    expect(reprocessOverWindow(reference, recipe, grid, { min: 599, max: 4001 })).toBeNull();
    const short = crop(reference, 1000, 1750);
    expect(reprocessOverWindow(short, recipe, grid, window)).toBeNull();
    expect(reprocessOverWindow(short, recipe, grid, { min: 2000, max: 3000 })).toBeNull();
  });

  it('honours the reference recipe’s own crop when narrowing it', () => {
    const cropped = recipeSchema.parse({ crop: { min: 1200, max: 3000 } });
    const again = reprocessOverWindow(reference, cropped, grid, window)!;
    const covered = axis.filter((_, i) => Number.isFinite(again[i]!));
    expect([covered[0], covered.at(-1)]).toEqual([1200, 1750]);
  });
});

describe('spectrumExtent', () => {
  it('spans the finite points inside the crop', () => {
    const s: Spectrum = {
      wavenumber: Float64Array.of(900, 1000, 1100, 1200),
      absorbance: Float64Array.of(Number.NaN, 0.1, 0.2, 0.3),
    };
    expect(spectrumExtent(s)).toEqual({ min: 1000, max: 1200 });
    expect(spectrumExtent(s, { crop: { min: 950, max: 1150 } })).toEqual({ min: 1000, max: 1100 });
    expect(spectrumExtent(s, { crop: { min: 1150, max: 1190 } })).toBeNull();
  });
});

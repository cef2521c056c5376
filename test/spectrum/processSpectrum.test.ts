// Tests of the whole processing recipe end to end on small literal spectra.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { type RecipeInput, recipeSchema } from '../../src/schema/recipe.js';
import { gridAxis } from '../../src/spectrum/gridAxis.js';
import { processSpectrum } from '../../src/spectrum/processSpectrum.js';
import type { Spectrum } from '../../src/spectrum/types.js';
import { mulberry32 } from '../mulberry32.js';

const spectrum = (x: ArrayLike<number>, y: ArrayLike<number>): Spectrum => ({
  wavenumber: Float64Array.from(x),
  absorbance: Float64Array.from(y),
});
/**
 * Every step off unless the case turns it on, so each hand value follows from the steps named; the hand values
 * use the bin-average-or-interpolate resampling (resampleByArea has its own tests).
 */
const plain = (extra: RecipeInput = {}) =>
  recipeSchema.parse({
    exclude: [],
    baseline: { method: 'none' },
    normalise: { method: 'none' },
    resample: { method: 'cell-or-interpolate' },
    ...extra,
  });
const grid = { start: 1010, stop: 1000, step: 2 };
const values = (v: Float64Array) =>
  Array.from(v, (a) => (Number.isNaN(a) ? null : Math.round(a * 1e9) / 1e9));

describe('processSpectrum', () => {
  it('sorts, merges, crops and resamples a descending file spectrum (by hand)', () => {
    // Descending with the middle point written twice; after the crop to 1002–1010 only 1005 and 1010 remain,
    // so 1006 and 1008 interpolate 10 → 0 and everything below 1005 is not covered.
    const original = spectrum([1010, 1005, 1005, 1000], [0, 10, 10, 0]);
    const whole = processSpectrum(original, plain(), grid);
    expect(values(whole.processed)).toEqual([0, 4, 8, 8, 4, 0]);
    const cropped = processSpectrum(original, plain({ crop: { min: 1010, max: 1002 } }), grid);
    expect(values(cropped.processed)).toEqual([null, null, null, 8, 4, 0]);
  });

  it('removes exclusion windows from the data and from the grid, then normalises to unit length', () => {
    // On-grid source; 1004 and 1006 lie in the window [1003, 1007]: NaN on the grid although the 6 cm⁻¹
    // hole would be within maxGap. Vector norm of (0, 2, 8, 10) is √168.
    const original = spectrum([1000, 1002, 1004, 1006, 1008, 1010], [0, 2, 4, 6, 8, 10]);
    const recipe = plain({ exclude: [{ min: 1003, max: 1007 }], normalise: { method: 'vector' } });
    const { processed } = processSpectrum(original, recipe, grid);
    const norm = Math.sqrt(168);
    expect(values(processed)).toEqual(
      [0, 2 / norm, null, null, 8 / norm, 10 / norm].map((v) =>
        v === null ? null : Math.round(v * 1e9) / 1e9,
      ),
    );
  });

  it('smooths each stretch between gaps separately, so nothing leaks across the excluded CO₂ window', () => {
    // Absorbance 1 below the default CO₂ window (2280–2400 cm⁻¹, common practice) and 5 above: smoothing the
    // stretches together would blend them next to the window.
    const x = Array.from({ length: 301 }, (_, i) => 2200 + i);
    const original = spectrum(
      x,
      x.map((v) => (v < 2340 ? 1 : 5)),
    );
    const recipe = recipeSchema.parse({
      baseline: { method: 'none' },
      normalise: { method: 'none' },
      smooth: { width: 9, order: 2 },
    });
    const g = { start: 2500, stop: 2200, step: 2 };
    const { processed } = processSpectrum(original, recipe, g);
    const axis = gridAxis(g);
    for (let i = 0; i < axis.length; i++) {
      const w = axis[i]!;
      if (w >= 2280 && w <= 2400) expect(processed[i]).toBeNaN();
      else expect(processed[i]).toBeCloseTo(w < 2280 ? 1 : 5, 12);
    }
  });

  it('leaves a stretch shorter than the smoothing window unsmoothed (18 cm⁻¹ is 9 points at 2 cm⁻¹)', () => {
    const original = spectrum([1000, 1002, 1004, 1006, 1008, 1010], [0, 3, 1, 4, 1, 5]);
    const { processed } = processSpectrum(original, plain({ smooth: { width: 18, order: 2 } }), grid);
    expect(values(processed)).toEqual([0, 3, 1, 4, 1, 5]);
  });

  it('subtracts a supplied reference and reports its fitted scale', () => {
    // Sample = 0.5 × "water" + a band at 1004 outside the fit window (1006–1010): the band is what remains.
    const x = [1000, 1001, 1002, 1003, 1004, 1005, 1006, 1007, 1008, 1009, 1010];
    const water = x.map((v) => 1 + 0.1 * (v - 1000) + 0.02 * (v - 1005) ** 2);
    const band = x.map((v) => (v <= 1005 ? Math.max(0, 1 - Math.abs(v - 1004) / 2) : 0));
    const sample = spectrum(
      x,
      x.map((_, i) => 0.5 * water[i]! + band[i]!),
    );
    const references = new Map([['water-01', spectrum(x, water)]]);
    const recipe = plain({ reference: { id: 'water-01', window: { min: 1006, max: 1010 } } });
    const onGrid = { start: 1010, stop: 1000, step: 1 };
    const result = processSpectrum(sample, recipe, onGrid, { references });
    expect(result.referenceScale).toBeCloseTo(0.5, 9);
    expect(values(result.processed)).toEqual(band.map((v) => Math.round(v * 1e9) / 1e9));
  });

  it('runs EMSC against a supplied reference and returns its coefficients', () => {
    const x = Array.from({ length: 41 }, (_, i) => 1000 + i);
    const ref = x.map((v) => Math.exp(-(((v - 1020) / 4) ** 2)) + 0.3 * Math.exp(-(((v - 1008) / 3) ** 2)));
    // Multiplicative 1.3 and an offset of 0.1: EMSC should give back the reference.
    const sample = spectrum(
      x,
      ref.map((v) => 1.3 * v + 0.1),
    );
    const recipe = plain({ emsc: { id: 'ref', degree: 1 } });
    const onGrid = { start: 1040, stop: 1000, step: 1 };
    const result = processSpectrum(sample, recipe, onGrid, {
      references: new Map([['ref', spectrum(x, ref)]]),
    });
    expect(result.emscCoefficients?.length).toBe(3);
    for (let i = 0; i < x.length; i++) expect(result.processed[i]).toBeCloseTo(ref[i]!, 9);
  });

  it('names a missing reference entry with NOT_FOUND', () => {
    const original = spectrum([1000, 1010], [0, 1]);
    let caught: unknown;
    try {
      processSpectrum(original, plain({ reference: { id: 'buffer-pbs' } }), grid, { file: 'u.csv' });
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(BandshelfError);
    expect((caught as BandshelfError).code).toBe('NOT_FOUND');
    expect((caught as BandshelfError).message).toContain('buffer-pbs');
    expect((caught as BandshelfError).file).toBe('u.csv');
  });

  it('is deterministic and leaves its input untouched under the default recipe', () => {
    // A synthetic descending spectrum 4000 → 600 at an uneven 1.93 cm⁻¹ with a sloped baseline and seeded noise.
    const rand = mulberry32(31);
    const n = 1762;
    const x = Float64Array.from({ length: n }, (_, i) => 4000 - 1.93 * i);
    const y = x.map(
      (v) =>
        0.05 +
        2e-5 * v +
        Math.exp(-(((v - 1652) / 12) ** 2)) +
        0.6 * Math.exp(-(((v - 1545) / 14) ** 2)) +
        0.002 * rand(),
    );
    const original = { wavenumber: x, absorbance: y };
    const before = [x.slice(), y.slice()];
    const recipe = recipeSchema.parse({ smooth: {} });
    const libraryGrid = { start: 4000, stop: 600, step: 2 };
    const first = processSpectrum(original, recipe, libraryGrid);
    const second = processSpectrum(original, recipe, libraryGrid);
    expect(Buffer.from(first.processed.buffer).equals(Buffer.from(second.processed.buffer))).toBe(true);
    expect(Array.from(x)).toEqual(Array.from(before[0]!));
    expect(Array.from(y)).toEqual(Array.from(before[1]!));
    expect(first.processed.length).toBe(1701);
    // Unit length over the covered points, the CO₂ window not covered, everything else finite.
    const axis = gridAxis(libraryGrid);
    let sumSq = 0;
    for (let i = 0; i < axis.length; i++) {
      const v = first.processed[i]!;
      const w = axis[i]!;
      if (w >= 2280 && w <= 2400) expect(v).toBeNaN();
      else if (w >= x[n - 1]!) {
        expect(Number.isFinite(v)).toBe(true);
        sumSq += v * v;
      }
    }
    expect(sumSq).toBeCloseTo(1, 12);
  });
});

describe('processSpectrum on spectra computed from time-domain traces', () => {
  it('treats the frequency-bin spacing as sampling, not as gaps, even when it exceeds resample.maxGap', () => {
    // Bins every 20 cm⁻¹ (a short trace): with the 16 cm⁻¹ default gap limit a plain spectrum keeps only the 60 grid
    // points that fall exactly on a bin and nothing between them.
    const n = 60;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      x[i] = 1000 + 20 * i;
      y[i] = Math.exp(-(((x[i]! - 1600) / 80) ** 2));
    }
    const grid = { start: 2200, stop: 900, step: 2 };
    const plain = recipeSchema.parse({
      resample: { method: 'cell-or-interpolate' },
      baseline: { method: 'none' },
      exclude: [],
      normalise: { method: 'none' },
    });
    const fromTraces = recipeSchema.parse({
      resample: { method: 'cell-or-interpolate' },
      baseline: { method: 'none' },
      exclude: [],
      normalise: { method: 'none' },
      timeDomain: {},
    });
    const covered = (v: Float64Array) => v.filter((a) => Number.isFinite(a)).length;
    expect(covered(processSpectrum({ wavenumber: x, absorbance: y }, plain, grid).processed)).toBe(60);
    const result = processSpectrum({ wavenumber: x, absorbance: y }, fromTraces, grid).processed;
    // 1000–2180 cm⁻¹ on a 2 cm⁻¹ grid from 900: points 1000, 1002, …, 2180 are covered (591 points).
    expect(covered(result)).toBe(591);
    // Linear interpolation between bins at 1600 (the band centre, a bin) returns the bin value exactly.
    expect(result[(1600 - 900) / 2]).toBeCloseTo(1, 12);
  });
});

describe('processSpectrum: parameters in wavenumbers (recipe version 2)', () => {
  // An invented two-band spectrum on a curved baseline, sampled at spacing h over 3990–1010 cm⁻¹.
  const sampled = (h: number): Spectrum => {
    const n = Math.round(2980 / h) + 1;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const v = 1010 + i * h;
      x[i] = v;
      y[i] =
        0.1 +
        2e-8 * (v - 2500) ** 2 +
        Math.exp(-0.5 * ((v - 1650) / 14) ** 2) +
        0.6 * Math.exp(-0.5 * ((v - 2920) / 18) ** 2);
    }
    return spectrum(x, y);
  };
  const grid4 = { start: 4000, stop: 1000, step: 4 };

  for (const baseline of [
    { method: 'als' as const, lambda: 1e9, p: 0.001, iterations: 20 },
    { method: 'airpls' as const, lambda: 1e5, iterations: 20 },
  ]) {
    it(`${baseline.method}: 0.5, 1, 2 and 4 cm⁻¹ spacing agree within 1 % of the largest band`, () => {
      // The target; λ in cm^(2d) per Eilers, Anal. Chem. 75:3631 (2003).
      const recipe = recipeSchema.parse({
        exclude: [],
        baseline,
        smooth: { width: 12, order: 2 },
        normalise: { method: 'none' },
      });
      const vectors = [0.5, 1, 2, 4].map((h) => processSpectrum(sampled(h), recipe, grid4).processed);
      const ref = vectors[0]!;
      let peak = 0;
      for (const v of ref) if (Number.isFinite(v)) peak = Math.max(peak, Math.abs(v));
      for (const v of vectors.slice(1)) {
        let worst = 0;
        for (let i = 0; i < v.length; i++) {
          if (Number.isFinite(v[i]!) && Number.isFinite(ref[i]!))
            worst = Math.max(worst, Math.abs(v[i]! - ref[i]!));
        }
        expect(worst / peak).toBeLessThan(0.01);
      }
    });
  }

  it('a version-2 recipe refuses a smoothing window in points', () => {
    expect(recipeSchema.safeParse({ smooth: { window: 9 } }).success).toBe(false);
    expect(recipeSchema.safeParse({ version: 1, smooth: { window: 9 } }).success).toBe(true);
  });
});

describe('processSpectrum: version-1 recipes keep their meaning', () => {
  it('recomputes the vectors the per-point code gave, byte for byte', async () => {
    // The sha-256 of the processed bytes were recorded by running this input through the code before the
    // unit change (λ and window per point); a stored version-1 recipe must reproduce them for `check`.
    const { createHash } = await import('node:crypto');
    const n = 1500;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      x[i] = 600 + i * 2.3;
      y[i] =
        0.3 * Math.exp(-(((x[i]! - 1650) / 15) ** 2)) +
        0.2 * Math.exp(-(((x[i]! - 2920) / 25) ** 2)) +
        1e-4 * x[i]! +
        0.01 * Math.sin(i * 1.7);
    }
    const expected = {
      als: 'edf95007bc64309486c87430d8835cfae54437dd84848686ba7e38b4ed8d37b1',
      airpls: 'c20aa2dee1532cb7c79e31c613ff46695fc3786bde62813cbfe7132bf256d148',
    };
    for (const b of [
      { method: 'als' as const, lambda: 1e5, p: 0.01, iterations: 10 },
      { method: 'airpls' as const, lambda: 100, iterations: 20 },
    ]) {
      const r = recipeSchema.parse({ version: 1, baseline: b, smooth: { window: 9, order: 2 } });
      const out = processSpectrum(spectrum(x, y), r, { start: 4000, stop: 600, step: 2 }).processed;
      expect(createHash('sha256').update(Buffer.from(out.buffer)).digest('hex')).toBe(expected[b.method]);
    }
  });

  it('applies an explicit ATR step to the sample, and none for auto or a recipe without the key (Harrick 1967)', () => {
    // Flat absorbance 1 over 1000–1010 cm⁻¹: the correction multiplies by ν̃/1000 (d_p ∝ λ), by hand.
    const original = spectrum([1000, 1002, 1004, 1006, 1008, 1010], [1, 1, 1, 1, 1, 1]);
    const corrected = processSpectrum(original, plain({ atr: { crystal: 'ge' } }), grid);
    expect(values(corrected.processed)).toEqual([1, 1.002, 1.004, 1.006, 1.008, 1.01]);
    for (const atr of ['auto', null, undefined] as const) {
      const kept = processSpectrum(original, plain(atr === undefined ? {} : { atr }), grid);
      expect(values(kept.processed)).toEqual([1, 1, 1, 1, 1, 1]);
    }
  });
});

describe('processSpectrum: resolution matching', () => {
  // A Gaussian band of intrinsic FWHM 8 cm⁻¹ seen through Gaussian instrument line shapes of 2 and 6 cm⁻¹ is a
  // Gaussian of FWHM √(8² + 2²) and √(8² + 6²) = 10 cm⁻¹: widths of convolved Gaussians add in quadrature
  // (common practice) while the area stays (peak × width fixed). Brought to 6 cm⁻¹, both must be the same 10 cm⁻¹ band.
  const measured = (ils: number, step: number) => {
    const width = Math.sqrt(64 + ils * ils);
    const n = Math.round(400 / step) + 1;
    const x = Float64Array.from({ length: n }, (_, i) => 1300 + i * step);
    return spectrum(
      x,
      Array.from(x, (v) => (8 / width) * Math.exp(-4 * Math.LN2 * ((v - 1500) / width) ** 2)),
    );
  };
  const wide = { start: 1300, stop: 1700, step: 1 };
  const largestDifference = (a: Float64Array, b: Float64Array) => {
    let d = 0;
    for (let i = 0; i < a.length; i++) d = Math.max(d, Math.abs(a[i]! - b[i]!));
    return d;
  };

  it('gives a sharp and a coarse instrument the same vector at the common resolution, and changes nothing without the step', () => {
    const sharp = measured(2, 0.25);
    const coarse = measured(6, 1);
    const step = (own: number) => plain({ resolution: { target: 6, own }, resample: { method: 'area' } });
    const a = processSpectrum(sharp, step(2), wide).processed;
    const b = processSpectrum(coarse, step(6), wide).processed;
    // Within 1 % of the band's height (0.8), the agreement target; what is left is the line-segment
    // drawing of the 1 cm⁻¹ points on the band's top.
    expect(largestDifference(a, b)).toBeLessThan(0.008);
    // Without the step the two differ by the width difference (about 12 % of the peak here).
    const off = plain({ resample: { method: 'area' } });
    const c = processSpectrum(sharp, off, wide).processed;
    const d = processSpectrum(coarse, off, wide).processed;
    expect(largestDifference(c, d)).toBeGreaterThan(0.05);
    // Absent and null both mean no step: the vector is byte for byte the recipe-without-the-key one.
    const none = processSpectrum(
      sharp,
      plain({ resolution: null, resample: { method: 'area' } }),
      wide,
    ).processed;
    expect(Array.from(none)).toEqual(Array.from(c));
  });

  it('estimates the own resolution from the spacing when the recipe carries none', () => {
    // At 2 cm⁻¹ spacing the estimate is 4 cm⁻¹, so a target of 4 leaves the spectrum as it is.
    const coarse = measured(6, 2);
    const at4 = processSpectrum(
      coarse,
      plain({ resolution: { target: 4 }, resample: { method: 'area' } }),
      wide,
    );
    const off = processSpectrum(coarse, plain({ resample: { method: 'area' } }), wide);
    expect(Array.from(at4.processed)).toEqual(Array.from(off.processed));
  });
});

// Tests of reference (water) subtraction: the scale fitted in a window, interpolation, refused windows.
import { describe, expect, it } from 'vitest';
import { subtractReference } from '../../src/spectrum/subtractReference.js';
import type { Spectrum } from '../../src/spectrum/types.js';
import { bandshelfErrorOf } from '../bandshelfErrorOf.js';
import { mulberry32 } from '../mulberry32.js';

const gaussian = (x: number, centre: number, fwhm: number, height: number) =>
  height * Math.exp(-4 * Math.LN2 * ((x - centre) / fwhm) ** 2);

// Liquid water's O–H stretch, combination band and H–O–H bend near 3404, 2125 and 1643 cm⁻¹ (Bertie & Lan,
// Appl. Spectrosc. 50, 1996; from memory); widths and heights invented for the test.
const water = (x: number) =>
  gaussian(x, 3404, 350, 1.0) + gaussian(x, 2125, 160, 0.08) + gaussian(x, 1643, 75, 0.35);
// Amide I and II of a protein (Barth 2007; from memory): no absorption inside the 1900–2300 cm⁻¹ window.
const protein = (x: number) => gaussian(x, 1652, 30, 0.2) + gaussian(x, 1545, 35, 0.12);

function sampled(from: number, to: number, step: number, f: (x: number) => number): Spectrum {
  const n = Math.floor((to - from) / step) + 1;
  const wavenumber = Float64Array.from({ length: n }, (_, i) => from + i * step);
  return { wavenumber, absorbance: wavenumber.map(f) };
}

const window = { min: 1900, max: 2300 };

describe('subtractReference', () => {
  it('recovers a known water scale exactly when the reference is sampled at the same wavenumbers', () => {
    const scale = 0.73;
    const offset = 0.05;
    const sample = sampled(1000, 4000, 2, (x) => protein(x) + scale * water(x) + offset);
    const reference = sampled(1000, 4000, 2, water);
    const result = subtractReference(sample, reference, window);
    expect(result.scale).toBeCloseTo(scale, 12);
    expect(result.offset).toBeCloseTo(offset, 12);
    expect(result.points).toBe(201);
    // What is left is the protein on the untouched offset: the offset belongs to the baseline step.
    for (let i = 0; i < sample.wavenumber.length; i++) {
      expect(result.spectrum.absorbance[i]).toBeCloseTo(protein(sample.wavenumber[i]!) + offset, 12);
    }
  });

  it('interpolates a finer reference onto the sample’s own wavenumbers', () => {
    const sample = sampled(1000.37, 3999, 1.93, (x) => protein(x) + 0.41 * water(x));
    const reference = sampled(900, 4100, 0.5, water);
    const result = subtractReference(sample, reference, window);
    // Linear interpolation of a 160 cm⁻¹ wide band on a 0.5 cm⁻¹ grid errs by ~h²/8·|y''| ≈ 1e-7 of its
    // height.
    expect(result.scale).toBeCloseTo(0.41, 5);
    expect(result.spectrum.wavenumber).toEqual(sample.wavenumber);
  });

  it('finds the scale to within 1 % on noisy data', () => {
    const rnd = mulberry32(77);
    const gauss = () => Math.sqrt(-2 * Math.log(1 - rnd())) * Math.cos(2 * Math.PI * rnd());
    const sample = sampled(1000, 4000, 1, (x) => protein(x) + 0.6 * water(x) + 0.02 + 5e-4 * gauss());
    const result = subtractReference(sample, sampled(1000, 4000, 1, water), window);
    // Noise 5e-4 over 401 points against a band of 0.08 × 0.6: the standard error is ≈ 0.3 % of the scale.
    expect(Math.abs(result.scale - 0.6) / 0.6).toBeLessThan(0.01);
  });

  it('without the offset term, an offset in the window biases the scale', () => {
    const sample = sampled(1000, 4000, 2, (x) => 0.5 * water(x) + 0.03);
    const reference = sampled(1000, 4000, 2, water);
    expect(subtractReference(sample, reference, window).scale).toBeCloseTo(0.5, 12);
    const plain = subtractReference(sample, reference, window, { fitOffset: false });
    expect(plain.offset).toBe(0);
    expect(plain.scale).toBeGreaterThan(0.6);
  });

  it('drops the points the reference does not cover', () => {
    const sample = sampled(600, 4000, 2, (x) => protein(x) + 0.3 * water(x));
    const reference = sampled(1000, 4000, 2, water);
    const result = subtractReference(sample, reference, window);
    expect(result.spectrum.wavenumber[0]).toBe(1000);
    expect(result.spectrum.wavenumber.length).toBe(sample.wavenumber.length - 200);
  });

  it('accepts the window in either order', () => {
    const sample = sampled(1000, 4000, 2, (x) => 0.2 * water(x));
    const reference = sampled(1000, 4000, 2, water);
    expect(subtractReference(sample, reference, { min: 2300, max: 1900 }).scale).toBeCloseTo(0.2, 12);
  });

  it('refuses a window with too few points or without reference signal (BAD_RECIPE)', () => {
    const sample = sampled(1000, 4000, 2, (x) => water(x));
    const reference = sampled(1000, 4000, 2, water);
    const few = bandshelfErrorOf(() =>
      subtractReference(sample, reference, { min: 2000, max: 2006 }, { file: 'serum.csv' }),
    );
    expect([few.code, few.field, few.file]).toEqual(['BAD_RECIPE', 'reference.window', 'serum.csv']);
    expect(few.message).toContain('only 4 point(s)');
    const outside = bandshelfErrorOf(() => subtractReference(sample, sampled(3000, 4000, 2, water), window));
    expect(outside.message).toContain('only 0 point(s)');
    const flat = bandshelfErrorOf(() =>
      subtractReference(
        sample,
        sampled(1000, 4000, 2, () => 0.1),
        window,
      ),
    );
    expect(flat.message).toContain('no signal');
  });

  it('does not modify its inputs', () => {
    const sample = sampled(1000, 4000, 2, (x) => protein(x) + 0.3 * water(x));
    const reference = sampled(1000, 4000, 2, water);
    const before = [sample.absorbance.slice(), reference.absorbance.slice()];
    subtractReference(sample, reference, window);
    expect([sample.absorbance, reference.absorbance]).toEqual(before);
  });
});

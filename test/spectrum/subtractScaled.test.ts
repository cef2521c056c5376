// subtractScaled: the fitted scale and its standard error, and a given scale.
import { describe, expect, it } from 'vitest';
import { fitReferences } from '../../src/spectrum/fitReferences.js';
import { subtractScaled } from '../../src/spectrum/subtractScaled.js';
import type { Spectrum } from '../../src/spectrum/types.js';
import { mulberry32 } from '../mulberry32.js';

const x = Float64Array.from({ length: 1201 }, (_, i) => 1000 + i);
// An invented water-like reference: a broad band near 2130 cm⁻¹ and a bend near 1640 cm⁻¹.
const water = x.map(
  (v) => 0.3 * Math.exp(-0.5 * ((v - 2130) / 120) ** 2) + Math.exp(-0.5 * ((v - 1640) / 30) ** 2),
);
const solute = x.map((v) => 0.2 * Math.exp(-0.5 * ((v - 1450) / 10) ** 2));
const of = (y: Float64Array): Spectrum => ({ wavenumber: x, absorbance: y });

describe('subtractScaled', () => {
  it('fits the scale in the window and leaves the solute (exact without noise, by construction)', () => {
    const y = x.map((_, i) => 0.8 * water[i]! + solute[i]! + 0.01);
    const r = subtractScaled(of(y), of(water), { window: { min: 1900, max: 2300 } });
    expect(r.scale).toBeCloseTo(0.8, 9);
    // The axis ends at 2200 cm⁻¹: 1900–2200 inclusive is 301 points.
    expect(r.points).toBe(301);
    const at1450 = x.indexOf(1450);
    expect(r.spectrum.absorbance[at1450]).toBeCloseTo(0.2 + 0.01, 9);
  });

  it('reports the standard error of fitReferences for the same fit (the one owner of that OLS)', () => {
    const u = mulberry32(4);
    const y = x.map((_, i) => 0.8 * water[i]! + solute[i]! + 0.001 * (u() - 0.5));
    const r = subtractScaled(of(y), of(water));
    const fit = fitReferences(of(y), [of(water)], [{ min: 1900, max: 2300 }]);
    expect(r.standardError).toBe(fit.standardErrors[0]);
    expect(r.standardError).toBeGreaterThan(0);
    // The scale lies within a few standard errors of the truth 0.8.
    expect(Math.abs(r.scale - 0.8)).toBeLessThan(5 * r.standardError!);
  });

  it('subtracts a given scale with no standard error, only where the reference covers', () => {
    const short: Spectrum = { wavenumber: x.slice(0, 600), absorbance: water.slice(0, 600) };
    const r = subtractScaled(of(water), short, { scale: 0.5 });
    expect(r.standardError).toBeNull();
    expect(r.spectrum.wavenumber.length).toBe(600);
    expect(r.spectrum.absorbance[10]).toBeCloseTo(0.5 * water[10]!, 12);
  });
});

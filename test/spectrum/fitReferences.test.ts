// Several references fitted at once with an offset and a slope, with standard errors.
import { inverse, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../src/demo/seededRandom.js';
import { fitReferences } from '../../src/spectrum/fitReferences.js';
import type { Spectrum } from '../../src/spectrum/types.js';

const x = Float64Array.from({ length: 401 }, (_, i) => 1900 + i);
const band = (centre: number, width: number) => x.map((v) => Math.exp(-0.5 * ((v - centre) / width) ** 2));
// A broad combination-band-like shape and a narrow vapour-like line pattern, invented.
const water = x.map((v) => 0.3 + 0.7 * Math.exp(-0.5 * ((v - 2130) / 120) ** 2));
const vapour = band(1990, 1.5).map((v, i) => v + band(2050, 1.5)[i]! + band(2240, 1.5)[i]!);
const spectrumOf = (y: Float64Array): Spectrum => ({ wavenumber: x, absorbance: y });
const whole = [{ min: 1900, max: 2300 }];

describe('fitReferences', () => {
  it('recovers scales under an offset and a slope exactly without noise (by construction)', () => {
    const y = x.map((v, i) => 3 * water[i]! + 0.2 * vapour[i]! + 0.05 + 2e-4 * (v - 2000));
    const fit = fitReferences(spectrumOf(y), [spectrumOf(water), spectrumOf(vapour)], whole);
    expect(fit.scales[0]).toBeCloseTo(3, 9);
    expect(fit.scales[1]).toBeCloseTo(0.2, 9);
    expect(fit.slope).toBeCloseTo(2e-4, 9);
    const rest = fit.spectrum.absorbance;
    expect(rest[0]).toBeCloseTo(0.05 + 2e-4 * (1900 - 2000), 9);
  });

  it('reports the OLS standard error √(σ̂²(XᵀX)⁻¹) as a general-purpose matrix library computes it (ml-matrix)', () => {
    const rng = seededRandom(11);
    const y = x.map((v, i) => 3 * water[i]! + 0.2 * vapour[i]! + 0.01 * (v / 1000) + 5e-4 * rng.normal());
    const fit = fitReferences(spectrumOf(y), [spectrumOf(water), spectrumOf(vapour)], whole);
    const centre = x.reduce((s, v) => s + v, 0) / x.length;
    const X = new Matrix(Array.from(x, (v, i) => [water[i]!, vapour[i]!, 1, v - centre]));
    const Y = Matrix.columnVector(Array.from(y));
    const xtxInv = inverse(X.transpose().mmul(X));
    const beta = xtxInv.mmul(X.transpose()).mmul(Y);
    const residual = Y.sub(X.mmul(beta));
    const s2 = residual.transpose().mmul(residual).get(0, 0) / (x.length - 4);
    expect(fit.scales[0]).toBeCloseTo(beta.get(0, 0), 8);
    expect(fit.standardErrors[0]).toBeCloseTo(Math.sqrt(s2 * xtxInv.get(0, 0)), 8);
    expect(fit.standardErrors[1]).toBeCloseTo(Math.sqrt(s2 * xtxInv.get(1, 1)), 8);
  });

  it('its standard error matches the spread of the scale over repeated white-noise draws (Gauss–Markov)', () => {
    const rng = seededRandom(5);
    const scales: number[] = [];
    let reported = 0;
    for (let k = 0; k < 200; k++) {
      const y = x.map((v, i) => 3 * water[i]! + 1e-4 * (v - 2000) + 5e-4 * rng.normal());
      const fit = fitReferences(spectrumOf(y), [spectrumOf(water)], whole);
      scales.push(fit.scales[0]!);
      reported += fit.standardErrors[0]! / 200;
    }
    const mean = scales.reduce((s, v) => s + v, 0) / scales.length;
    const sd = Math.sqrt(scales.reduce((s, v) => s + (v - mean) ** 2, 0) / (scales.length - 1));
    // 200 draws: the sample SD is within ±15 % of the true one with > 95 % probability (χ² with 199 dof).
    expect(Math.abs(mean - 3)).toBeLessThan(4 * sd);
    expect(sd / reported).toBeGreaterThan(0.85);
    expect(sd / reported).toBeLessThan(1.15);
  });

  it('refuses references a line can stand in for', () => {
    const line = spectrumOf(x.map((v) => 1 + 1e-3 * v));
    expect(() => fitReferences(spectrumOf(water), [line], whole)).toThrow(/told apart/);
  });
});

describe('fitReferences minZ', () => {
  it('takes out a reference the sample does not hold and refits the rest as ordinary least squares would', () => {
    const rng = seededRandom(23);
    // Water present at scale 3, no vapour: noise alone gives the vapour scale.
    const y = x.map((v, i) => 3 * water[i]! + 0.01 * (v / 1000) + 5e-3 * rng.normal());
    const refs = [spectrumOf(water), spectrumOf(vapour)];
    const all = fitReferences(spectrumOf(y), refs, whole);
    const z = all.scales[1]! / all.standardErrors[1]!;
    expect(z).toBeLessThan(3); // the premise: no vapour to find at 3σ (one-sided z-test; common practice)
    const tested = fitReferences(spectrumOf(y), refs, whole, { minZ: 3 });
    expect(tested.scales[1]).toBe(0);
    expect(tested.standardErrors[1]).toBeCloseTo(all.standardErrors[1]!, 12);
    // Water alone with offset and slope, as ml-matrix (a general-purpose library) solves it.
    const centre = x.reduce((s, v) => s + v, 0) / x.length;
    const X = new Matrix(Array.from(x, (v, i) => [water[i]!, 1, v - centre]));
    const Y = Matrix.columnVector(Array.from(y));
    const beta = inverse(X.transpose().mmul(X)).mmul(X.transpose()).mmul(Y);
    expect(tested.scales[0]).toBeCloseTo(beta.get(0, 0), 8);
    expect(tested.spectrum.absorbance[0]).toBeCloseTo(y[0]! - beta.get(0, 0) * water[0]!, 8);
  });

  it('keeps every reference that passes, and subtracts nothing when none does', () => {
    const y = x.map((v, i) => 3 * water[i]! + 0.2 * vapour[i]! + 1e-4 * Math.sin(v));
    const refs = [spectrumOf(water), spectrumOf(vapour)];
    const kept = fitReferences(spectrumOf(y), refs, whole, { minZ: 3 });
    expect(kept.scales[0]).toBeCloseTo(3, 3);
    expect(kept.scales[1]).toBeCloseTo(0.2, 3);
    const flat = x.map((v) => 0.1 + 1e-4 * Math.sin(v));
    const none = fitReferences(spectrumOf(flat), [spectrumOf(water)], whole, { minZ: 3 });
    expect(none.scales[0]).toBe(0);
    expect(Array.from(none.spectrum.absorbance)).toEqual(Array.from(flat));
  });
});

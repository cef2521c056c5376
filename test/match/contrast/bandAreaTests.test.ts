// The band-level contrast: window areas, windows chosen blind to the labels, and the raised band of a seeded cohort.
import { describe, expect, it } from 'vitest';
import { COHORT_GRID, syntheticCohort } from '../../../src/demo/syntheticCohort.js';
import { bandAreaTests } from '../../../src/match/contrast/bandAreaTests.js';
import { benjaminiHochberg } from '../../../src/match/contrast/benjaminiHochberg.js';
import { welchTTest } from '../../../src/match/contrast/welchTTest.js';
import { gridAxis } from '../../../src/spectrum/gridAxis.js';

const axis = gridAxis(COHORT_GRID);
const gaussian = (x: number, centre: number, height: number, fwhm: number) =>
  height * Math.exp((-4 * Math.LN2 * (x - centre) ** 2) / fwhm ** 2);

describe('bandAreaTests', () => {
  it('a window area is the band area above a sloped straight baseline', () => {
    // Area of a Gaussian = height × FWHM × √(π / (4 ln 2)) ≈ 1.0645 h·FWHM (common practice).
    const spectrum = (h: number) =>
      Float64Array.from(axis, (x) => 0.2 + 1e-4 * (x - 1300) + gaussian(x, 1400, h, 20));
    const a = [spectrum(1), spectrum(1.1), spectrum(0.9)];
    const b = [spectrum(0.5), spectrum(0.55), spectrum(0.45)];
    const [test] = bandAreaTests({ a, b, axis }, { windows: [{ min: 1340, max: 1460 }] });
    const area = (h: number) => h * 20 * Math.sqrt(Math.PI / (4 * Math.LN2));
    expect(test!.meanA).toBeCloseTo(area(1), 1);
    expect(test!.meanB).toBeCloseTo(area(0.5), 1);
    expect(Math.abs(test!.meanA / area(1) - 1)).toBeLessThan(0.005);
    expect(test!.origin).toBe('given');
    // The test is Welch's on the areas (itself checked against published values in welchTTest.test.ts).
    const welch = welchTTest([area(1), area(1.1), area(0.9)], [area(0.5), area(0.55), area(0.45)]);
    expect(test!.t).toBeCloseTo(welch.t, 1);
    expect(test!.lower).toBeLessThan(test!.difference);
    expect(test!.upper).toBeGreaterThan(test!.difference);
  });

  it('finds the windows on the pooled mean, blind to the labels, and q is Benjamini–Hochberg over the windows', () => {
    const { a, b } = syntheticCohort(7, { n: 12 });
    const va = a.map((s) => s.processed);
    const vb = b.map((s) => s.processed);
    const forward = bandAreaTests({ a: va, b: vb, axis });
    const swapped = bandAreaTests({ a: vb, b: va, axis });
    // One window per invented cohort band (src/demo/syntheticCohort.ts: seven bands, 1740 … 1080 cm⁻¹).
    expect(forward.map((t) => Math.round(t.position))).toEqual([1740, 1652, 1545, 1455, 1395, 1240, 1080]);
    expect(swapped.map((t) => t.position)).toEqual(forward.map((t) => t.position));
    for (const [i, t] of forward.entries()) expect(swapped[i]!.difference).toBeCloseTo(-t.difference, 12);
    expect(Array.from(benjaminiHochberg(forward.map((t) => t.p)))).toEqual(forward.map((t) => t.q));
  });

  it('finds a band raised by 2 SD in group A, and leaves out a window a spectrum does not cover', () => {
    const { a, b } = syntheticCohort(3, { n: 20, raised: 0, raisedBy: 2 });
    const va = a.map((s) => s.processed);
    const vb = b.map((s) => Float64Array.from(s.processed));
    const tests = bandAreaTests({ a: va, b: vb, axis });
    const ester = tests.find((t) => Math.abs(t.position - 1740) <= 4)!;
    expect(ester.q).toBeLessThanOrEqual(0.05);
    expect(ester.difference).toBeGreaterThan(0);
    vb[0]![axis.indexOf(1240)] = Number.NaN;
    expect(bandAreaTests({ a: va, b: vb, axis }).some((t) => Math.abs(t.position - 1240) <= 4)).toBe(false);
  });
});

// Tests of EMSC scatter correction: known offset, multiplicative and Legendre terms recovered exactly.
import { describe, expect, it } from 'vitest';
import { emscCorrect } from '../../src/spectrum/emscCorrect.js';
import type { Spectrum } from '../../src/spectrum/types.js';
import { bandshelfErrorOf } from '../bandshelfErrorOf.js';

const gaussian = (x: number, centre: number, fwhm: number, height: number) =>
  height * Math.exp(-4 * Math.LN2 * ((x - centre) / fwhm) ** 2);
const referenceOf = (x: number) =>
  gaussian(x, 1652, 30, 1) +
  gaussian(x, 1545, 35, 0.6) +
  gaussian(x, 1240, 40, 0.3) +
  gaussian(x, 1080, 30, 0.25);

// Legendre polynomials written out (common practice; any table of orthogonal polynomials), independent of the
// recurrence in the code under test.
const legendre = [
  (_t: number) => 1,
  (t: number) => t,
  (t: number) => (3 * t * t - 1) / 2,
  (t: number) => (5 * t ** 3 - 3 * t) / 2,
  (t: number) => (35 * t ** 4 - 30 * t * t + 3) / 8,
];

function sampled(f: (x: number) => number, from = 1000, to = 1800, step = 2): Spectrum {
  const n = Math.round((to - from) / step) + 1;
  const wavenumber = Float64Array.from({ length: n }, (_, i) => from + i * step);
  return { wavenumber, absorbance: wavenumber.map(f) };
}

const scaled = (x: number, from = 1000, to = 1800) => (2 * (x - from)) / (to - from) - 1;

describe('emscCorrect', () => {
  it('recovers known offset, multiplicative and polynomial terms exactly on noise-free data', () => {
    const a = 0.05;
    const b = 1.7;
    const d = [0.03, -0.02];
    const sample = sampled((x) => {
      const t = scaled(x);
      return a + b * referenceOf(x) + d[0]! * legendre[1]!(t) + d[1]! * legendre[2]!(t);
    });
    const reference = sampled(referenceOf);
    const result = emscCorrect(sample, reference, { degree: 2 });
    expect(result.coefficients).toHaveLength(4);
    for (const [got, want] of result.coefficients.map((c, i) => [c, [a, b, ...d][i]!])) {
      expect(got).toBeCloseTo(want!, 11);
    }
    for (let i = 0; i < sample.wavenumber.length; i++) {
      expect(result.spectrum.absorbance[i]).toBeCloseTo(reference.absorbance[i]!, 11);
    }
  });

  it('handles degree 4 and degree 0 (plain multiplicative scatter correction)', () => {
    const d = [0.01, -0.02, 0.015, 0.005];
    const sample = sampled((x) => {
      const t = scaled(x);
      return -0.1 + 0.6 * referenceOf(x) + d.reduce((s, dk, k) => s + dk * legendre[k + 1]!(t), 0);
    });
    const four = emscCorrect(sample, sampled(referenceOf), { degree: 4 });
    expect(four.coefficients.map((c) => Number(c.toFixed(10)))).toEqual([-0.1, 0.6, ...d]);
    const msc = emscCorrect(
      sampled((x) => 0.2 + 2.5 * referenceOf(x)),
      sampled(referenceOf),
      { degree: 0 },
    );
    expect(msc.coefficients.map((c) => Number(c.toFixed(10)))).toEqual([0.2, 2.5]);
  });

  it('scales x̃ over the points the reference covers and drops the others', () => {
    const reference = sampled(referenceOf, 1100, 1700);
    const sample = sampled((x) => 0.02 + 1.2 * referenceOf(x) + 0.04 * scaled(x, 1100, 1700));
    const result = emscCorrect(sample, reference, { degree: 1 });
    expect(result.spectrum.wavenumber[0]).toBe(1100);
    expect(result.spectrum.wavenumber.at(-1)).toBe(1700);
    expect(result.coefficients.map((c) => Number(c.toFixed(10)))).toEqual([0.02, 1.2, 0.04]);
  });

  it('refuses a vanishing or negative multiplicative term, a degenerate model and too few points', () => {
    const reference = sampled(referenceOf);
    const tiny = bandshelfErrorOf(() =>
      emscCorrect(
        sampled((x) => 0.3 + 1e-5 * referenceOf(x)),
        reference,
        { file: 'u.csv' },
      ),
    );
    expect([tiny.code, tiny.field, tiny.file]).toEqual(['BAD_RECIPE', 'emsc', 'u.csv']);
    expect(tiny.message).toContain('multiplicative term');
    expect(
      bandshelfErrorOf(() =>
        emscCorrect(
          sampled((x) => 1 - referenceOf(x)),
          reference,
        ),
      ).message,
    ).toContain('b = -1.00');
    // A straight-line reference is itself one of the polynomial terms.
    const line = sampled((x) => 0.001 * x);
    expect(bandshelfErrorOf(() => emscCorrect(sampled(referenceOf), line, { degree: 1 })).message).toContain(
      'degenerate',
    );
    const short = sampled(referenceOf, 1000, 1006);
    expect(bandshelfErrorOf(() => emscCorrect(short, short, { degree: 2 })).message).toContain(
      'needs more than 4 points',
    );
    expect(bandshelfErrorOf(() => emscCorrect(sampled(referenceOf), reference, { degree: 1.5 })).field).toBe(
      'emsc.degree',
    );
  });

  it('does not modify its inputs', () => {
    const sample = sampled((x) => 0.1 + referenceOf(x));
    const reference = sampled(referenceOf);
    const before = [sample.absorbance.slice(), reference.absorbance.slice()];
    emscCorrect(sample, reference);
    expect([sample.absorbance, reference.absorbance]).toEqual(before);
  });
});

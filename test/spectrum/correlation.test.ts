// Tests of Pearson correlation over the points both vectors cover.
import { sampleCorrelation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { correlation } from '../../src/spectrum/correlation.js';
import { mulberry32 } from '../mulberry32.js';

describe('correlation', () => {
  it('equals simple-statistics sampleCorrelation on random data (a general-purpose reference library)', () => {
    const rand = mulberry32(2024);
    for (let trial = 0; trial < 20; trial++) {
      const n = 50 + Math.floor(rand() * 500);
      const a = Float64Array.from({ length: n }, () => rand());
      const b = a.map((v) => 0.3 * v + rand());
      expect(correlation(a, b)).toBeCloseTo(sampleCorrelation(Array.from(a), Array.from(b)), 10);
    }
  });

  it('leaves out every index where either side is NaN', () => {
    const rand = mulberry32(5);
    const n = 300;
    const a = Float64Array.from({ length: n }, () => rand());
    const b = a.map((v) => v + rand());
    const keptA: number[] = [];
    const keptB: number[] = [];
    for (let i = 0; i < n; i++) {
      if (i % 7 === 0) a[i] = Number.NaN;
      else if (i % 11 === 0) b[i] = Number.NaN;
      else {
        keptA.push(a[i]!);
        keptB.push(b[i]!);
      }
    }
    expect(correlation(a, b)).toBeCloseTo(sampleCorrelation(keptA, keptB), 10);
  });

  it('gives ±1 for exact linear relations, also on a large offset', () => {
    const a = Float64Array.from([1, 2, 3, 4]);
    expect(correlation(a, Float64Array.from([2, 4, 6, 8]))).toBe(1);
    expect(correlation(a, Float64Array.from([4, 3, 2, 1]))).toBe(-1);
    const offset = a.map((v) => v + 1e8);
    expect(correlation(offset, Float64Array.from([2, 4, 6, 8]))).toBeCloseTo(1, 12);
  });

  it('is NaN for a constant vector or too small an overlap, and refuses different lengths', () => {
    expect(correlation(Float64Array.from([1, 1, 1]), Float64Array.from([1, 2, 3]))).toBeNaN();
    expect(
      correlation(Float64Array.from([1, 2, Number.NaN, Number.NaN]), Float64Array.from([1, 2, 3, 4])),
    ).toBeNaN();
    expect(
      correlation(Float64Array.from([1, 2, Number.NaN]), Float64Array.from([2, 1, 3]), { minOverlap: 2 }),
    ).toBe(-1);
    expect(() => correlation(Float64Array.from([1, 2]), Float64Array.from([1, 2, 3]))).toThrow(
      BandshelfError,
    );
  });
});

// correlationMatrix against a general-purpose statistics library (simple-statistics).
import fc from 'fast-check';
import { sampleCorrelation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { correlationMatrix } from '../../src/spectrum/correlationMatrix.js';

describe('correlationMatrix', () => {
  it('gives each pair’s Pearson r over the points both cover, symmetric', () => {
    const N = Number.NaN;
    const a = Float64Array.of(1, 2, 3, 4, 5, 6);
    const b = Float64Array.of(2, 1, 4, 3, 6, N);
    const c = Float64Array.of(6, 5, 4, 3, 2, 1);
    const m = correlationMatrix([a, b, c]);
    // simple-statistics' sampleCorrelation on the shared points (the first five for pairs with b).
    expect(m[0]![1]).toBeCloseTo(sampleCorrelation([1, 2, 3, 4, 5], [2, 1, 4, 3, 6]), 12);
    expect(m[1]![2]).toBeCloseTo(sampleCorrelation([2, 1, 4, 3, 6], [6, 5, 4, 3, 2]), 12);
    expect(m[0]![2]).toBeCloseTo(-1, 12);
    expect(m[2]![0]).toBe(m[0]![2]);
    expect(m[1]![1]).toBeCloseTo(1, 12);
  });
});

describe('correlationMatrix on generated vectors (fast-check, seeded)', () => {
  // What `bandshelf compare` feeds it: grid vectors of several spectra, each with its own coverage (NaN).
  const SEED = 20_261_207;
  const RUNS = 1000;
  const vectorArb = fc
    .tuple(
      fc.array(
        fc.integer({ min: -3000, max: 3000 }).map((v) => v / 1000),
        { minLength: 40, maxLength: 40 },
      ),
      fc.integer({ min: 0, max: 39 }),
      fc.integer({ min: 0, max: 39 }),
    )
    // Covered over one run of the grid, as a spectrum is.
    .map(([v, from, to]) =>
      Float64Array.from(v, (x, j) => (j >= Math.min(from, to) && j <= Math.max(from, to) ? x : Number.NaN)),
    );

  it(`is symmetric, within [−1, 1], and agrees with simple-statistics on the shared points (${RUNS} cases, seed ${SEED})`, () => {
    fc.assert(
      fc.property(fc.array(vectorArb, { minLength: 1, maxLength: 5 }), (vectors) => {
        const m = correlationMatrix(vectors);
        for (let i = 0; i < vectors.length; i++) {
          for (let j = 0; j < vectors.length; j++) {
            expect(Object.is(m[i]![j], m[j]![i])).toBe(true);
            const r = m[i]![j]!;
            if (Number.isNaN(r)) continue;
            expect(Math.abs(r)).toBeLessThanOrEqual(1 + 1e-12);
            const a: number[] = [];
            const b: number[] = [];
            vectors[i]!.forEach((x, k) => {
              const y = vectors[j]![k]!;
              if (!Number.isNaN(x) && !Number.isNaN(y)) {
                a.push(x);
                b.push(y);
              }
            });
            expect(r).toBeCloseTo(sampleCorrelation(a, b), 9);
          }
        }
      }),
      { seed: SEED, numRuns: RUNS },
    );
  });
});

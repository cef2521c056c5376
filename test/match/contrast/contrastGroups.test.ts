// contrastGroups on seeded synthetic cohorts: one raised band is found and assigned; null cohorts stay quiet;
// generated groups give valid reports with the symmetries of Welch's t, and bad groups a stable code.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { COHORT_GRID, syntheticCohort } from '../../../src/demo/syntheticCohort.js';
import { BandshelfError } from '../../../src/error.js';
import { contrastGroups } from '../../../src/match/contrast/contrastGroups.js';
import { CONTRAST_CAUTION, contrastReportSchema } from '../../../src/schema/contrastReport.js';

const run = (seed: number, options: Parameters<typeof syntheticCohort>[1] = {}, q = 0.05) => {
  const { a, b } = syntheticCohort(seed, options);
  return contrastGroups(
    { a: { label: 'cases', spectra: a }, b: { label: 'controls', spectra: b }, grid: COHORT_GRID },
    { q, created: '2026-01-01T00:00:00.000Z' },
  );
};

describe('contrastGroups', () => {
  it('finds exactly the band raised in group A, higher, at its position, assigned to the ester C=O row', async () => {
    // 20 + 20 spectra, 10 % biological variation per band, the 1740 cm⁻¹ band raised by 2 SD in group A.
    const report = await run(7, { raised: 0 });
    expect(contrastReportSchema.parse(report)).toEqual(report);
    expect(report.bands).toHaveLength(1);
    const band = report.bands[0]!;
    expect(band.sign).toBe('higher');
    expect(Math.abs(band.position - 1740)).toBeLessThanOrEqual(4);
    expect(band.min).toBeLessThan(1740);
    expect(band.max).toBeGreaterThan(1740);
    // Ester C=O stretch 1730–1750 cm⁻¹: Movasaghi et al., Appl. Spectrosc. Rev. 43:134 (2008), a row of the shipped table.
    expect(band.assignments[0]!.label).toBe('ester C=O stretch');
    // The true standardised difference is 2 SD of the band's variation (less, diluted by noise and baseline):
    // Hedges' g near it, the interval excludes 0, and the raised band's height difference is 0.2 × 0.15 = 0.03.
    expect(band.g).toBeGreaterThan(1);
    expect(band.g).toBeLessThan(3.5);
    expect(band.lower).toBeGreaterThan(0);
    expect(band.difference).toBeGreaterThan(0.015);
    expect(band.difference).toBeLessThan(0.045);
    expect(band.smallestQ).toBeLessThanOrEqual(0.05);
    expect(report.groups.a).toMatchObject({ label: 'cases', read: 20, n: 20 });
    expect(report.search).toEqual({ higher: null, lower: null });
    expect(report.caution).toBe(CONTRAST_CAUTION);
    expect(report.method.assumptions.join(' ')).toMatch(/independent.*variances.*normal/);
    // The band-level test finds the same band: higher in A, its window assigned first to the ester C=O row.
    const significant = report.bandTests.filter((t) => t.significant);
    expect(significant.map((t) => Math.round(t.position))).toEqual([1740]);
    expect(significant[0]!.difference).toBeGreaterThan(0);
    expect(significant[0]!.assignments[0]?.label).toBe('ester C=O stretch');
    expect(report.method.bandTest).toMatch(/Benjamini–Hochberg over the windows/);
  });

  it('finds no difference band in a null cohort (fixed seed) at q = 0.05', async () => {
    const report = await run(11);
    expect(report.bands).toEqual([]);
    expect(report.discoveries).toBe(0);
    expect(report.tested).toBe(451);
    expect(report.bandTests.filter((t) => t.significant)).toEqual([]);
  });

  it('has any discovery in about the nominal share of null cohorts', async () => {
    // Under the global null Benjamini–Hochberg controls the chance of any discovery at q (Benjamini & Hochberg
    // 1995, Theorem 1 with m0 = m); 50 seeds at q = 0.05 expect 2.5; P(Binomial(50, 0.05) ≥ 7) ≈ 0.01.
    let any = 0;
    for (let seed = 100; seed < 150; seed++) if ((await run(seed, { n: 10 })).bands.length > 0) any++;
    expect(any).toBeLessThan(7);
  });

  it('tests only inside the given ranges: fewer tests in the FDR, the rest untested', async () => {
    const { a, b } = syntheticCohort(7, { raised: 0 });
    const report = await contrastGroups(
      { a: { label: 'A', spectra: a }, b: { label: 'B', spectra: b }, grid: COHORT_GRID },
      { ranges: [{ min: 1800, max: 1700 }] },
    );
    // 1700–1800 cm⁻¹ at 2 cm⁻¹ steps: 51 grid points (both ends included).
    expect(report.tested).toBe(51);
    expect(report.settings.ranges).toEqual([{ min: 1700, max: 1800 }]);
    expect(report.pointwise.p[0]).toBeNull(); // 900 cm⁻¹, outside
    // Means and the difference are still given outside the ranges; only the tests are not.
    expect(report.groups.a.mean[0]).not.toBeNull();
    expect(report.pointwise.difference[0]).not.toBeNull();
    expect(report.bands.map((band) => band.sign)).toEqual(['higher']);
    expect(report.method.fdr).toMatch(/over the 51 tested grid points \(inside 1800–1700 cm⁻¹ only\)/);
  });

  it('lists an outlier and leaves it out only with dropOutliers', async () => {
    const { a, b } = syntheticCohort(3, { n: 8 });
    const odd = Float64Array.from(a[2]!.processed, (v) => v * 1.8);
    const spectraA = a.map((s, i) => (i === 2 ? { ...s, processed: odd } : s));
    const input = { a: { label: 'A', spectra: spectraA }, b: { label: 'B', spectra: b }, grid: COHORT_GRID };
    const kept = await contrastGroups(input);
    // The rule flags by the group's own spread, so a clean group may have a flagged spectrum too; group A has one.
    expect(kept.spectra.filter((s) => s.group === 'a' && s.outlier).map((s) => s.file)).toEqual(['a-03.csv']);
    expect(kept.spectra.find((s) => s.file === 'a-03.csv')!.robustZ).toBeGreaterThan(5);
    expect(kept.groups.a.n).toBe(8);
    const dropped = await contrastGroups(input, { dropOutliers: true });
    expect(dropped.groups.a).toMatchObject({ read: 8, n: 7, outliers: 1 });
    expect(dropped.spectra.find((s) => s.file === 'a-03.csv')!.dropped).toBe(true);
  });

  it('refuses a group with fewer than 3 spectra', async () => {
    const { a, b } = syntheticCohort(5, { n: 2 });
    await expect(
      contrastGroups({ a: { label: 'A', spectra: a }, b: { label: 'B', spectra: b }, grid: COHORT_GRID }),
    ).rejects.toMatchObject({
      code: 'BAD_OPTION',
      message: expect.stringMatching(/group 'A' has 2 spectra.*at least 3/),
    });
  });
});

/** The BandshelfError an async call rejects with; any other outcome fails the test. */
async function bandshelfErrorOfAsync(run: () => Promise<unknown>): Promise<BandshelfError> {
  try {
    await run();
  } catch (error) {
    if (error instanceof BandshelfError) return error;
    throw error;
  }
  throw new Error('expected a BandshelfError');
}

describe('contrastGroups on generated cohorts (fast-check, seeded)', () => {
  // What `bandshelf contrast` feeds it: two groups of processed grid vectors, any values, any coverage.
  const GRID = { start: 1100, stop: 1000, step: 2 };
  const COLS = 51;
  const SEED = 20_261_205;
  const RUNS = 300;
  const vectorArb = fc
    .tuple(
      // Absorbances in steps of 0.001 (what a processed spectrum resolves), so an offset is exact enough to compare.
      fc.array(
        fc.integer({ min: -2000, max: 2000 }).map((v) => v / 1000),
        { minLength: COLS, maxLength: COLS },
      ),
      fc.array(fc.boolean(), { minLength: COLS, maxLength: COLS }),
      fc.boolean(),
    )
    // A vector is fully covered or, in the other half of the cases, has random points not covered (NaN).
    .map(([values, holes, gappy]) => values.map((v, j) => (gappy && holes[j] ? Number.NaN : v)));
  const groupArb = fc.array(vectorArb, { minLength: 3, maxLength: 7 });
  const spectra = (vectors: number[][], tag: string) =>
    vectors.map((processed, i) => ({ file: `${tag}${i}.csv`, hash: 'a'.repeat(64), processed }));
  const contrast = (a: number[][], b: number[][]) =>
    contrastGroups(
      {
        a: { label: 'A', spectra: spectra(a, 'a') },
        b: { label: 'B', spectra: spectra(b, 'b') },
        grid: GRID,
      },
      { created: '2026-01-01T00:00:00.000Z' },
    );

  it(`gives a valid report with p ≤ q ≤ 1, antisymmetric in the groups, blind to a common offset (${RUNS} cases, seed ${SEED})`, async () => {
    await fc.assert(
      fc.asyncProperty(
        groupArb,
        groupArb,
        fc.double({ min: -5, max: 5, noNaN: true }),
        async (a, b, offset) => {
          const report = await contrast(a, b);
          expect(contrastReportSchema.parse(report)).toEqual(report);
          const { p, q, t } = report.pointwise;
          for (let j = 0; j < COLS; j++) {
            if (p[j] === null) continue;
            // Benjamini–Hochberg q-values are never below their p-values (q_i = min over j ≥ i of m·p_(j)/j).
            expect(p[j]!).toBeGreaterThanOrEqual(0);
            expect(q[j]!).toBeGreaterThanOrEqual(p[j]! * (1 - 1e-12));
            expect(q[j]!).toBeLessThanOrEqual(1);
          }
          // Welch's t changes sign when the groups change places; p and the number of discoveries do not.
          const swapped = await contrast(b, a);
          expect(swapped.tested).toBe(report.tested);
          expect(swapped.discoveries).toBe(report.discoveries);
          for (let j = 0; j < COLS; j++) {
            if (t[j] === null) expect(swapped.pointwise.t[j]).toBeNull();
            else expect(swapped.pointwise.t[j]!).toBeCloseTo(-t[j]!, 9);
          }
          // The same offset added to every spectrum leaves means' difference and SDs, hence t, unchanged.
          const shift = (g: number[][]) => g.map((v) => v.map((x) => x + offset));
          const shifted = await contrast(shift(a), shift(b));
          for (let j = 0; j < COLS; j++) {
            if (t[j] === null || !Number.isFinite(t[j]!)) continue;
            expect(shifted.pointwise.t[j]!).toBeCloseTo(t[j]!, 5);
          }
        },
      ),
      { seed: SEED, numRuns: RUNS },
    );
  }, 600_000);

  it(`refuses a group of fewer than three spectra or a vector off the grid with a stable code (${RUNS} cases, seed ${SEED})`, async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(vectorArb, { minLength: 0, maxLength: 2 }),
        groupArb,
        fc.integer({ min: 0, max: COLS + 5 }),
        async (small, ok, cut) => {
          const few = await bandshelfErrorOfAsync(() => contrast(small, ok));
          expect(few.code).toBe('BAD_OPTION');
          expect(few.field).toBe('groupA');
          if (cut === COLS) return;
          // A vector cut short or running past the grid.
          const wrong =
            cut < COLS ? ok[0]!.slice(0, cut) : [...ok[0]!, ...new Array<number>(cut - COLS).fill(0)];
          const off = await bandshelfErrorOfAsync(() => contrast(ok, [...ok.slice(1), wrong]));
          expect(off.code).toBe('BAD_OPTION');
          expect(off.field).toBe('processed');
        },
      ),
      { seed: SEED, numRuns: RUNS },
    );
  }, 600_000);
});

// contrastGroups on seeded synthetic cohorts: one raised band is found and assigned; null cohorts stay quiet.
import { describe, expect, it } from 'vitest';
import { COHORT_GRID, syntheticCohort } from '../../../src/demo/syntheticCohort.js';
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

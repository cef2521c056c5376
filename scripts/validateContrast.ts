// npm run validate:contrast -- [--runs N] [--seed S] [--n PER_GROUP]: contrast's error rates on seeded synthetic cohorts.
//
// Each run draws a synthetic cohort of serum-film-like grid spectra (invented bands, labelled synthetic: 10 % biological
// variation per band, offset, slope, noise; src/demo/syntheticCohort.ts) and contrasts the two groups at q = 0.05.
// Null runs have no difference: the share with any discovery estimates the chance of a false alarm (Benjamini–Hochberg
// bounds it by q under the global null). Raised runs lift the 1740 cm⁻¹ band of group A by 1 and by 2 of its SDs:
// recall is the share of runs whose difference bands include one within 4 cm⁻¹ of 1740, higher in A, assigned first to
// the ester C=O row; bands lying wholly outside 1710–1770 cm⁻¹ (where the raised Gaussian, FWHM 18 cm⁻¹, is above
// ~0.1 % of its height) are spurious, and the false-discovery proportion is the share of passing grid points outside
// that span, averaged over runs (0 for a run without discoveries): the quantity Benjamini–Hochberg bounds by q.
// The raised runs are also contrasted testing only 1800–1700 cm⁻¹, a region of interest fixed in advance.
// The band-level test (integrated area per window, Welch, Benjamini–Hochberg over the windows) is measured on the
// same runs: null runs with any significant window; recall = a significant window centred within 4 cm⁻¹ of 1740,
// higher in A, assigned first to the ester C=O row; spurious = significant windows not overlapping 1710–1770.
// Printed as one JSON document.
import { COHORT_GRID, syntheticCohort } from '../src/demo/syntheticCohort.js';
import { contrastGroups } from '../src/match/contrast/contrastGroups.js';
import type { WavenumberWindow } from '../src/schema/recipe.js';

function argument(name: string, fallback: number): number {
  const at = process.argv.indexOf(`--${name}`);
  return at >= 0 ? Number(process.argv[at + 1]) : fallback;
}

async function bandsOf(
  seed: number,
  n: number,
  raised: number | null,
  raisedBy: number,
  ranges: readonly WavenumberWindow[] = [],
) {
  const { a, b } = syntheticCohort(seed, { n, raised, raisedBy });
  const report = await contrastGroups(
    { a: { label: 'A', spectra: a }, b: { label: 'B', spectra: b }, grid: COHORT_GRID },
    { q: 0.05, ranges },
  );
  return report;
}

const TRUE_SPAN = { min: 1710, max: 1770 };

async function main(): Promise<void> {
  const runs = argument('runs', 200);
  const seed = argument('seed', 1);
  const n = argument('n', 20);
  let anyDiscovery = 0;
  let anyBandLevel = 0;
  for (let r = 0; r < runs; r++) {
    const report = await bandsOf(seed + r, n, null, 0);
    if (report.bands.length > 0) anyDiscovery++;
    if (report.bandTests.some((t) => t.significant)) anyBandLevel++;
  }
  const bandLevel: Record<string, { recall: number; spuriousWindowsPerRun: number }> = {};
  const raised: Record<
    string,
    {
      recall: number;
      spuriousBandsPerRun: number;
      runsWithSpurious: number;
      falseDiscoveryProportion: number;
    }
  > = {};
  const plans = [
    { label: 'whole grid', ranges: [] },
    { label: 'only 1800–1700', ranges: [{ min: 1700, max: 1800 }] },
  ];
  for (const plan of plans)
    for (const by of [1, 2]) {
      let found = 0;
      let spurious = 0;
      let runsWithSpurious = 0;
      let fdp = 0;
      let bandFound = 0;
      let bandSpurious = 0;
      for (let r = 0; r < runs; r++) {
        const report = await bandsOf(seed + runs + r, n, 0, by, plan.ranges);
        const bands = report.bands;
        const significant = report.bandTests.filter((t) => t.significant);
        if (
          significant.some(
            (t) =>
              Math.abs(t.position - 1740) <= 4 &&
              t.difference > 0 &&
              t.assignments[0]?.label === 'ester C=O stretch',
          )
        )
          bandFound++;
        bandSpurious += significant.filter((t) => t.max < TRUE_SPAN.min || t.min > TRUE_SPAN.max).length;
        const hit = bands.find(
          (band) =>
            Math.abs(band.position - 1740) <= 4 &&
            band.sign === 'higher' &&
            band.assignments[0]?.label === 'ester C=O stretch',
        );
        if (hit) found++;
        const outside = bands.filter((band) => band.max < TRUE_SPAN.min || band.min > TRUE_SPAN.max).length;
        spurious += outside;
        if (outside > 0) runsWithSpurious++;
        let passing = 0;
        let falsePassing = 0;
        for (const band of bands) {
          for (let x = band.min; x <= band.max + 1e-9; x += COHORT_GRID.step) {
            passing++;
            if (x < TRUE_SPAN.min || x > TRUE_SPAN.max) falsePassing++;
          }
        }
        fdp += passing === 0 ? 0 : falsePassing / passing;
      }
      bandLevel[`${by} SD, ${plan.label}`] = {
        recall: bandFound / runs,
        spuriousWindowsPerRun: bandSpurious / runs,
      };
      raised[`${by} SD, ${plan.label}`] = {
        recall: found / runs,
        spuriousBandsPerRun: spurious / runs,
        runsWithSpurious: runsWithSpurious / runs,
        falseDiscoveryProportion: fdp / runs,
      };
    }
  process.stdout.write(
    `${JSON.stringify(
      {
        runs,
        perGroup: n,
        q: 0.05,
        nullRunsWithAnyDiscovery: anyDiscovery / runs,
        raised1740: raised,
        bandLevel: { nullRunsWithAnySignificantWindow: anyBandLevel / runs, raised1740: bandLevel },
        note: 'synthetic cohorts on the grid (no file reading); research use only: a difference is an association, not a diagnosis',
      },
      null,
      2,
    )}\n`,
  );
}

await main();

// Mixture fit on a seeded synthetic 4-component mixture with noise and a sloped baseline.
import { fcnnlsVector } from 'ml-fcnnls';
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../src/demo/seededRandom.js';
import { BandshelfError } from '../../src/error.js';
import { fitMixture } from '../../src/match/fitMixture.js';
import { lineShapeTerms } from '../../src/match/mixture/lineShapeTerms.js';
import type { MixtureCandidate } from '../../src/match/types.js';
import type { Grid } from '../../src/schema/recipe.js';
import { correlation } from '../../src/spectrum/correlation.js';
import { gridAxis } from '../../src/spectrum/gridAxis.js';

const grid: Grid = { start: 4000, stop: 600, step: 2 };
const axis = gridAxis(grid);

/** Unit-L2 vector of Gaussian bands [position, height, fwhm], like a vector-normalised processed row. */
function bandsVector(bands: [number, number, number][]): Float64Array {
  const v = new Float64Array(axis.length);
  for (const [p, h, w] of bands) {
    const s = w / 2.3548;
    for (let i = 0; i < axis.length; i++) v[i] = v[i]! + h * Math.exp(-0.5 * ((axis[i]! - p) / s) ** 2);
  }
  const norm = Math.hypot(...v);
  return v.map((x) => x / norm);
}

const compounds: Record<string, [number, number, number][]> = {
  protein: [
    [3300, 0.3, 150],
    [2960, 0.15, 20],
    [1652, 1, 30],
    [1545, 0.6, 30],
    [1240, 0.2, 40],
  ],
  lipid: [
    [2922, 1, 16],
    [2852, 0.7, 14],
    [1740, 0.6, 18],
    [1467, 0.2, 12],
    [1170, 0.2, 20],
  ],
  sugar: [
    [3350, 0.4, 200],
    [1150, 0.6, 25],
    [1080, 1, 30],
    [1035, 0.9, 25],
  ],
  spike: [
    [1402, 1, 12],
    [1577, 0.5, 14],
    [850, 0.4, 10],
  ],
};
const random = seededRandom(4242);
for (let d = 0; d < 8; d++) {
  compounds[`decoy-${d}`] = Array.from({ length: 5 }, () => [
    900 + random.uniform() * 2300,
    0.2 + random.uniform(),
    10 + random.uniform() * 40,
  ]);
}
const vectors = new Map(Object.entries(compounds).map(([id, bands]) => [id, bandsVector(bands)]));
const area = (v: Float64Array): number => v.reduce((s, x) => s + Math.abs(x), 0);

// Weights chosen so the spike holds 5 % of the summed component area (share of the fitted signal).
const shares: Record<string, number> = { protein: 0.5, lipid: 0.28, sugar: 0.17, spike: 0.05 };
const weights = Object.fromEntries(Object.entries(shares).map(([id, s]) => [id, s / area(vectors.get(id)!)]));
const noiseSigma = 2e-5;

function makeMixture(seed: number, sigma: number): Float64Array {
  const out = new Float64Array(axis.length);
  const noise = seededRandom(seed);
  for (let i = 0; i < axis.length; i++) {
    let y = 0;
    for (const [id, w] of Object.entries(weights)) y += w * vectors.get(id)![i]!;
    // Sloped baseline: rising towards low wavenumber.
    y += 0.002 + 0.004 * ((4000 - axis[i]!) / 3400);
    out[i] = y + sigma * noise.normal();
  }
  return out;
}
const mixture = makeMixture(99, noiseSigma);

/** The pool the CLI would offer: candidates ranked by correlation with the unknown. */
function rankedPool(exclude: string[] = [], unknown = mixture): MixtureCandidate[] {
  return [...vectors.entries()]
    .filter(([id]) => !exclude.includes(id))
    .map(([id, vector]) => ({ id, revision: 1, vector, score: correlation(unknown, vector) }))
    .sort((a, b) => b.score - a.score)
    .map(({ id, revision, vector }) => ({ id, revision, vector }));
}

describe('fitMixture', () => {
  it('recovers the weights of a 4-component mixture and finds the 5 % spiked compound', () => {
    const result = fitMixture(mixture, rankedPool(), { grid, baselineDegree: 1 });
    const byId = new Map(result.components.map((c) => [c.id, c]));
    expect([...byId.keys()].sort()).toEqual(['lipid', 'protein', 'spike', 'sugar']);
    for (const [id, w] of Object.entries(weights)) {
      expect(Math.abs(byId.get(id)!.weight - w) / w).toBeLessThan(0.01);
      expect(byId.get(id)!.share).toBeCloseTo(shares[id]!, 2);
    }
    // The sloped baseline is recovered as a line: value at 4000 and at 600 cm⁻¹.
    const base = result.baseline!;
    const at = (x: number): number => {
      const u = (x - base.centre) / base.halfWidth;
      return base.coefficients.reduce((s, c, j) => s + c * u ** j, 0);
    };
    expect(at(4000)).toBeCloseTo(0.002, 4);
    expect(at(600)).toBeCloseTo(0.006, 4);
    expect(result.r2).toBeGreaterThan(0.999);
    // The noise is now estimated from the residual's own first differences (no fixed window), close to the added σ.
    expect(result.noiseSource).toBe('residual-differences');
    expect(result.noise / noiseSigma).toBeGreaterThan(0.7);
    expect(result.noise / noiseSigma).toBeLessThan(1.3);
    expect(result.residualBands).toEqual([]);
    expect(result.stopReason).toMatch(/is not significant|explains only|no further candidate/);
  });

  it('gives each share a 95 % interval that covers the true share in about 95 % of noise realisations (seeded)', () => {
    // The shares above are the truth (component area over summed area); 20 noise realisations at 10× the noise
    // above. The interval propagates the weights' Newey–West covariance (delta method), so its coverage should sit
    // near the nominal 95 % (Newey & West 1987; delta method, common practice); 76 of 80 here. An interval too wide to miss fails too.
    let inside = 0;
    let total = 0;
    for (let seed = 1; seed <= 20; seed++) {
      const result = fitMixture(makeMixture(1000 + seed, 10 * noiseSigma), rankedPool(), {
        grid,
        baselineDegree: 1,
      });
      for (const c of result.components) {
        expect(c.shareInterval95[0]).toBeLessThanOrEqual(c.share);
        expect(c.shareInterval95[1]).toBeGreaterThanOrEqual(c.share);
        const truth = shares[c.id];
        if (truth === undefined) continue;
        total++;
        if (truth >= c.shareInterval95[0] && truth <= c.shareInterval95[1]) inside++;
      }
    }
    expect(total).toBeGreaterThanOrEqual(75);
    expect(inside / total).toBeGreaterThan(0.85);
    expect(inside / total).toBeLessThan(1);
    // One component is all of the fitted signal: share 1, interval [1, 1].
    const single = fitMixture(vectors.get('lipid')!, rankedPool(), { grid, baselineDegree: 1 });
    expect(single.components.map((c) => [c.id, c.share, c.shareInterval95])).toEqual([['lipid', 1, [1, 1]]]);
  });

  it('puts the left-out compound’s main band among the unexplained bands', () => {
    const result = fitMixture(mixture, rankedPool(['spike']), { grid, baselineDegree: 1 });
    expect(result.components.map((c) => c.id)).not.toContain('spike');
    const near1402 = result.residualBands.filter((b) => Math.abs(b.position - 1402) <= 4);
    expect(near1402).toHaveLength(1);
    expect(near1402[0]!.height).toBeGreaterThan(3 * result.noise);
  });

  it('reports no unexplained bands from noise alone and still finds the spike (main band ≈ 14× the noise)', () => {
    for (const seed of [1, 2, 3, 4, 5, 6]) {
      const noisy = makeMixture(seed, 3e-4);
      const full = fitMixture(noisy, rankedPool([], noisy), { grid });
      expect(full.components.map((c) => c.id)).toContain('spike');
      expect(full.residualBands).toEqual([]);
      const without = fitMixture(noisy, rankedPool(['spike'], noisy), { grid });
      expect(without.residualBands.some((b) => Math.abs(b.position - 1402) <= 4)).toBe(true);
    }
  });

  it('reaches the same minimum as ml-fcnnls with the baseline and line-shape terms split into ± columns', () => {
    // ml-fcnnls is a general-purpose NNLS implementation; a free-sign term t equals t⁺ − t⁻ with t± ≥ 0.
    const pool = rankedPool();
    const result = fitMixture(mixture, pool, { grid, baselineDegree: 1, maxComponents: 4 });
    const chosen = result.components.map((c) => vectors.get(c.id)!);
    const shapes = chosen.flatMap((v) => lineShapeTerms(v, { step: grid.step }));
    const u = Array.from(axis, (x) => (x - 2300) / 1700);
    const rows = Array.from(axis, (_, i) => [
      ...chosen.map((v) => v[i]!),
      1,
      -1,
      u[i]!,
      -u[i]!,
      ...shapes.flatMap((d) => [d[i]!, -d[i]!]),
    ]);
    const k = fcnnlsVector(rows, Array.from(mixture), { gradientTolerance: 1e-14 }).K.to1DArray();
    result.components.forEach((c, j) => {
      expect(c.weight).toBeCloseTo(k[j]!, 7);
    });
    let rss = 0;
    rows.forEach((row, i) => {
      const fit = row.reduce((s, a, j) => s + a * k[j]!, 0);
      rss += (mixture[i]! - fit) ** 2;
    });
    expect(result.rss / rss).toBeCloseTo(1, 6);
  });

  it('keeps forced components, honours maxComponents and rejects unknown forced ids', () => {
    const result = fitMixture(mixture, rankedPool(), { grid, with: ['decoy-3'], maxComponents: 3 });
    expect(result.components.length).toBeLessThanOrEqual(3);
    const decoy = result.components.find((c) => c.id === 'decoy-3')!;
    expect(decoy.forced).toBe(true);
    expect(decoy.improvement).toBeNull();
    expect(result.stopReason).toMatch(/maximum of 3/);
    expect(() => fitMixture(mixture, rankedPool(), { grid, with: ['nothing-here'] })).toThrow(BandshelfError);
    try {
      fitMixture(mixture, rankedPool(), { grid, with: ['nothing-here'] });
    } catch (error) {
      expect((error as BandshelfError).code).toBe('NOT_FOUND');
    }
  });

  it('fits inside ranges only and falls back to a residual noise estimate outside the band-free window', () => {
    const result = fitMixture(mixture, rankedPool(['spike']), {
      grid,
      ranges: [{ min: 900, max: 1800 }],
      baselineDegree: 1,
    });
    expect(result.span).toEqual({ min: 900, max: 1800 });
    expect(result.points).toBe(451);
    expect(result.noiseSource).toBe('residual-differences');
    expect(Number.isNaN(result.residual[0]!)).toBe(true);
    expect(result.residualBands.some((b) => Math.abs(b.position - 1402) <= 4)).toBe(true);
  });

  it('skips candidates that do not cover the fit points and refuses too small an overlap', () => {
    const partial = Float64Array.from(vectors.get('lipid')!, (v, i) => (axis[i]! > 3000 ? Number.NaN : v));
    const result = fitMixture(mixture, [{ id: 'partial', revision: 1, vector: partial }, ...rankedPool()], {
      grid,
    });
    expect(result.skipped).toEqual(['partial']);
    const tiny = new Float64Array(axis.length).fill(Number.NaN);
    tiny.set([1, 2, 3], 100);
    expect(() => fitMixture(tiny, rankedPool(), { grid })).toThrow(/usable grid points/);
  });
});

// The one match pipeline on a small in-memory source of synthetic Gaussian-band compounds (known by construction).
import { describe, expect, it } from 'vitest';
import { jsScoreKernels } from '../../../src/match/jsScoreKernels.js';
import { runMatchPipeline } from '../../../src/match/pipeline/runMatchPipeline.js';
import type { EntryOriginal, MatchScorer, MatchSource } from '../../../src/match/pipeline/types.js';
import { searchSpectra } from '../../../src/match/searchSpectra.js';
import { singleThreadRunner } from '../../../src/match/singleThreadRunner.js';
import { matchReportSchema } from '../../../src/schema/matchReport.js';
import { type Grid, recipeSchema } from '../../../src/schema/recipe.js';
import { findPeaks } from '../../../src/spectrum/findPeaks.js';
import { gridAxis } from '../../../src/spectrum/gridAxis.js';
import { penetrationDepth } from '../../../src/spectrum/penetrationDepth.js';
import { processSpectrum } from '../../../src/spectrum/processSpectrum.js';
import type { Spectrum } from '../../../src/spectrum/types.js';

const grid: Grid = { start: 4000, stop: 600, step: 2 };
const recipe = recipeSchema.parse({ baseline: { method: 'none' } });

/** Absorbance of Gaussian bands [position cm⁻¹, height, FWHM cm⁻¹] on a 1 cm⁻¹ axis, 4000–600 cm⁻¹. */
function compound(bands: [number, number, number][]): Spectrum {
  const wavenumber = Float64Array.from({ length: 3401 }, (_, i) => 600 + i);
  const absorbance = new Float64Array(wavenumber.length);
  for (const [p, h, w] of bands) {
    const s = w / 2.3548;
    for (let i = 0; i < wavenumber.length; i++)
      absorbance[i]! += h * Math.exp(-0.5 * ((wavenumber[i]! - p) / s) ** 2);
  }
  return { wavenumber, absorbance };
}

// Invented compounds, each with its own band pattern (synthetic, not real substances).
const originals: Record<string, Spectrum> = {
  alpha: compound([
    [1652, 1, 30],
    [1545, 0.6, 30],
    [3300, 0.3, 150],
  ]),
  beta: compound([
    [2922, 1, 16],
    [2852, 0.7, 14],
    [1740, 0.6, 18],
  ]),
  gamma: compound([
    [1080, 1, 40],
    [1030, 0.8, 30],
    [3350, 0.4, 200],
  ]),
  delta: compound([
    [1600, 1, 12],
    [1500, 0.5, 10],
    [830, 0.7, 14],
  ]),
};
const ids = Object.keys(originals);

function source(): MatchSource & { loaded: number[] } {
  const cols = gridAxis(grid).length;
  const processed = new Float32Array(ids.length * cols);
  const peakRows: { entry: number; position: number; height: number; prominence: number }[] = [];
  ids.forEach((id, r) => {
    const row = processSpectrum(originals[id]!, recipe, grid).processed;
    processed.set(row, r * cols);
    for (const p of findPeaks(originals[id]!)) peakRows.push({ entry: r, ...p });
  });
  peakRows.sort((a, b) => a.position - b.position);
  const loaded: number[] = [];
  return {
    name: 'in-memory',
    at: null,
    grid,
    recipe,
    stateKey: 'in-memory-1',
    entries: ids.map((id) => ({ id, revision: 1, name: id, class: 'small-molecule', hash: id })),
    processed,
    rows: ids.length,
    cols,
    peaks: {
      entry: Uint32Array.from(peakRows, (p) => p.entry),
      position: Float64Array.from(peakRows, (p) => p.position),
      height: Float64Array.from(peakRows, (p) => p.height),
      prominence: Float64Array.from(peakRows, (p) => p.prominence),
    },
    references: new Map(),
    loaded,
    originals: async (rows) => {
      loaded.push(...rows);
      return new Map(
        rows.map((r): [number, EntryOriginal] => [
          r,
          { original: originals[ids[r]!]!, recipe, references: new Map() },
        ]),
      );
    },
  };
}

const scorer: MatchScorer = (set, queries, options) =>
  searchSpectra(set, queries, {
    ...options,
    precision: 'exact',
    runner: (matrix) => singleThreadRunner(jsScoreKernels(matrix.memory)),
  });

/** 0.7 alpha + 0.3 beta, point by point: the weights are known by construction. */
function blend(): Spectrum {
  const a = originals.alpha!;
  const b = originals.beta!;
  return {
    wavenumber: a.wavenumber,
    absorbance: a.absorbance.map((v, i) => 0.7 * v + 0.3 * b.absorbance[i]!),
  };
}

describe('runMatchPipeline', () => {
  it('ranks a pure compound first and reports a schema-valid report naming the file only', async () => {
    const report = await runMatchPipeline({
      unknown: { file: 'gamma.csv', hash: 'a'.repeat(64), spectrum: originals.gamma!, warnings: [] },
      source: source(),
      scorer,
      assignments: [],
    });
    expect(matchReportSchema.parse(report)).toEqual(report);
    expect(report.hitsByMetric.pearson![0]!.id).toBe('gamma');
    expect(report.hitsByMetric.pearson![0]!.score).toBeGreaterThan(0.999);
    expect(report.query.file).toBe('gamma.csv');
    expect(report.mixture).toBeNull();
  });

  it('fits a two-compound blend with exactly its two compounds and finds their bands', async () => {
    const report = await runMatchPipeline(
      {
        unknown: { file: 'blend.csv', hash: 'b'.repeat(64), spectrum: blend(), warnings: [] },
        source: source(),
        scorer,
        assignments: [],
      },
      { mixture: true },
    );
    const components = report.mixture!.components.map((c) => c.id).sort();
    expect(components).toEqual(['alpha', 'beta']);
    expect(report.mixture!.r2).toBeGreaterThan(0.999);
    // Each constructed band position of the blend's compounds is among the identified bands (±4 cm⁻¹).
    for (const p of [1652, 1545, 2922, 2852, 1740]) {
      expect(
        report.bands.some((b) => Math.abs(b.position - p) <= 4),
        `${p}`,
      ).toBe(true);
    }
  });

  it('processes candidates again over a partial unknown span, loading their originals through the source', async () => {
    const b = blend();
    const keep = Array.from(b.wavenumber.keys()).filter(
      (i) => b.wavenumber[i]! >= 1400 && b.wavenumber[i]! <= 3100,
    );
    const partial = {
      wavenumber: Float64Array.from(keep, (i) => b.wavenumber[i]!),
      absorbance: Float64Array.from(keep, (i) => b.absorbance[i]!),
    };
    const s = source();
    const report = await runMatchPipeline(
      {
        unknown: { file: 'part.csv', hash: 'c'.repeat(64), spectrum: partial, warnings: [] },
        source: s,
        scorer,
        assignments: [],
      },
      { mixture: true },
    );
    expect(s.loaded.length).toBeGreaterThan(0);
    expect(report.mixture!.criterion).toContain('processed again over that span');
    expect(report.mixture!.components.map((c) => c.id).sort()).toEqual(['alpha', 'beta']);
  });

  it('leaves composite classes out of the fit by default and class or id filters out of the hit list', async () => {
    const s = source();
    // Entry 'gamma' relabelled as a composite reference: the fit must not draw on it (issue rule: pure substances only).
    const entries = s.entries.map((e) => (e.id === 'gamma' ? { ...e, class: 'mixture' } : e));
    const unknown = { file: 'g.csv', hash: 'e'.repeat(64), spectrum: originals.gamma!, warnings: [] };
    const report = await runMatchPipeline(
      { unknown, source: { ...s, entries }, scorer, assignments: [] },
      { mixture: true },
    );
    expect(report.hitsByMetric.pearson![0]!.id).toBe('gamma');
    expect(report.mixture!.components.map((c) => c.id)).not.toContain('gamma');
    expect(report.mixture!.criterion).toContain('class mixture were left out');
    const filtered = await runMatchPipeline(
      { unknown, source: s, scorer, assignments: [] },
      { exclude: ['gamma'], excludeClass: [], onlyClass: [] },
    );
    expect(filtered.hitsByMetric.pearson!.map((h) => h.id)).not.toContain('gamma');
    expect(filtered.hitsByMetric.pearson!).toHaveLength(3);
  });

  it('corrects an unknown measured by ATR as ATR entries are, when its technique says so', async () => {
    // Harrick (1967): an ATR spectrum samples a depth d_p ∝ λ, so A_ATR(ν̃) = A(ν̃) · d_p(ν̃) / d_p(1000 cm⁻¹) for a
    // weak absorber (diamond at 45°, sample index 1.5); the correction divides that weighting out again.
    const g = originals.gamma!;
    const depth = (x: number) => penetrationDepth(x, { crystalIndex: 2.4, sampleIndex: 1.5, angle: 45 });
    const atr: Spectrum = {
      wavenumber: g.wavenumber,
      absorbance: g.absorbance.map((a, i) => (a * depth(g.wavenumber[i]!)) / depth(1000)),
    };
    const run = (technique?: string) =>
      runMatchPipeline({
        unknown: {
          file: 'gamma-atr.csv',
          hash: 'c'.repeat(64),
          spectrum: atr,
          warnings: [],
          ...(technique === undefined ? {} : { technique }),
        },
        source: source(),
        scorer,
        assignments: [],
      });
    const asIs = await run();
    const corrected = await run('atr');
    expect(asIs.query.recipe.atr).toBeUndefined();
    expect(corrected.query.recipe.atr).toEqual({
      crystal: 'diamond',
      sampleIndex: 1.5,
      angle: 45,
      referenceWavenumber: 1000,
    });
    // The corrected unknown is the transmission spectrum again: its entry's stored vector, to rounding.
    expect(corrected.hitsByMetric.pearson![0]!.id).toBe('gamma');
    expect(corrected.hitsByMetric.pearson![0]!.score).toBeGreaterThan(0.99999);
    expect(corrected.hitsByMetric.pearson![0]!.score).toBeGreaterThan(asIs.hitsByMetric.pearson![0]!.score);
    expect(asIs.hitsByMetric.pearson![0]!.score).toBeLessThan(0.995);
  });

  it('refuses a forced id the source does not hold', async () => {
    await expect(
      runMatchPipeline(
        {
          unknown: { file: 'x.csv', hash: 'd'.repeat(64), spectrum: blend(), warnings: [] },
          source: source(),
          scorer,
          assignments: [],
        },
        { mixture: true, with: ['nope'] },
      ),
    ).rejects.toMatchObject({ code: 'NOT_FOUND' });
  });
});

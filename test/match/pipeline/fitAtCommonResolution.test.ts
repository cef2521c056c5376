// Like with like in the mixture fit: references and unknown at one resolution before the fit (through the pipeline).
import { describe, expect, it } from 'vitest';
import { jsScoreKernels } from '../../../src/match/jsScoreKernels.js';
import { runMatchPipeline } from '../../../src/match/pipeline/runMatchPipeline.js';
import type { EntryOriginal, MatchScorer, MatchSource } from '../../../src/match/pipeline/types.js';
import { searchSpectra } from '../../../src/match/searchSpectra.js';
import { singleThreadRunner } from '../../../src/match/singleThreadRunner.js';
import { matchReportSchema } from '../../../src/schema/matchReport.js';
import { type Grid, recipeSchema } from '../../../src/schema/recipe.js';
import { gridAxis } from '../../../src/spectrum/gridAxis.js';
import { processSpectrum } from '../../../src/spectrum/processSpectrum.js';
import type { Spectrum } from '../../../src/spectrum/types.js';

const grid: Grid = { start: 4000, stop: 600, step: 2 };
const recipe = recipeSchema.parse({ baseline: { method: 'none' } });

/**
 * Gaussian bands [position cm⁻¹, height, intrinsic FWHM cm⁻¹] as an instrument of Gaussian line shape `resolution`
 * records them, on a 0.5 cm⁻¹ axis: a Gaussian convolved with a Gaussian is a Gaussian whose FWHM is the
 * quadrature sum √(w² + r²), at the same area (common practice: the convolution of two normal densities).
 */
function measured(bands: [number, number, number][], resolution: number): Spectrum {
  const wavenumber = Float64Array.from({ length: 6801 }, (_, i) => 600 + i * 0.5);
  const absorbance = new Float64Array(wavenumber.length);
  for (const [p, h, w] of bands) {
    const seen = Math.hypot(w, resolution);
    const s = seen / 2.3548;
    const height = (h * w) / seen; // the area h·w is kept
    for (let i = 0; i < wavenumber.length; i++)
      absorbance[i]! += height * Math.exp(-0.5 * ((wavenumber[i]! - p) / s) ** 2);
  }
  return { wavenumber, absorbance };
}

// Invented band sets (synthetic): narrow bands, so the instrument's line shape dominates their width.
const bandsOf: Record<string, [number, number, number][]> = {
  narrow: [
    [1710, 1, 4],
    [1450, 0.7, 5],
    [1180, 0.5, 4],
  ],
  other: [
    [2960, 1, 6],
    [1380, 0.8, 5],
    [1030, 0.6, 6],
  ],
  decoy: [
    [1700, 0.8, 14],
    [1440, 0.6, 14],
    [1170, 0.5, 14],
    [2950, 0.3, 20],
  ],
};

function source(resolutions: Record<string, number>): MatchSource {
  const ids = Object.keys(resolutions);
  const cols = gridAxis(grid).length;
  const processed = new Float32Array(ids.length * cols);
  const originals = ids.map((id) => measured(bandsOf[id]!, resolutions[id]!));
  for (const [r, s] of originals.entries())
    processed.set(processSpectrum(s, recipe, grid).processed, r * cols);
  return {
    name: 'in-memory',
    at: null,
    grid,
    recipe,
    stateKey: 'in-memory-resolutions',
    entries: ids.map((id) => ({ id, revision: 1, name: id, class: 'small-molecule', hash: id })),
    processed,
    rows: ids.length,
    cols,
    peaks: {
      entry: new Uint32Array(0),
      position: new Float64Array(0),
      height: new Float64Array(0),
      prominence: new Float64Array(0),
    },
    references: new Map(),
    originals: async (rows) =>
      new Map(
        rows.map((r): [number, EntryOriginal] => [
          r,
          { original: originals[r]!, recipe, references: new Map(), resolution: resolutions[ids[r]!]! },
        ]),
      ),
  };
}

const scorer: MatchScorer = (set, queries, options) =>
  searchSpectra(set, queries, {
    ...options,
    precision: 'exact',
    runner: (matrix) => singleThreadRunner(jsScoreKernels(matrix.memory)),
  });

/** 0.6 narrow + 0.4 other, both as a coarse instrument records them. */
function blendAt(resolution: number): Spectrum {
  const a = measured(bandsOf.narrow!, resolution);
  const b = measured(bandsOf.other!, resolution);
  return {
    wavenumber: a.wavenumber,
    absorbance: a.absorbance.map((v, i) => 0.6 * v + 0.4 * b.absorbance[i]!),
  };
}

async function fitted(src: MatchSource, unknown: Spectrum, resolution: number, likeWithLike: boolean) {
  const report = await runMatchPipeline(
    {
      unknown: { file: 'blend.csv', hash: 'b'.repeat(64), spectrum: unknown, warnings: [], resolution },
      source: src,
      scorer,
      assignments: [],
    },
    { mixture: true, likeWithLike },
  );
  expect(matchReportSchema.parse(report)).toEqual(report);
  return report.mixture!;
}

describe('the mixture fit at a common resolution', () => {
  it('degrades a sharper reference to a coarse unknown before the fit, and the fit then leaves no residual', async () => {
    // References at 2 cm⁻¹, the unknown at 12 cm⁻¹.
    const src = source({ narrow: 2, other: 2, decoy: 2 });
    const unknown = blendAt(12);
    const alike = await fitted(src, unknown, 12, true);
    const unlike = await fitted(src, unknown, 12, false);
    expect(alike.resolution).toEqual({
      common: 12,
      unknown: 12,
      degraded: expect.arrayContaining(['narrow', 'other']),
      unknownDegraded: false,
    });
    expect(alike.criterion).toContain('common resolution of 12 cm⁻¹');
    expect(alike.components.map((c) => c.id).sort()).toEqual(['narrow', 'other']);
    // Degraded by √(12² − 2²), each band has the unknown's width √(w² + 12²) exactly (quadrature, above):
    // what is left is the grid's discretisation only.
    expect(alike.r2!).toBeGreaterThan(0.9999);
    expect(alike.rss).toBeLessThan(unlike.rss / 20);
    expect(unlike.resolution).toBeUndefined();
  });

  it('raises the common resolution to a coarser fitted reference and degrades the unknown to it', async () => {
    // The unknown at 4 cm⁻¹; 'narrow' was recorded at 16 cm⁻¹, 'other' at 4.
    const src = source({ narrow: 16, other: 4, decoy: 4 });
    const unknown = blendAt(4);
    const alike = await fitted(src, unknown, 4, true);
    const unlike = await fitted(src, unknown, 4, false);
    expect(alike.resolution).toMatchObject({ common: 16, unknown: 4, unknownDegraded: true });
    expect(alike.resolution!.degraded).toContain('other');
    expect(alike.resolution!.degraded).not.toContain('narrow');
    expect(alike.components.map((c) => c.id).sort()).toEqual(['narrow', 'other']);
    expect(alike.r2!).toBeGreaterThan(0.9999);
    expect(alike.rss).toBeLessThan(unlike.rss / 20);
  });

  it('changes nothing when every resolution agrees', async () => {
    const src = source({ narrow: 8, other: 8, decoy: 8 });
    const alike = await fitted(src, blendAt(8), 8, true);
    const unlike = await fitted(src, blendAt(8), 8, false);
    expect(alike.resolution).toBeUndefined();
    expect(alike.rss).toBe(unlike.rss);
  });
});

// Small in-memory site objects for unit tests (no library): summaries and details built from Gaussian bands.
import { seededRandom } from '../../src/demo/seededRandom.js';
import { recipeSchema } from '../../src/schema/recipe.js';
import type { SiteEntryDetail, SiteEntrySummary } from '../../src/site/types.js';
import { processSpectrum } from '../../src/spectrum/processSpectrum.js';

export const GRID = { start: 4000, stop: 600, step: 2 };

export function summary(id: string, meta: Record<string, unknown> = {}): SiteEntrySummary {
  return {
    id,
    revision: 1,
    name: String(meta.name ?? id),
    class: String(meta.class ?? 'other'),
    technique: String(meta.technique ?? ''),
    sampleForm: String(meta.sampleForm ?? ''),
    tags: (meta.tags as string[]) ?? [],
    synonyms: (meta.synonyms as string[]) ?? [],
    formula: String(meta.formula ?? ''),
    inchiKey: String(meta.inchiKey ?? ''),
    cas: String(meta.cas ?? ''),
    notes: String(meta.notes ?? ''),
    date: '2026-01-01',
    createdAt: '2026-01-01T00:00:00.000Z',
    reviewState: 'draft',
    coverage: null,
    synthetic: true,
    meta: { id, name: meta.name ?? id, synthetic: true, ...meta },
  };
}

/** An entry whose original is Gaussian bands (position, height, FWHM) at 1 cm⁻¹ spacing, processed by the recipe. */
export function detail(
  id: string,
  bands: [number, number, number][],
  meta: Record<string, unknown> = {},
  seed = 1,
): SiteEntryDetail {
  const rng = seededRandom(seed);
  const n = 3401;
  const wavenumber = new Float64Array(n);
  const absorbance = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = 600 + i;
    let y = 0.01 + 0.0003 * rng.normal();
    for (const [c, h, w] of bands) y += h * Math.exp(-4 * Math.LN2 * ((x - c) / w) ** 2);
    wavenumber[i] = x;
    absorbance[i] = y;
  }
  const recipe = recipeSchema.parse({});
  const { processed } = processSpectrum({ wavenumber, absorbance }, recipe, GRID);
  return {
    summary: summary(id, meta),
    hash: 'f'.repeat(64),
    original: { wavenumber, absorbance },
    grid: GRID,
    processed: Float32Array.from(processed),
    recipe,
    peaks: bands.map(([c, h, w]) => ({ position: c, height: h, prominence: h, fwhm: w })),
    qc: [],
    extras: {},
    files: [{ role: 'data', name: `${id}.csv`, sha256: 'a'.repeat(64), size: 1 }],
    history: [
      {
        revision: 1,
        kind: 'data',
        hash: 'f'.repeat(64),
        author: 'a',
        message: 'm',
        createdAt: '2026-01-01T00:00:00Z',
        reviewState: 'draft',
        changed: [],
        releases: ['r1'],
      },
    ],
  };
}

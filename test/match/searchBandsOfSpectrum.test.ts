// Band-position search from a spectrum: the bands it reads off a synthetic spectrum of known Gaussian bands, their
// strengths, the saturated points it leaves out, and the hits equal to searchBands given the same bands.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { bandStrength } from '../../src/match/bandStrength.js';
import { buildBandIndex } from '../../src/match/buildBandIndex.js';
import { searchBands } from '../../src/match/searchBands.js';
import { searchBandsOfSpectrum } from '../../src/match/searchBandsOfSpectrum.js';
import type { PeakTable } from '../../src/match/types.js';
import { recipeSchema } from '../../src/schema/recipe.js';

const grid = { start: 4000, stop: 600, step: 2 };
const recipe = recipeSchema.parse({});

/** Gaussian bands (centre, height, FWHM) on 4000–600 cm⁻¹ at 1 cm⁻¹, ascending: a Gaussian's maximum is its
 * centre and its height there the given height (common practice). */
function spectrumOf(bands: [number, number, number][]) {
  const n = 3401;
  const wavenumber = new Float64Array(n);
  const absorbance = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = 600 + i;
    wavenumber[i] = x;
    for (const [c, h, w] of bands) absorbance[i]! += h * Math.exp((-4 * Math.LN2 * (x - c) ** 2) / w ** 2);
  }
  return { wavenumber, absorbance };
}

function tableOf(entries: Record<string, [number, number][]>): PeakTable {
  const ids = Object.keys(entries).sort();
  const flat: [number, number, number][] = [];
  ids.forEach((id, row) => {
    for (const [p, h] of entries[id]!) flat.push([row, p, h]);
  });
  flat.sort((a, b) => a[1] - b[1]);
  return {
    entries: ids.map((id) => ({ id, revision: 1, name: id, class: 'protein' })),
    peaks: {
      entry: Uint32Array.from(flat, (f) => f[0]),
      position: Float64Array.from(flat, (f) => f[1]),
      height: Float64Array.from(flat, (f) => f[2]),
      prominence: Float64Array.from(flat, (f) => f[2]),
    },
  };
}

const index = buildBandIndex(
  tableOf({
    a: [
      [1652, 1],
      [1545, 0.6],
      [1240, 0.3],
    ],
    b: [
      [1650, 1],
      [1400, 0.5],
    ],
  }),
);
const spectrum = spectrumOf([
  [1652, 1, 30],
  [1545, 0.5, 30],
  [1240, 0.2, 40],
]);

describe('bandStrength', () => {
  it('rates a band against the strongest at the documented bounds (s ≥ 0.6, m ≥ 0.25)', () => {
    expect([0.6, 0.5999, 0.25, 0.2499, 1].map((r) => bandStrength(r))).toEqual(['s', 'm', 'm', 'w', 's']);
  });
});

describe('searchBandsOfSpectrum', () => {
  it('reads the bands at the Gaussians’ centres with their strengths and searches them like searchBands', () => {
    const found = searchBandsOfSpectrum({ spectrum, recipe, grid, references: new Map(), index });
    expect(found.bands.map((b) => b.strength)).toEqual(['s', 'm', 'w']);
    // The bands' centres (the synthetic spectrum's own), within a fifth of the 2 cm⁻¹ grid step.
    [1652, 1545, 1240].forEach((c, i) => {
      expect(Math.abs(found.bands[i]!.position - c)).toBeLessThan(0.4);
    });
    expect(found.hits.map((h) => [h.id, h.matched])).toEqual([
      ['a', 3],
      ['b', 1],
    ]);
    expect(found.hits).toEqual(searchBands(index, found.bands));
  });

  it('keeps the most prominent bands only, up to maxBands', () => {
    const found = searchBandsOfSpectrum(
      { spectrum, recipe, grid, references: new Map(), index },
      { maxBands: 1 },
    );
    expect(found.bands).toHaveLength(1);
    expect(Math.round(found.bands[0]!.position)).toBe(1652);
  });

  it('reads no band where the spectrum is saturated (not covered)', () => {
    const saturated = new Uint8Array(spectrum.wavenumber.length);
    for (let i = 0; i < saturated.length; i++) {
      const x = spectrum.wavenumber[i]!;
      if (x >= 1630 && x <= 1675) saturated[i] = 1;
    }
    const found = searchBandsOfSpectrum({ spectrum, saturated, recipe, grid, references: new Map(), index });
    expect(found.bands.some((b) => Math.abs(b.position - 1652) < 30)).toBe(false);
    expect(found.bands.map((b) => Math.round(b.position))).toEqual([1545, 1240]);
  });

  it('refuses a spectrum off the grid in one error naming the grid', () => {
    const far = spectrumOf([[1652, 1, 30]]);
    const shifted = { wavenumber: far.wavenumber.map((x) => x + 10000), absorbance: far.absorbance };
    let error: unknown;
    try {
      searchBandsOfSpectrum({
        spectrum: shifted,
        recipe,
        grid,
        references: new Map(),
        index,
        file: 'far.csv',
      });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(BandshelfError);
    expect((error as BandshelfError).file).toBe('far.csv');
  });
});

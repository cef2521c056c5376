// Band-position search from a spectrum (browser-safe): its bands, read as the library's stored peaks were, searched.
import { BandshelfError } from '../error.js';
import type { Grid, Recipe } from '../schema/recipe.js';
import { findPeaks } from '../spectrum/findPeaks.js';
import { gridAxis } from '../spectrum/gridAxis.js';
import { processSpectrum } from '../spectrum/processSpectrum.js';
import type { Spectrum } from '../spectrum/types.js';
import { bandStrength } from './bandStrength.js';
import { resolutionForUnknown } from './resolutionForUnknown.js';
import { type SearchBandsOptions, searchBands } from './searchBands.js';
import type { BandHit, BandIndex, BandQuery } from './types.js';

export interface SearchBandsOfSpectrumInput {
  /** The spectrum as read from its file (cm⁻¹ ascending, absorbance). */
  spectrum: Spectrum;
  /** 1 per point clipped at the absorbance ceiling: those points are not covered, so no band is read there. */
  saturated?: Uint8Array;
  /** The resolution the file states, cm⁻¹ (for a recipe that matches resolutions). */
  resolution?: unknown;
  /** The file, named in errors. */
  file?: string;
  /** The recipe the library's entries were processed with (their stored peaks were found on its output). */
  recipe: Recipe;
  grid: Grid;
  /** The reference spectra the recipe's subtraction or EMSC step names, by entry id. */
  references: ReadonlyMap<string, Spectrum>;
  /** The band index of the library state to search. */
  index: BandIndex;
}

export interface SearchBandsOfSpectrumOptions extends SearchBandsOptions {
  /**
   * Search with at most this many bands of the spectrum, the most prominent ones (a spectrum's minor bands, which
   * every entry has somewhere, would otherwise outvote its characteristic ones).
   * @default 12
   */
  maxBands?: number;
  /**
   * Smallest peak prominence as a fraction of the processed vector's range: the 0.01 the library stores its
   * peaks with, so the spectrum's bands and the entries' peaks are read alike.
   * @default 0.01
   */
  relativeProminence?: number;
}

export interface SpectrumBandSearch {
  /** The bands read off the spectrum, high to low wavenumber, each with its s/m/w class (bandStrength). */
  bands: BandQuery[];
  hits: BandHit[];
}

/**
 * The spectrum is processed with the recipe onto the library grid (as `match` processes an unknown: its
 * resolution pinned in, saturated points not covered), its peaks found exactly as ingest finds an entry's (same
 * finder, same relative prominence, on the processed vector), the `maxBands` most prominent kept with their
 * strength relative to the strongest, and those positions searched with `searchBands`.
 */
export function searchBandsOfSpectrum(
  input: SearchBandsOfSpectrumInput,
  options: SearchBandsOfSpectrumOptions = {},
): SpectrumBandSearch {
  const maxBands = options.maxBands ?? 12;
  if (!(Number.isInteger(maxBands) && maxBands > 0)) {
    throw new BandshelfError('BAD_OPTION', `maxBands must be a positive whole number, not ${maxBands}`, {
      field: 'maxBands',
    });
  }
  const { recipe } = resolutionForUnknown(input.spectrum, input.recipe, { stated: input.resolution });
  const { processed } = processSpectrum(input.spectrum, recipe, input.grid, {
    references: new Map(input.references),
    ...(input.file === undefined ? {} : { file: input.file }),
    ...(input.saturated === undefined ? {} : { saturated: input.saturated }),
  });
  const covered = processed.reduce((n, v) => (Number.isNaN(v) ? n : n + 1), 0);
  if (covered === 0) {
    const hi = Math.max(input.grid.start, input.grid.stop);
    const lo = Math.min(input.grid.start, input.grid.stop);
    const clipped = input.saturated?.reduce((n, v) => n + v, 0) ?? 0;
    const why =
      clipped === 0
        ? 'check its x unit (--x-unit)'
        : `${clipped} of its points are saturated (at or beyond the absorbance ceiling) and kept out`;
    throw new BandshelfError(
      'SMALL_OVERLAP',
      `the spectrum covers none of the library grid (${hi}–${lo} cm⁻¹): ${why}`,
      { ...(input.file === undefined ? {} : { file: input.file }) },
    );
  }
  const all = findPeaks(
    { wavenumber: gridAxis(input.grid), absorbance: processed },
    { relativeProminence: options.relativeProminence ?? 0.01 },
  );
  if (all.length === 0) {
    throw new BandshelfError(
      'NO_BANDS',
      'no band stands out of the processed spectrum, so there is nothing to search for; give band positions instead',
      { ...(input.file === undefined ? {} : { file: input.file }) },
    );
  }
  // Strength relative to the strongest of all its peaks, as buildBandIndex rates an entry's stored peaks.
  const strongest = all.reduce((m, p) => Math.max(m, Math.abs(p.height)), 0);
  const bands = [...all]
    .sort((a, b) => b.prominence - a.prominence || a.position - b.position)
    .slice(0, maxBands)
    .sort((a, b) => b.position - a.position)
    .map(
      (p): BandQuery => ({
        position: p.position,
        strength: bandStrength(strongest > 0 ? Math.abs(p.height) / strongest : 0),
      }),
    );
  const { maxBands: _maxBands, relativeProminence: _prominence, ...search } = options;
  return { bands, hits: searchBands(input.index, bands, search) };
}

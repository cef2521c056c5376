// Matches a dropped spectrum file against the published vectors with the project's own reader, recipe and
// scoring code (browser-safe: the same functions `bandshelf match` runs, bundled for the page).
import { readSpectrumFile } from '../../formats/readSpectrumFile.js';
import { jsScoreKernels } from '../../match/jsScoreKernels.js';
import { searchSpectra } from '../../match/searchSpectra.js';
import { type Hit, MIN_OVERLAP_DEFAULT } from '../../match/searchTypes.js';
import { singleThreadRunner } from '../../match/singleThreadRunner.js';
import type { Grid, Recipe } from '../../schema/recipe.js';
import { processSpectrum } from '../../spectrum/processSpectrum.js';
import type { Spectrum } from '../../spectrum/types.js';

/** What the build writes beside the binary matrix (`assets/search-matrix.json`), plus the decoded matrix. */
export interface PublishedSearchSet {
  grid: Grid;
  recipe: Recipe;
  stateKey: string;
  entries: { id: string; revision: number; name: string; class: string; path: string | null }[];
  /** rows × gridLength(grid), NaN where not covered. */
  processed: Float32Array;
  references: Record<string, { wavenumber: number[]; absorbance: number[] }>;
}

export interface MatchSpectrumFileOptions {
  /** Hits returned.
   * @default 10 */
  k?: number;
  /** Least shared coverage, cm⁻¹ (as `bandshelf match --min-overlap`).
   * @default MIN_OVERLAP_DEFAULT (200) */
  minOverlap?: number;
}

export interface FileMatch {
  /** Title of the spectrum read (JCAMP-DX TITLE) or the file name. */
  title: string;
  /** Spectra in the file; only the first is matched. */
  spectra: number;
  warnings: string[];
  hits: (Hit & { path: string | null })[];
}

/**
 * Scores run on plain JavaScript kernels: compiling WebAssembly would need 'wasm-unsafe-eval' in the page's
 * Content-Security-Policy, and one query against a published release is fast enough without it.
 */
export function matchSpectrumFile(
  bytes: Uint8Array,
  file: string,
  set: PublishedSearchSet,
  options: MatchSpectrumFileOptions = {},
): FileMatch {
  const parsed = readSpectrumFile(bytes, { file });
  const first = parsed[0]!;
  const references = new Map<string, Spectrum>(
    Object.entries(set.references).map(([id, s]) => [
      id,
      { wavenumber: Float64Array.from(s.wavenumber), absorbance: Float64Array.from(s.absorbance) },
    ]),
  );
  const { processed } = processSpectrum(first.spectrum, set.recipe, set.grid, { references, file });
  const [hits] = searchSpectra(set, [processed], {
    metric: 'pearson',
    k: options.k ?? 10,
    minOverlap: options.minOverlap ?? MIN_OVERLAP_DEFAULT,
    precision: 'exact',
    runner: (matrix) => singleThreadRunner(jsScoreKernels(matrix.memory)),
  });
  const paths = new Map(set.entries.map((e) => [e.id, e.path]));
  return {
    title: typeof first.meta.title === 'string' && first.meta.title !== '' ? first.meta.title : file,
    spectra: parsed.length,
    warnings: first.warnings.map((w) => (w.line === undefined ? w.message : `line ${w.line}: ${w.message}`)),
    hits: (hits ?? []).map((h) => ({ ...h, path: paths.get(h.id) ?? null })),
  };
}

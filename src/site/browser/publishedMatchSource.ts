// The site's published data as the match pipeline's source: the vectors, peaks and recipe of search-matrix.json,
// and each entry's original loaded from its published JSON only when the pipeline asks for it.
import type { EntryOriginal, MatchSource } from '../../match/pipeline/types.js';
import type { Recipe } from '../../schema/recipe.js';
import type { Spectrum } from '../../spectrum/types.js';
import type { PublishedSearchSet } from './matchSpectrumFile.js';

/** The part of a published entry JSON (`entries/<slug>/<slug>.json`) the pipeline reads. */
export interface PublishedEntryDocument {
  recipe: Recipe;
  original: { x: number[]; y: number[] };
  /** The revision's extras; its recorded resolution is used to compare like with like. */
  extras?: { resolution?: { value: number } };
}

export interface PublishedMatchSourceOptions {
  /**
   * Loads the JSON of the entry published in the given folder (e.g. `entries/albumin/`).
   * @default undefined (no originals: partial-span unknowns keep the stored vectors)
   */
  loadEntry?: (path: string) => Promise<PublishedEntryDocument>;
}

const spectrumOf = (s: { wavenumber: ArrayLike<number>; absorbance: ArrayLike<number> }): Spectrum => ({
  wavenumber: Float64Array.from(s.wavenumber),
  absorbance: Float64Array.from(s.absorbance),
});

/** Loaded entries are kept for the life of the source, so several dropped files load each at most once. */
export function publishedMatchSource(
  set: PublishedSearchSet,
  options: PublishedMatchSourceOptions = {},
): MatchSource {
  const cols = set.processed.length / Math.max(1, set.entries.length);
  const documents = new Map<string, Promise<PublishedEntryDocument>>();
  const load = (path: string): Promise<PublishedEntryDocument> => {
    let doc = documents.get(path);
    if (doc === undefined) {
      doc = options.loadEntry!(path);
      documents.set(path, doc);
    }
    return doc;
  };
  const pathOf = new Map(set.entries.map((e) => [e.id, e.path]));
  const referencesOf = async (recipe: Recipe): Promise<Map<string, Spectrum>> => {
    const map = new Map<string, Spectrum>();
    for (const step of [recipe.reference, recipe.emsc]) {
      if (step === null || map.has(step.id)) continue;
      const published = set.references[step.id];
      const path = pathOf.get(step.id);
      if (published !== undefined) map.set(step.id, spectrumOf(published));
      else if (path != null) {
        const doc = await load(path);
        map.set(step.id, spectrumOf({ wavenumber: doc.original.x, absorbance: doc.original.y }));
      }
    }
    return map;
  };
  const peaks = set.peaks ?? { entry: [], position: [], height: [], prominence: [] };
  return {
    name: set.name ?? 'published library',
    at: set.at ?? null,
    grid: set.grid,
    recipe: set.recipe,
    stateKey: set.stateKey,
    entries: set.entries.map((e) => ({
      id: e.id,
      revision: e.revision,
      name: e.name,
      class: e.class,
      hash: e.hash ?? '',
    })),
    processed: set.processed,
    rows: set.entries.length,
    cols,
    peaks: {
      entry: Uint32Array.from(peaks.entry),
      position: Float64Array.from(peaks.position),
      height: Float64Array.from(peaks.height),
      prominence: Float64Array.from(peaks.prominence),
    },
    references: new Map(Object.entries(set.references).map(([id, s]) => [id, spectrumOf(s)])),
    wrongHitNull:
      set.wrongHitNull === undefined
        ? null
        : {
            metric: 'pearson',
            scores: Float64Array.from(set.wrongHitNull.scores),
            entries: set.wrongHitNull.entries,
            sampled: set.wrongHitNull.sampled,
          },
    originals: async (rows) => {
      const out = new Map<number, EntryOriginal>();
      if (options.loadEntry === undefined) return out;
      // Loaded side by side: the mixture fit asks for every candidate's original (its resolution) at once.
      const loaded = await Promise.all(
        rows.map(async (row): Promise<[number, EntryOriginal] | null> => {
          const path = set.entries[row]?.path;
          if (path == null) return null;
          const doc = await load(path);
          return [
            row,
            {
              original: spectrumOf({ wavenumber: doc.original.x, absorbance: doc.original.y }),
              recipe: doc.recipe,
              references: await referencesOf(doc.recipe),
              ...(typeof doc.extras?.resolution?.value === 'number'
                ? { resolution: doc.extras.resolution.value }
                : {}),
            },
          ];
        }),
      );
      for (const pair of loaded) if (pair !== null) out.set(pair[0], pair[1]);
      return out;
    },
  };
}

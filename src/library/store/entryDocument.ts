// The JSON form of one entry revision, owned once: `bandshelf show ID --json` prints it (with the store's own
// fields added) and the site publishes it as each entry's download.
import type { Grid, Recipe } from '../../schema/recipe.js';
import type { Peak, QcFlag, Spectrum } from '../../spectrum/types.js';

/** What the document carries as it is stored. */
export interface EntryDocumentFields {
  id: string;
  revision: number;
  hash: string;
  reviewState: string;
  createdAt: string;
  meta: Record<string, unknown>;
  grid: Grid;
  recipe: Recipe;
  qc: QcFlag[];
  files: { role: string; name: string; sha256: string; size: number }[];
}

/** What the document is made from: an `EntryView`, or the site's view of the same revision. */
export interface EntryDocumentSource extends EntryDocumentFields {
  original: Spectrum;
  /** gridLength(grid) values, ascending wavenumber, NaN where not covered. */
  processed: Float32Array | Float64Array;
  peaks: readonly Peak[];
  /** Figures stored beside the vectors (`RevisionExtras`). */
  extras: object;
}

/** The processed vector kept in a file beside the JSON instead of inline. */
export interface ProcessedVectorFile {
  file: string;
  format: 'float32le';
  length: number;
}

export interface EntryDocument extends EntryDocumentFields {
  /** The parsed original spectrum: cm⁻¹ ascending, absorbance; every point. */
  original: { x: number[]; y: number[] };
  /**
   * Inline, null where not covered (JSON has no NaN); or, with `processedFile`, the name of a file of raw
   * little-endian float32 (gridLength(grid) values, NaN where not covered): the stored values in a quarter of the
   * bytes of JSON text.
   */
  processed: (number | null)[] | ProcessedVectorFile;
  peaks: Peak[];
  extras: Record<string, unknown>;
}

export interface EntryDocumentOptions {
  /** Name the processed vector's file (written beside the JSON by the caller) instead of inlining the values.
   * @default undefined (inline) */
  processedFile?: string;
}

export function entryDocument(
  source: EntryDocumentSource,
  options: EntryDocumentOptions = {},
): EntryDocument {
  return {
    id: source.id,
    revision: source.revision,
    hash: source.hash,
    reviewState: source.reviewState,
    createdAt: source.createdAt,
    meta: source.meta,
    grid: source.grid,
    recipe: source.recipe,
    original: { x: Array.from(source.original.wavenumber), y: Array.from(source.original.absorbance) },
    processed:
      options.processedFile === undefined
        ? Array.from(source.processed, (v) => (Number.isFinite(v) ? v : null))
        : { file: options.processedFile, format: 'float32le', length: source.processed.length },
    peaks: source.peaks.map((p) => ({
      position: p.position,
      height: p.height,
      prominence: p.prominence,
      fwhm: p.fwhm,
    })),
    qc: source.qc,
    extras: source.extras as Record<string, unknown>,
    files: source.files,
  };
}

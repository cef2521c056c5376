// The JSON download of an entry: its metadata, the full original data, peaks, QC and recipe, in the shape of
// `bandshelf show ID --json` except that the processed vector is named, not inlined (see EntryDocument).
import type { EntryDocument, SiteEntryDetail } from './types.js';

export interface EntryJsonOptions {
  /** File name of the processed vector written beside the JSON.
   * @default `${id}.processed.f32` */
  processedFile?: string;
}

export function entryJson(detail: SiteEntryDetail, options: EntryJsonOptions = {}): string {
  const s = detail.summary;
  const document: EntryDocument = {
    id: s.id,
    revision: s.revision,
    hash: detail.hash,
    reviewState: s.reviewState,
    createdAt: s.createdAt,
    meta: s.meta,
    grid: detail.grid,
    recipe: detail.recipe,
    original: { x: Array.from(detail.original.wavenumber), y: Array.from(detail.original.absorbance) },
    processed: {
      file: options.processedFile ?? `${s.id}.processed.f32`,
      format: 'float32le',
      length: detail.processed.length,
    },
    peaks: detail.peaks.map((p) => ({
      position: p.position,
      height: p.height,
      prominence: p.prominence,
      fwhm: p.fwhm,
    })),
    qc: detail.qc,
    extras: detail.extras,
    files: detail.files,
  };
  return `${JSON.stringify(document)}\n`;
}

// The JSON download of an entry: the shape `bandshelf show ID --json` prints, with the full original data.
import type { SiteEntryDetail } from './types.js';

export interface EntryJsonOptions {
  /** The caution every published file carries.
   * @default undefined (left out) */
  caution?: string;
}

/** Float32 values need at most 9 significant digits to come back exactly; fewer bytes than the float64 digits. */
function float32Value(v: number): number | null {
  return Number.isFinite(v) ? Number(v.toPrecision(9)) : null;
}

export function entryJson(detail: SiteEntryDetail, options: EntryJsonOptions = {}): string {
  const s = detail.summary;
  const processed = new Array<number | null>(detail.processed.length);
  for (let i = 0; i < processed.length; i++) processed[i] = float32Value(detail.processed[i]!);
  const document = {
    id: s.id,
    revision: s.revision,
    hash: detail.hash,
    reviewState: s.reviewState,
    createdAt: s.createdAt,
    meta: s.meta,
    grid: detail.grid,
    recipe: detail.recipe,
    original: { x: Array.from(detail.original.wavenumber), y: Array.from(detail.original.absorbance) },
    processed,
    peaks: detail.peaks.map((p) => ({ position: p.position, height: p.height, prominence: p.prominence, fwhm: p.fwhm })),
    qc: detail.qc,
    extras: detail.extras,
    files: detail.files,
    ...(options.caution === undefined ? {} : { caution: options.caution }),
  };
  return `${JSON.stringify(document)}\n`;
}

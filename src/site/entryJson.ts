// The JSON download of an entry: the shape `bandshelf show ID --json` prints, with the full original data.
import type { EntryDocument, SiteEntryDetail } from './types.js';

export interface EntryJsonOptions {
  /** The caution every published file carries.
   * @default undefined (left out) */
  caution?: string;
}

/**
 * Processed vectors are stored as float32, which resolves about 6e-8 of a vector's largest |value|. Rounding every
 * value to 1e-8 of that largest value keeps all of it, and lets JSON print short decimals instead of the float64
 * digits the float32 → float64 widening adds (0.012345678, not 0.012345678918063641) — half the bytes.
 */
function roundedProcessed(values: ArrayLike<number>): (number | null)[] {
  let maxAbs = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (Number.isFinite(v) && Math.abs(v) > maxAbs) maxAbs = Math.abs(v);
  }
  const decimals = maxAbs > 0 ? Math.max(0, Math.min(20, 8 - Math.ceil(Math.log10(maxAbs)))) : 0;
  const scale = 10 ** decimals;
  const out = new Array<number | null>(values.length);
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    // Dividing by a power of ten gives the double nearest the decimal, which JSON prints in its short form.
    out[i] = Number.isFinite(v) ? Math.round(v * scale) / scale : null;
  }
  return out;
}

export function entryJson(detail: SiteEntryDetail, options: EntryJsonOptions = {}): string {
  const s = detail.summary;
  const processed = roundedProcessed(detail.processed);
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
    processed,
    peaks: detail.peaks.map((p) => ({ position: p.position, height: p.height, prominence: p.prominence, fwhm: p.fwhm })),
    qc: detail.qc,
    extras: detail.extras,
    files: detail.files,
    ...(options.caution === undefined ? {} : { caution: options.caution }),
  };
  return `${JSON.stringify(document)}\n`;
}

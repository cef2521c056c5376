// Runs a pinned recipe on an original spectrum: the one path both ingest and `check` take, so a stored vector can
// always be reproduced bit for bit.
import { BandshelfError } from '../../error.js';
import type { Recipe } from '../../schema/recipe.js';
import { processSpectrum } from '../../spectrum/processSpectrum.js';
import type { Peak, Spectrum } from '../../spectrum/types.js';
import { blobFloat64 } from '../codecs/blobFloat64.js';
import type { Library } from '../types.js';
import { processedPeaks } from './processedPeaks.js';

export interface ProcessOriginalOptions {
  /** The file named in errors. */
  file?: string;
  /** Points the reader clipped at the absorbance ceiling. @default undefined (none) */
  saturated?: Uint8Array;
}

export interface ProcessedOriginal {
  processed: Float64Array;
  peaks: Peak[];
  referenceScale?: number;
  subtracted?: { id: string; scale: number; standardError: number }[];
}

export function processOriginal(
  library: Library,
  original: Spectrum,
  recipe: Recipe,
  options: ProcessOriginalOptions = {},
): ProcessedOriginal {
  const references = new Map<string, Spectrum>();
  for (const step of [recipe.reference, recipe.emsc, ...(recipe.subtract?.references ?? [])]) {
    if (step === null || references.has(step.id)) continue;
    const row = library.db
      .prepare('SELECT original_x, original_y FROM revisions WHERE entry_id = ? AND revision = ?')
      .get(step.id, step.revision ?? -1) as { original_x: Buffer; original_y: Buffer } | undefined;
    if (row === undefined) {
      throw new BandshelfError(
        'NOT_FOUND',
        `the recipe names '${step.id}' revision ${step.revision ?? '(unpinned)'}, which is not stored`,
        { file: options.file, field: 'recipe' },
      );
    }
    references.set(step.id, {
      wavenumber: blobFloat64(row.original_x),
      absorbance: blobFloat64(row.original_y),
    });
  }
  const result = processSpectrum(original, recipe, library.grid, {
    references,
    file: options.file,
    ...(options.saturated === undefined ? {} : { saturated: options.saturated }),
  });
  const out: ProcessedOriginal = {
    processed: result.processed,
    peaks: processedPeaks(result.processed, library.grid),
  };
  if (result.referenceScale !== undefined) out.referenceScale = result.referenceScale;
  if (result.subtracted !== undefined) out.subtracted = result.subtracted;
  return out;
}

// Computes everything a new revision stores (pinned recipe, hashes, processed vector, peaks, QC) without writing;
// the near-duplicate flag, which needs the rest of the library, is the ingest session's (ingestSession's `flag`).
import { BandshelfError } from '../../error.js';
import { cropToWindow } from '../../spectrum/cropToWindow.js';
import { excludeWindows } from '../../spectrum/excludeWindows.js';
import { qcFlags } from '../../spectrum/qcFlags.js';
import { sortAndMerge } from '../../spectrum/sortAndMerge.js';
import { subtractBaseline } from '../../spectrum/subtractBaseline.js';
import { contentHashes } from '../store/contentHashes.js';
import { sha256Hex } from '../store/sha256Hex.js';
import type { Library, RevisionKind } from '../types.js';
import type { PreparedRevision, RevisionInput } from './ingestTypes.js';
import { pinRecipe } from './pinRecipe.js';
import { processOriginal } from './processOriginal.js';

export interface PrepareRevisionOptions {
  /** Store the revision even when QC raises an error-level flag (the flags are stored either way).
   * @default false */
  force?: boolean;
  /** @default 'data' */
  kind?: RevisionKind;
}

export function prepareRevision(
  library: Library,
  input: RevisionInput,
  options: PrepareRevisionOptions = {},
): PreparedRevision {
  const id = input.meta.id;
  const recipe = pinRecipe(library, input.recipe, {
    entryId: id,
    file: input.label,
    ...(typeof input.meta.technique === 'string' ? { technique: input.meta.technique } : {}),
  });
  const files = input.files.map((f) => ({ ...f, sha256: sha256Hex(f.bytes) }));
  const hashes = contentHashes({ files, read: input.read, recipe, meta: input.meta });
  const base = { ...input, id, kind: options.kind ?? 'data', recipe, hashes };
  const { processed, peaks, referenceScale, subtracted } = processOriginal(library, input.original, recipe, {
    file: input.label,
    ...(input.saturated === undefined ? {} : { saturated: input.saturated }),
  });
  // The negative-absorbance check looks at the spectrum after the baseline step, before normalisation.
  const sorted = sortAndMerge(input.original, { file: input.label });
  const baselineCorrected = subtractBaseline(
    excludeWindows(cropToWindow(sorted, recipe.crop), recipe.exclude),
    recipe.baseline,
  );
  const qc = qcFlags(input.original, processed, library.grid, {
    baselineCorrected,
    maxGap: recipe.resample.maxGap,
    exclude: recipe.exclude,
    crop: recipe.crop,
    ...(input.extras.dynamicRangeOrders !== undefined
      ? { dynamicRangeOrders: input.extras.dynamicRangeOrders }
      : {}),
  });
  const errors = qc.filter((f) => f.level === 'error');
  const blocked =
    errors.length > 0 && !options.force
      ? new BandshelfError(
          'QC_FAILED',
          `quality check failed for '${id}': ${errors.map((f) => `${f.code} (${f.message})`).join('; ')}; set \`force\` to store it anyway`,
          { file: input.label },
        )
      : undefined;
  const head = library.db
    .prepare(
      'SELECT revision, kind, content_hash FROM revisions WHERE entry_id = ? ORDER BY revision DESC LIMIT 1',
    )
    .get(id) as { revision: number; kind: string; content_hash: string } | undefined;
  const unchanged = head !== undefined && head.kind !== 'retire' && head.content_hash === hashes.content;
  // Identical content re-added is a no-op even when QC would block it (it was forced the first time).
  if (blocked && !unchanged) throw blocked;
  const extras = {
    ...input.extras,
    ...(referenceScale === undefined ? {} : { referenceScale }),
    ...(subtracted === undefined ? {} : { subtracted }),
  };
  return {
    ...base,
    extras,
    processed,
    peaks,
    qc,
    ...(unchanged ? { unchangedRevision: head.revision } : {}),
    ...(blocked ? { blocked } : {}),
  };
}

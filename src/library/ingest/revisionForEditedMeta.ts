// The revision a metadata edit writes: the stored data with the new metadata, re-pinned and re-processed when the
// edit changes the resolution a recipe's resolution step was pinned with.
import type { EntryMeta } from '../../schema/meta.js';
import { resolutionOf } from '../../spectrum/resolutionOf.js';
import { readOriginals } from '../store/readOriginals.js';
import type { Library } from '../types.js';
import type { PreparedRevision } from './ingestTypes.js';
import { prepareRevision } from './prepareRevision.js';

export interface RevisionForEditedMetaOptions {
  /** The file the new metadata came from, named in errors. @default undefined (the entry id) */
  file?: string;
}

/**
 * `stored` (the head revision) with `meta` in place of its metadata. When the stated resolution changes:
 * - a recipe with a resolution step gets `own` re-pinned from the new value (from the spacing, flagged estimated,
 *   when the edit removes it) and the original is processed again exactly as `add` would (same files, reference
 *   pins, ATR step and time-domain step), so the stored vector, its peaks and its QC notes follow the recipe and
 *   `check` recomputes them; the revision is then a data revision;
 * - any other recipe keeps its vector; only the recorded `extras.resolution` follows the metadata.
 * Otherwise the revision is the stored one with the new metadata (a metadata revision).
 */
export function revisionForEditedMeta(
  library: Library,
  stored: PreparedRevision,
  meta: EntryMeta,
  options: RevisionForEditedMetaOptions = {},
): PreparedRevision {
  const label = options.file ?? stored.id;
  const base: PreparedRevision = { ...stored, label, kind: 'metadata', meta };
  if (stored.meta.resolution === meta.resolution) return base;
  const step = stored.recipe.resolution;
  if (step === undefined || step === null) {
    const resolution = resolutionOf(stored.original, { stated: meta.resolution });
    const { resolution: _old, ...extras } = stored.extras;
    return { ...base, extras: Number.isFinite(resolution.value) ? { ...extras, resolution } : extras };
  }
  const { own: _own, estimated: _estimated, ...unpinned } = step;
  // An older revision without an ATR key was not corrected: keep it so (pinRecipe would read 'absent' as 'auto').
  const atr = stored.recipe.atr === undefined && meta.technique === 'atr' ? null : stored.recipe.atr;
  const { atr: _atr, ...rest } = stored.recipe;
  const recipe = { ...rest, ...(atr === undefined ? {} : { atr }), resolution: unpinned };
  const [again] = readOriginals({ files: stored.files, read: stored.read, recipe: stored.recipe }, { label });
  const { resolution: _r, referenceScale: _s, subtracted: _t, ...extras } = stored.extras;
  return prepareRevision(
    library,
    {
      label,
      files: stored.files,
      read: stored.read,
      original: stored.original,
      meta,
      recipe,
      extras,
      ...(again?.saturated === undefined ? {} : { saturated: again.saturated }),
    },
    { force: true, kind: 'data' },
  );
}

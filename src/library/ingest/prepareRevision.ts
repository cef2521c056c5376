// Computes everything a new revision stores (pinned recipe, hashes, processed vector, peaks, QC) without writing;
// the near-duplicate flag, which needs the rest of the library, is the ingest session's (ingestSession's `flag`).
import { BandshelfError } from '../../error.js';
import { likelyXUnit } from '../../formats/likelyXUnit.js';
import type { XUnit } from '../../formats/types.js';
import { cropToWindow } from '../../spectrum/cropToWindow.js';
import { excludeWindows } from '../../spectrum/excludeWindows.js';
import { gridAxis } from '../../spectrum/gridAxis.js';
import { qcFlags } from '../../spectrum/qcFlags.js';
import { resolutionOf } from '../../spectrum/resolutionOf.js';
import { sortAndMerge } from '../../spectrum/sortAndMerge.js';
import { subtractBaseline } from '../../spectrum/subtractBaseline.js';
import type { QcFlag } from '../../spectrum/types.js';
import { contentHashes } from '../store/contentHashes.js';
import { headRevision } from '../store/headRevision.js';
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

/** Refuses a processed vector the Float32 blob cannot hold: a value that would become ±Infinity. (Values that
 * round to zero or a subnormal are stored so, and `check` compares after the same rounding.) */
function refuseUnstorable(processed: Float64Array, library: Library, file: string | undefined): void {
  for (let i = 0; i < processed.length; i++) {
    const v = processed[i]!;
    if (Number.isNaN(v)) continue;
    if (!Number.isFinite(Math.fround(v))) {
      const axis = gridAxis(library.grid);
      throw new BandshelfError(
        'NOT_FINITE',
        `the processed value at ${axis[i]} cm⁻¹ is ${v}, beyond what a stored spectrum can hold (±3.4e38); check the file's scaling`,
        { file, field: 'processed' },
      );
    }
  }
}

export function prepareRevision(
  library: Library,
  input: RevisionInput,
  options: PrepareRevisionOptions = {},
): PreparedRevision {
  const id = input.meta.id;
  // Recorded with every revision (stated in the metadata or the file's labels, else estimated from the spacing).
  const resolution = resolutionOf(input.original, { stated: input.meta.resolution });
  const recipe = pinRecipe(library, input.recipe, {
    entryId: id,
    file: input.label,
    resolution,
    ...(typeof input.meta.technique === 'string' ? { technique: input.meta.technique } : {}),
  });
  const files = input.files.map((f) => ({ ...f, sha256: sha256Hex(f.bytes) }));
  const hashes = contentHashes({ files, read: input.read, recipe, meta: input.meta });
  const base = { ...input, id, kind: options.kind ?? 'data', recipe, hashes };
  const { processed, peaks, referenceScale, subtracted } = processOriginal(library, input.original, recipe, {
    file: input.label,
    ...(input.saturated === undefined ? {} : { saturated: input.saturated }),
  });
  refuseUnstorable(processed, library, input.label);
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
    ...(recipe.resolution?.own === undefined
      ? {}
      : {
          resolution: {
            value: recipe.resolution.own,
            estimated: recipe.resolution.estimated === true,
            target: recipe.resolution.target,
          },
        }),
  });
  const errors = qc.filter((f) => f.level === 'error');
  const blocked =
    errors.length > 0 && !options.force
      ? new BandshelfError(
          'QC_FAILED',
          `quality check failed for '${id}': ${qcAdvice(library, input, errors)}`,
          {
            file: input.label,
          },
        )
      : undefined;
  const head = headRevision(library, id);
  const unchanged = head !== undefined && head.kind !== 'retire' && head.content_hash === hashes.content;
  // Identical content re-added is a no-op even when QC would block it (it was forced the first time).
  if (blocked && !unchanged) throw blocked;
  const extras = {
    ...input.extras,
    ...(Number.isFinite(resolution.value) ? { resolution } : {}),
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

const UNIT_NAMES: Record<XUnit, string> = { 'cm-1': 'cm⁻¹', um: 'µm', nm: 'nm', thz: 'THz' };

function shortNumber(v: number): string {
  return String(Number(v.toPrecision(4)));
}

/**
 * When the file does reach the grid (and the recipe's crop window) but every point there is saturated or too
 * sparse between saturated ones to cover a grid cell: the range and the count, not unit advice or `force`.
 */
function nothingUsable(input: RevisionInput, span: { min: number; max: number }): string | null {
  const saturated = input.saturated;
  if (saturated === undefined) return null;
  const crop = input.recipe.crop;
  const lo = crop === null ? span.min : Math.max(span.min, Math.min(crop.min, crop.max));
  const hi = crop === null ? span.max : Math.min(span.max, Math.max(crop.min, crop.max));
  const w = input.original.wavenumber;
  let inside = 0;
  let clipped = 0;
  for (let i = 0; i < w.length; i++) {
    if (w[i]! < lo || w[i]! > hi) continue;
    inside++;
    if (saturated[i] === 1) clipped++;
  }
  if (inside === 0 || clipped === 0) return null;
  return (
    `nothing usable is left inside the recipe's range ${shortNumber(hi)}–${shortNumber(lo)} cm⁻¹: ${clipped} of its ` +
    `${inside} points there are saturated (at or beyond the absorbance ceiling)` +
    `${clipped < inside ? ' and the rest cover no grid cell' : ''}; ` +
    'measure a thinner sample or a shorter path'
  );
}

/**
 * The blocking flags and what to do. A spectrum that covers none of the grid is stored in vain even with `force`:
 * the advice names the file's x range and the grid, and the unit its values more likely are in.
 */
function qcAdvice(library: Library, input: RevisionInput, errors: readonly QcFlag[]): string {
  const flags = errors.map((f) => `${f.code} (${f.message})`).join('; ');
  const missesGrid = errors.some((f) => f.code === 'narrow-coverage' && f.value === 0);
  if (!missesGrid) return `${flags}; set \`force\` to store it anyway`;
  const used = input.extras.source?.xUnit as XUnit | undefined;
  const w = input.original.wavenumber;
  if (used === undefined || w.length === 0) return `${flags}; check the data's x axis and the library grid`;
  const { start, stop } = library.grid;
  const span = { min: Math.min(start, stop), max: Math.max(start, stop) };
  const saturation = nothingUsable(input, span);
  if (saturation !== null) return saturation;
  const guess = likelyXUnit({ min: w[0]!, max: w[w.length - 1]! }, { used, span });
  const values = `${shortNumber(guess.values.min)}–${shortNumber(guess.values.max)}`;
  const grid = `${shortNumber(span.min)}–${shortNumber(span.max)} cm⁻¹`;
  const where = `its x values run ${values} (read as ${UNIT_NAMES[used]}) and cover none of the library grid ${grid}`;
  const hint =
    guess.unit === null
      ? "check the file's x unit (`xUnit`) and the library grid"
      : `values ${values} look like ${UNIT_NAMES[guess.unit]}: try \`xUnit\` ${guess.unit}`;
  return `${where}; ${hint}`;
}

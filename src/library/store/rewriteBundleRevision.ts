// A bundle revision moved under another entry id and/or with its recipe's references moved to renamed entries
// (an imported history that diverged is kept under a suffixed id): metadata id, recipe, content and record hash
// are made again so `check` verifies it like any other revision.
import type { BundleRevision } from '../../schema/bundle.js';
import type { FileRole, ReadOptions } from '../types.js';
import { canonicalJson } from './canonicalJson.js';
import { contentHashes } from './contentHashes.js';
import { recordHash } from './recordHash.js';
import { revisionRowFromBundle } from './revisionRowFromBundle.js';

/** A renamed entry: references to its revisions after `after` (those the library's own history does not share)
 * now point to `to`. */
export interface RenamedEntry {
  to: string;
  after: number;
}

export interface RewriteBundleRevisionInput {
  revision: BundleRevision;
  /** The id the bundle stores the entry under. */
  from: string;
  /** The id it is imported under. */
  to: string;
  /** Renamed entries by their bundle id. */
  renamed: ReadonlyMap<string, RenamedEntry>;
}

type Reference = { id: string; revision?: number };

function moved(ref: Reference, renamed: ReadonlyMap<string, RenamedEntry>): Reference {
  const r = renamed.get(ref.id);
  if (r === undefined || (ref.revision !== undefined && ref.revision <= r.after)) return ref;
  return { ...ref, id: r.to };
}

/** The stored recipe with every reference (reference subtraction, EMSC, multi-reference subtraction) moved. */
function movedRecipe(recipe: Record<string, unknown>, renamed: ReadonlyMap<string, RenamedEntry>) {
  const out: Record<string, unknown> = { ...recipe };
  for (const key of ['reference', 'emsc'] as const) {
    const step = recipe[key] as Reference | null | undefined;
    if (step !== null && step !== undefined) out[key] = moved(step, renamed);
  }
  const subtract = recipe.subtract as { references: Reference[] } | undefined;
  if (subtract !== undefined) {
    out.subtract = { ...subtract, references: subtract.references.map((r) => moved(r, renamed)) };
  }
  return out;
}

export function rewriteBundleRevision(input: RewriteBundleRevisionInput): BundleRevision {
  const { revision, renamed } = input;
  const meta = { ...(JSON.parse(revision.meta) as Record<string, unknown>), id: input.to };
  const recipe = movedRecipe(JSON.parse(revision.recipe) as Record<string, unknown>, renamed);
  const metaText = canonicalJson(meta);
  const recipeText = canonicalJson(recipe);
  if (metaText === revision.meta && recipeText === revision.recipe && input.from === input.to)
    return revision;
  const hashes = contentHashes({
    files: revision.files.map((f) => ({ role: f.role as FileRole, sha256: f.sha256 })),
    read: JSON.parse(revision.readOptions) as ReadOptions,
    recipe,
    meta,
  });
  const next: BundleRevision = {
    ...revision,
    meta: metaText,
    recipe: recipeText,
    contentHash: hashes.content,
    dataHash: hashes.data,
  };
  const { row, files } = revisionRowFromBundle({ revision: next, entryId: input.to });
  return { ...next, recordHash: recordHash(row, files) };
}

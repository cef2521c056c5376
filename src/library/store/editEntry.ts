// Makes a metadata revision: same files, recipe and processed data, new metadata (and so a new content hash); a
// changed resolution under a resolution step re-pins the step and re-processes (a data revision).
import { BandshelfError } from '../../error.js';
import { entryMetaSchema } from '../../schema/meta.js';
import { metaErrorFromIssues } from '../../schema/metaErrorFromIssues.js';
import type { CommitOutcome } from '../ingest/ingestTypes.js';
import { revisionForEditedMeta } from '../ingest/revisionForEditedMeta.js';
import type { Library } from '../types.js';
import { commitRevisions } from './commitRevisions.js';
import { contentHashes } from './contentHashes.js';
import { headRevision } from './headRevision.js';
import { revisionFromRow } from './revisionFromRow.js';
import { sha256Hex } from './sha256Hex.js';

export interface EditEntryOptions {
  /** Fields to set; a value of `undefined` removes an optional field. */
  set?: Record<string, unknown>;
  /** A whole new metadata object replacing the old one (applied before `set`). */
  replace?: Record<string, unknown>;
  /** The file the new metadata came from, named in errors. */
  file?: string;
  author?: string;
  /** @default 'metadata edit' */
  message?: string;
  now?: Date;
}

export function editEntry(library: Library, id: string, options: EditEntryOptions = {}): CommitOutcome {
  const head = headRevision(library, id);
  if (head === undefined)
    throw new BandshelfError('NOT_FOUND', `no entry '${id}' in the library`, { field: 'id' });
  if (head.kind === 'retire') {
    throw new BandshelfError('NOT_FOUND', `entry '${id}' is retired; add its data again to bring it back`, {
      field: 'id',
    });
  }
  const old = JSON.parse(head.meta) as Record<string, unknown>;
  const merged: Record<string, unknown> = { ...(options.replace ?? old) };
  for (const [key, value] of Object.entries(options.set ?? {})) {
    if (value === undefined) delete merged[key];
    else merged[key] = value;
  }
  if (merged.id === undefined) merged.id = id;
  if (merged.id !== id) {
    throw new BandshelfError('BAD_METADATA', `the id cannot be changed by an edit (it is '${id}')`, {
      file: options.file,
      field: 'id',
    });
  }
  const parsed = entryMetaSchema.safeParse(merged);
  if (!parsed.success) throw metaErrorFromIssues(parsed.error.issues, { file: options.file });
  const stored = revisionFromRow(library, head);
  const meta = parsed.data as typeof stored.meta;
  // A changed resolution re-pins the recipe's resolution step (and re-processes), so recipe and metadata agree.
  const revision = revisionForEditedMeta(
    library,
    stored,
    meta,
    options.file === undefined ? {} : { file: options.file },
  );
  const hashes =
    revision.kind === 'data'
      ? revision.hashes
      : contentHashes({
          files: stored.files.map((f) => ({ role: f.role, sha256: sha256Hex(f.bytes) })),
          read: stored.read,
          recipe: stored.recipe,
          meta,
        });
  const [outcome] = commitRevisions(library, [{ ...revision, hashes }], {
    author: options.author,
    message: options.message ?? 'metadata edit',
    now: options.now,
  });
  return outcome!;
}

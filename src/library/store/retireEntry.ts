// Takes an entry out of the current state with a retire revision; its history and releases keep every revision.
import { BandshelfError } from '../../error.js';
import type { CommitOutcome } from '../ingest/ingestTypes.js';
import type { Library } from '../types.js';
import { commitRevisions } from './commitRevisions.js';
import { headRevision } from './headRevision.js';
import { revisionFromRow } from './revisionFromRow.js';

export interface RetireEntryOptions {
  /** Why the entry leaves the library (required by the CLI; stored as the revision message). */
  reason?: string;
  author?: string;
  now?: Date;
}

export function retireEntry(library: Library, id: string, options: RetireEntryOptions = {}): CommitOutcome {
  const head = headRevision(library, id);
  if (head === undefined)
    throw new BandshelfError('NOT_FOUND', `no entry '${id}' in the library`, { field: 'id' });
  const [outcome] = commitRevisions(library, [{ ...revisionFromRow(library, head), kind: 'retire' }], {
    author: options.author,
    message: options.reason ?? 'retired',
    now: options.now,
  });
  return outcome!;
}

// Records a review decision on an entry's newest revision, as a row of its own (revisions never change).
import { BandshelfError } from '../../error.js';
import type { Library, ReviewRecord } from '../types.js';
import { headRevision } from './headRevision.js';
import { writeTransaction } from './writeTransaction.js';

export interface ReviewRevisionOptions {
  /** @default 'reviewed' */
  state?: ReviewRecord['state'];
  /** Who reviews; must differ from the revision's author ("reviewed by a second person") unless forced. */
  reviewer?: string;
  /** @default '' */
  note?: string;
  /** Allow the revision's own author to review it (a one-person lab).
   * @default false */
  force?: boolean;
  now?: Date;
}

export interface ReviewOutcome extends ReviewRecord {
  id: string;
  revision: number;
}

export function reviewRevision(
  library: Library,
  id: string,
  options: ReviewRevisionOptions = {},
): ReviewOutcome {
  const state = options.state ?? 'reviewed';
  const reviewer = (options.reviewer ?? '').trim();
  if (reviewer === '') {
    throw new BandshelfError('BAD_OPTION', 'a review needs a reviewer name', { field: 'reviewer' });
  }
  return writeTransaction(
    library,
    (): ReviewOutcome => {
      const head = headRevision(library, id);
      if (head === undefined)
        throw new BandshelfError('NOT_FOUND', `no entry '${id}' in the library`, { field: 'id' });
      if (head.kind === 'retire') {
        throw new BandshelfError('NOT_FOUND', `entry '${id}' is retired; there is nothing to review`, {
          field: 'id',
        });
      }
      if (reviewer === head.author && !options.force) {
        throw new BandshelfError(
          'BAD_OPTION',
          `'${reviewer}' made revision ${head.revision} of '${id}'; a second person must review it (or add --force)`,
          { field: 'reviewer' },
        );
      }
      const createdAt = (options.now ?? new Date()).toISOString();
      const note = options.note ?? '';
      library.db
        .prepare(
          'INSERT INTO reviews (revision_key, state, reviewer, note, created_at) VALUES (?, ?, ?, ?, ?)',
        )
        .run(head.key, state, reviewer, note, createdAt);
      return { id, revision: head.revision, state, reviewer, note, createdAt };
    },
    { what: 'the review' },
  );
}

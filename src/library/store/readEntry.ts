// Reads one entry as stored: its newest revision, a given revision, or the revision a release froze.
import { BandshelfError } from '../../error.js';
import type { EntryView, Library } from '../types.js';
import { entryViewFromRow } from './entryViewFromRow.js';
import { headRevision } from './headRevision.js';
import type { RevisionRow } from './rowTypes.js';

export interface ReadEntryOptions {
  /** A release tag: the revision that release holds. Undefined or 'current': the newest revision.
   * @default undefined */
  at?: string | null;
  /** A revision number (ignored when `at` names a release).
   * @default undefined (the newest) */
  revision?: number;
}

export function readEntry(library: Library, id: string, options: ReadEntryOptions = {}): EntryView {
  const db = library.db;
  const newest = headRevision(library, id);
  if (newest === undefined) {
    throw new BandshelfError('NOT_FOUND', `no entry '${id}' in the library`, { field: 'id' });
  }
  const head = newest.revision;
  const retired = newest.kind === 'retire';
  let row: RevisionRow | undefined;
  const at = options.at;
  if (at !== undefined && at !== null && at !== '' && at !== 'current') {
    if (db.prepare('SELECT 1 FROM releases WHERE tag = ?').get(at) === undefined) {
      throw new BandshelfError('UNKNOWN_RELEASE', `no release is tagged '${at}'`, { field: 'at' });
    }
    row = db
      .prepare(
        'SELECT r.* FROM release_members m JOIN revisions r ON r.key = m.revision_key WHERE m.tag = ? AND m.entry_id = ?',
      )
      .get(at, id) as RevisionRow | undefined;
    if (row === undefined) {
      throw new BandshelfError('NOT_FOUND', `entry '${id}' is not in release '${at}'`, { field: 'id' });
    }
  } else {
    const revision = options.revision ?? head;
    row =
      revision === head
        ? newest
        : (db.prepare('SELECT * FROM revisions WHERE entry_id = ? AND revision = ?').get(id, revision) as
            | RevisionRow
            | undefined);
    if (row === undefined) {
      throw new BandshelfError('NOT_FOUND', `entry '${id}' has no revision ${revision} (newest is ${head})`, {
        field: 'revision',
      });
    }
  }
  return entryViewFromRow(library, row, { retired });
}

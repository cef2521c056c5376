// Builds the SELECT that yields one revision row per entry of a library state: the current working state (newest
// revision of every entry that is not retired) or the frozen members of a release.
import { BandshelfError } from '../../error.js';
import type { Library } from '../types.js';

export interface StateSelectOptions {
  /** A release tag; undefined, null or 'current' mean the working state.
   * @default undefined */
  at?: string | null;
}

export interface StateSelect {
  /** SQL whose rows come from `revisions r` (alias `r`), ordered by entry id. */
  sql: string;
  params: unknown[];
  /** The release tag, or null for the working state. */
  at: string | null;
}

/** True when `at` names the working state rather than a release. */
function isCurrent(at: string | null | undefined): boolean {
  return at === undefined || at === null || at === '' || at === 'current';
}

export function stateSelect(
  library: Library,
  columns: string,
  options: StateSelectOptions = {},
): StateSelect {
  if (isCurrent(options.at)) {
    // Driven by the entries table in id order, each newest revision found through the (entry_id, revision) index:
    // rows stream out already sorted, with no temporary B-tree holding their blobs.
    return {
      sql: `SELECT ${columns} FROM entries e JOIN revisions r ON r.entry_id = e.id
        AND r.revision = (SELECT MAX(r2.revision) FROM revisions r2 WHERE r2.entry_id = e.id)
        WHERE r.kind != 'retire' ORDER BY e.id`,
      params: [],
      at: null,
    };
  }
  const tag = options.at as string;
  const known = library.db.prepare('SELECT 1 FROM releases WHERE tag = ?').get(tag);
  if (known === undefined) {
    throw new BandshelfError('UNKNOWN_RELEASE', `no release is tagged '${tag}'`, { field: 'at' });
  }
  return {
    sql: `SELECT ${columns} FROM release_members m JOIN revisions r ON r.key = m.revision_key
      WHERE m.tag = ? ORDER BY m.entry_id`,
    params: [tag],
    at: tag,
  };
}

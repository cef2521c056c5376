// One release with the exact revision of every entry it froze.
import { BandshelfError } from '../../error.js';
import type { Library, Release } from '../types.js';

export function readRelease(library: Library, tag: string): Release {
  const head = library.db
    .prepare('SELECT tag, created_at, message, reviewed_only FROM releases WHERE tag = ?')
    .get(tag) as { tag: string; created_at: string; message: string; reviewed_only: number } | undefined;
  if (head === undefined)
    throw new BandshelfError('UNKNOWN_RELEASE', `no release is tagged '${tag}'`, { field: 'tag' });
  const members = library.db
    .prepare(
      `SELECT m.entry_id AS id, r.revision, r.content_hash AS hash FROM release_members m
       JOIN revisions r ON r.key = m.revision_key WHERE m.tag = ? ORDER BY m.entry_id`,
    )
    .all(tag) as { id: string; revision: number; hash: string }[];
  return {
    tag: head.tag,
    createdAt: head.created_at,
    message: head.message,
    reviewedOnly: head.reviewed_only === 1,
    entries: members.length,
    members,
  };
}

// Every revision of one entry, oldest first, with what each changed and its review state and releases.
import { BandshelfError } from '../../error.js';
import type { ChangeKind, Library, ReviewState, RevisionKind, RevisionSummary } from '../types.js';

export function entryHistory(library: Library, id: string): RevisionSummary[] {
  const rows = library.db
    .prepare(
      `SELECT r.revision, r.kind, r.content_hash, r.data_hash, r.recipe, r.meta, r.author, r.message, r.created_at,
        (SELECT v.state FROM reviews v WHERE v.revision_key = r.key ORDER BY v.key DESC LIMIT 1) AS review_state,
        (SELECT v.reviewer FROM reviews v WHERE v.revision_key = r.key ORDER BY v.key DESC LIMIT 1) AS reviewer,
        (SELECT group_concat(m.tag, char(10)) FROM
          (SELECT tag FROM release_members WHERE revision_key = r.key ORDER BY tag) m) AS releases
       FROM revisions r WHERE r.entry_id = ? ORDER BY r.revision`,
    )
    .all(id) as {
    revision: number;
    kind: RevisionKind;
    content_hash: string;
    data_hash: string;
    recipe: string;
    meta: string;
    author: string;
    message: string;
    created_at: string;
    review_state: ReviewState | null;
    reviewer: string | null;
    releases: string | null;
  }[];
  if (rows.length === 0)
    throw new BandshelfError('NOT_FOUND', `no entry '${id}' in the library`, { field: 'id' });
  return rows.map((r, i) => {
    const previous = rows[i - 1];
    const changed: ChangeKind[] = [];
    if (previous !== undefined && r.kind !== 'retire') {
      if (previous.data_hash !== r.data_hash) changed.push('data');
      if (previous.recipe !== r.recipe) changed.push('recipe');
      if (previous.meta !== r.meta) changed.push('metadata');
    }
    return {
      revision: r.revision,
      kind: r.kind,
      hash: r.content_hash,
      author: r.author,
      message: r.message,
      createdAt: r.created_at,
      reviewState: r.review_state ?? 'draft',
      reviewer: r.reviewer,
      changed,
      releases: r.releases === null ? [] : r.releases.split('\n'),
    };
  });
}

// Every release of the library, oldest first, with its size.
import type { Library, ReleaseSummary } from '../types.js';

export function listReleases(library: Library): ReleaseSummary[] {
  const rows = library.db
    .prepare(
      `SELECT s.tag, s.created_at, s.message, s.reviewed_only,
        (SELECT count(*) FROM release_members m WHERE m.tag = s.tag) AS entries
       FROM releases s ORDER BY s.created_at, s.tag`,
    )
    .all() as { tag: string; created_at: string; message: string; reviewed_only: number; entries: number }[];
  return rows.map((r) => ({
    tag: r.tag,
    createdAt: r.created_at,
    message: r.message,
    reviewedOnly: r.reviewed_only === 1,
    entries: r.entries,
  }));
}

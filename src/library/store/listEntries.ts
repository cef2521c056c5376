// Lists the entries of a library state with their metadata and a few figures, without loading any vectors.

import { PEAK_BYTES } from '../codecs/peaksBlob.js';
import type { EntrySummary, Library, ReviewState, RevisionKind } from '../types.js';
import { stateSelect } from './stateSelect.js';

export interface ListEntriesOptions {
  /** A release tag, or undefined / 'current' for the working state.
   * @default undefined */
  at?: string | null;
}

export function listEntries(library: Library, options: ListEntriesOptions = {}): EntrySummary[] {
  const select = stateSelect(
    library,
    `r.entry_id AS id, r.revision, r.kind, r.content_hash AS hash, r.meta, r.created_at,
     (SELECT e.created_at FROM entries e WHERE e.id = r.entry_id) AS first_created_at,
     r.covered_points, r.coverage_min, r.coverage_max, length(r.peaks) / ${PEAK_BYTES} AS peak_count,
     (SELECT count(*) FROM json_each(r.qc) q WHERE q.value ->> '$.level' = 'warning') AS qc_warnings,
     (SELECT v.state FROM reviews v WHERE v.revision_key = r.key ORDER BY v.key DESC LIMIT 1) AS review_state`,
    options,
  );
  const rows = library.db.prepare(select.sql).all(...select.params) as {
    id: string;
    revision: number;
    kind: RevisionKind;
    hash: string;
    meta: string;
    created_at: string;
    first_created_at: string;
    covered_points: number;
    coverage_min: number | null;
    coverage_max: number | null;
    peak_count: number;
    qc_warnings: number;
    review_state: ReviewState | null;
  }[];
  return rows.map((r) => {
    const meta = JSON.parse(r.meta) as Record<string, unknown>;
    return {
      id: r.id,
      revision: r.revision,
      name: typeof meta.name === 'string' ? meta.name : r.id,
      class: typeof meta.class === 'string' ? meta.class : 'other',
      kind: r.kind,
      hash: r.hash,
      reviewState: r.review_state ?? 'draft',
      createdAt: r.created_at,
      firstCreatedAt: r.first_created_at,
      meta,
      coverage:
        r.covered_points > 0 && r.coverage_min !== null && r.coverage_max !== null
          ? { min: r.coverage_min, max: r.coverage_max, points: r.covered_points }
          : null,
      peakCount: r.peak_count,
      qcWarnings: r.qc_warnings,
    };
  });
}

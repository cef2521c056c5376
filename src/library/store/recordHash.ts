// A digest over every stored column of a revision and its file list, so `check` finds any byte changed behind
// bandshelf's back (the content hash covers only what defines the content, not the derived vectors).
import { canonicalJson } from './canonicalJson.js';
import type { RevisionFileRow, RevisionRow } from './rowTypes.js';
import { sha256Hex } from './sha256Hex.js';

export function recordHash(
  row: Omit<RevisionRow, 'key' | 'record_hash'>,
  files: readonly Pick<RevisionFileRow, 'position' | 'role' | 'name' | 'sha256'>[],
): string {
  return sha256Hex(
    canonicalJson({
      v: 1,
      entry: row.entry_id,
      revision: row.revision,
      kind: row.kind,
      content: row.content_hash,
      data: row.data_hash,
      read: row.read_options,
      recipe: row.recipe,
      meta: row.meta,
      x: sha256Hex(row.original_x),
      y: sha256Hex(row.original_y),
      processed: sha256Hex(row.processed),
      covered: [row.covered_points, row.coverage_min, row.coverage_max],
      peaks: sha256Hex(row.peaks),
      qc: row.qc,
      extras: row.extras,
      author: row.author,
      message: row.message,
      created: row.created_at,
      files: files.map((f) => [f.position, f.role, f.name, f.sha256]),
    }),
  );
}

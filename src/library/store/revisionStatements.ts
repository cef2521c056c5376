// The store's insert statements for one revision (entry row, file bytes, revision row, its file list), written once.
import type { Library } from '../types.js';

/** Prepared on the library's connection; `entry` and `file` insert only when the row is not there yet. */
export function revisionStatements(library: Library) {
  const db = library.db;
  return {
    entry: db.prepare(
      'INSERT INTO entries (id, created_at) SELECT ?, ? WHERE NOT EXISTS (SELECT 1 FROM entries WHERE id = ?)',
    ),
    file: db.prepare(
      'INSERT INTO files (sha256, bytes) SELECT ?, ? WHERE NOT EXISTS (SELECT 1 FROM files WHERE sha256 = ?)',
    ),
    revision: db.prepare(`INSERT INTO revisions (entry_id, revision, kind, content_hash, data_hash,
    read_options, recipe, meta, original_x, original_y, processed, covered_points, coverage_min, coverage_max,
    peaks, qc, extras, author, message, created_at, record_hash)
    VALUES (@entry_id, @revision, @kind, @content_hash, @data_hash, @read_options, @recipe, @meta, @original_x,
    @original_y, @processed, @covered_points, @coverage_min, @coverage_max, @peaks, @qc, @extras, @author,
    @message, @created_at, @record_hash)`),
    revisionFile: db.prepare(
      'INSERT INTO revision_files (revision_key, position, role, name, sha256) VALUES (?, ?, ?, ?, ?)',
    ),
  };
}

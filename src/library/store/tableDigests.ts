// Digests every table of record whole: how seals were made before running chains (sealChains); `check` still
// verifies such a seal, and the list of tables of record lives here.
import type Database from 'better-sqlite3';
import { sha256Hex } from './sha256Hex.js';

/** Every table whose rows are the library's record (all append-only). */
export const TABLES_OF_RECORD = [
  'settings',
  'entries',
  'revisions',
  'files',
  'revision_files',
  'reviews',
  'releases',
  'release_members',
  'band_assignments',
] as const;

/**
 * SHA-256 per table over its rows in rowid order. Blobs are left out where a hash column stands for them
 * (`files.sha256`, `revisions.record_hash`), which `check` verifies separately: a write then costs a pass over
 * small columns, not over every stored byte.
 */
export function tableDigests(db: Database.Database): Record<string, string> {
  const out: Record<string, string> = {};
  for (const table of TABLES_OF_RECORD) {
    const columns = (db.prepare(`PRAGMA table_info(${table})`).all() as { name: string; type: string }[])
      .filter((c) => c.type !== 'BLOB')
      .map((c) => `quote(${c.name})`);
    const rows = db
      .prepare(`SELECT ${columns.join(" || ',' || ")} FROM ${table} ORDER BY rowid`)
      .pluck()
      .all() as string[];
    out[table] = sha256Hex(Buffer.from(rows.join('\n'), 'utf8'));
  }
  return out;
}

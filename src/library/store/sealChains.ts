// A running digest per table of record, so a write seals the library in time proportional to the rows it added,
// not to the library: each row is folded into its table's chain in rowid order.
import { createHash } from 'node:crypto';
import type Database from 'better-sqlite3';
import { TABLES_OF_RECORD } from './tableDigests.js';

/** Where a table's chain stands: the last rowid folded in, how many rows, and the digest so far. */
export interface SealChain {
  last: number;
  rows: number;
  digest: string;
}

export type SealChains = Record<string, SealChain>;

export interface SealChainsOptions {
  /** The chains of the previous seal: only rows after each one's `last` rowid are read. Without it every row is
   * read (what `check` does, so a row changed anywhere in history shows).
   * @default undefined */
  from?: SealChains;
}

/** The digest a table's chain starts from, before its first row. */
function origin(table: string): string {
  return createHash('sha256').update(`bandshelf seal chain v1 ${table}\n`).digest('hex');
}

/**
 * digest_k = SHA-256(digest_(k−1) ‖ '\n' ‖ row_k), row_k being the rowid and every non-blob column, quoted as
 * SQL literals. Tables of record are append-only and rowids only grow, so folding new rows onto the last seal's
 * chain gives exactly what a pass over all rows gives. Blobs are left out where a hash column stands for them
 * (`files.sha256`, `revisions.record_hash`), which `check` verifies separately.
 */
export function sealChains(db: Database.Database, options: SealChainsOptions = {}): SealChains {
  const out: SealChains = {};
  for (const table of TABLES_OF_RECORD) {
    const columns = (db.prepare(`PRAGMA table_info(${table})`).all() as { name: string; type: string }[])
      .filter((c) => c.type !== 'BLOB')
      .map((c) => `quote(${c.name})`);
    const start = options.from?.[table] ?? { last: 0, rows: 0, digest: origin(table) };
    let { last, rows, digest } = start;
    const statement = db
      .prepare(
        `SELECT rowid, rowid || ',' || ${columns.join(" || ',' || ")} FROM ${table} WHERE rowid > ? ORDER BY rowid`,
      )
      .raw(true);
    for (const [rowid, text] of statement.iterate(last) as Iterable<[number, string]>) {
      digest = createHash('sha256').update(`${digest}\n`).update(text, 'utf8').digest('hex');
      last = rowid;
      rows++;
    }
    out[table] = { last, rows, digest };
  }
  return out;
}

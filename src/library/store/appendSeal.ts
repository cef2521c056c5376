// Appends a seal (the digest of every table of record) at the end of a write, inside its transaction.
import type Database from 'better-sqlite3';
import { tableDigests } from './tableDigests.js';

export interface AppendSealOptions {
  /** Seal time (tests pin it).
   * @default new Date() */
  now?: Date;
}

export function appendSeal(db: Database.Database, options: AppendSealOptions = {}): void {
  db.prepare('INSERT INTO seals (digests, created_at) VALUES (?, ?)').run(
    JSON.stringify(tableDigests(db)),
    (options.now ?? new Date()).toISOString(),
  );
}

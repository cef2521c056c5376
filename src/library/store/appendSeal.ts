// Appends a seal (a running digest of every table of record) at the end of a write, inside its transaction.
import type Database from 'better-sqlite3';
import { type SealChains, sealChains } from './sealChains.js';

export interface AppendSealOptions {
  /** Seal time (tests pin it).
   * @default new Date() */
  now?: Date;
}

/** The previous seal's chains; a seal from before chains (whole-table digests) starts them afresh. */
function lastChains(db: Database.Database): SealChains | undefined {
  const digests = db.prepare('SELECT digests FROM seals ORDER BY key DESC LIMIT 1').pluck().get() as
    | string
    | undefined;
  if (digests === undefined) return undefined;
  const parsed = JSON.parse(digests) as { chains?: SealChains };
  return parsed.chains;
}

export function appendSeal(db: Database.Database, options: AppendSealOptions = {}): void {
  const from = lastChains(db);
  const chains = sealChains(db, from === undefined ? {} : { from });
  db.prepare('INSERT INTO seals (digests, created_at) VALUES (?, ?)').run(
    JSON.stringify({ chains }),
    (options.now ?? new Date()).toISOString(),
  );
}

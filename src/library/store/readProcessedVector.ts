// Reads one revision's processed vector (Float32 on the grid) by entry id and revision, and nothing else of its row.
import type Database from 'better-sqlite3';
import { gridLength } from '../../spectrum/gridLength.js';
import type { Library } from '../types.js';

export interface ReadProcessedVectorOptions {
  /** Grid points the vector should hold; a stored blob of another length reads as all NaN (it matches nothing).
   * @default gridLength(library.grid) */
  cols?: number;
}

/** One prepared statement per connection: a no-cache search reads every row through here. */
const statements = new WeakMap<Database.Database, Database.Statement>();

/**
 * Revisions are immutable, so (id, revision) names the same bytes whatever another process writes meanwhile. An
 * unknown revision reads as all NaN too: the caller got the pair from a state read of the same file.
 */
export function readProcessedVector(
  library: Library,
  key: { id: string; revision: number },
  options: ReadProcessedVectorOptions = {},
): Float32Array {
  const cols = options.cols ?? gridLength(library.grid);
  let statement = statements.get(library.db);
  if (statement === undefined) {
    statement = library.db
      .prepare('SELECT processed FROM revisions WHERE entry_id = ? AND revision = ?')
      .pluck(true);
    statements.set(library.db, statement);
  }
  const blob = statement.get(key.id, key.revision) as Buffer | undefined;
  const out = new Float32Array(cols);
  if (blob?.byteLength === cols * 4) new Uint8Array(out.buffer).set(blob);
  else out.fill(Number.NaN);
  return out;
}

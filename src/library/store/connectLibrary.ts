// Opens the SQLite handle of a library file with the pragmas every bandshelf connection needs.
import Database from 'better-sqlite3';
import { BandshelfError } from '../../error.js';

export interface ConnectLibraryOptions {
  /** Open read-only (reading commands); writers get WAL, full fsync and foreign keys.
   * @default false */
  readonly?: boolean;
  /** Create the file when it does not exist (only `initLibrary` does).
   * @default false */
  create?: boolean;
  /** How long a writer waits for another process's write lock, ms.
   * @default 10000 */
  busyTimeoutMs?: number;
  /** Page size of a new file, bytes: processed vectors are ~7 kB, so larger pages mean fewer overflow pages.
   * @default 16384 */
  pageSize?: number;
  /** Memory-mapped I/O window, bytes (reading a search set then copies far less).
   * @default 1073741824 */
  mmapBytes?: number;
}

export function connectLibrary(path: string, options: ConnectLibraryOptions = {}): Database.Database {
  const readonly = options.readonly ?? false;
  let db: Database.Database;
  try {
    db = new Database(path, { readonly, fileMustExist: !options.create });
  } catch (error) {
    throw new BandshelfError('NO_LIBRARY', `cannot open the library: ${(error as Error).message}`, {
      file: path,
      cause: error,
    });
  }
  try {
    db.pragma(`busy_timeout = ${Math.max(0, Math.round(options.busyTimeoutMs ?? 10_000))}`);
    db.pragma('foreign_keys = ON');
    // With recursive triggers, INSERT OR REPLACE fires the delete triggers too: a second guard beside the insert ones.
    db.pragma('recursive_triggers = ON');
    db.pragma(`mmap_size = ${Math.max(0, Math.round(options.mmapBytes ?? 2 ** 30))}`);
    // Only a file without content takes a page size; it must come before WAL is switched on.
    if (options.create) db.pragma(`page_size = ${options.pageSize ?? 16384}`);
    if (!readonly) {
      // WAL lets readers run beside one writer; FULL makes each committed transaction survive a power cut too.
      db.pragma('journal_mode = WAL');
      db.pragma('synchronous = FULL');
    }
    // Touch the schema so a file that is not SQLite fails here with a clear message, not on first use.
    db.prepare('SELECT count(*) FROM sqlite_schema').get();
  } catch (error) {
    db.close();
    throw new BandshelfError('NO_LIBRARY', `not a bandshelf library: ${(error as Error).message}`, {
      file: path,
      cause: error,
    });
  }
  return db;
}

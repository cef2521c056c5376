// Runs a write as one BEGIN IMMEDIATE transaction and turns SQLite's own failures (busy, read-only, disk full,
// corrupt) into one clear BandshelfError naming the library file.
import { BandshelfError } from '../../error.js';
import type { Library } from '../types.js';
import { appendSeal } from './appendSeal.js';

export interface WriteTransactionOptions {
  /** What is being written, for the error message.
   * @default 'the change' */
  what?: string;
}

export function writeTransaction<T>(
  library: Library,
  body: () => T,
  options: WriteTransactionOptions = {},
): T {
  try {
    return library.db
      .transaction(() => {
        const result = body();
        appendSeal(library.db);
        return result;
      })
      .immediate();
  } catch (error) {
    if (error instanceof BandshelfError) throw error;
    const code = (error as { code?: unknown }).code;
    if (typeof code === 'string' && code.startsWith('SQLITE_')) {
      const why =
        code === 'SQLITE_BUSY'
          ? 'another process held the write lock for longer than the busy timeout; try again'
          : code === 'SQLITE_READONLY'
            ? 'the library is read-only here'
            : code === 'SQLITE_FULL'
              ? 'the disk is full'
              : (error as Error).message;
      throw new BandshelfError(
        'IO_ERROR',
        `${options.what ?? 'the change'} was not stored: ${why} (${code})`,
        {
          file: library.path,
          cause: error,
        },
      );
    }
    throw error;
  }
}

// Copies a library with SQLite's online backup: a consistent snapshot even while others read or write it.
import { existsSync, renameSync, rmSync } from 'node:fs';
import { BandshelfError } from '../../error.js';
import type { Library } from '../types.js';

export interface BackupLibraryOptions {
  /** Replace an existing file at the destination.
   * @default false */
  overwrite?: boolean;
}

/** Writes to a temporary name and renames it into place, so a backup is whole or absent. Returns its page count. */
export async function backupLibrary(
  library: Library,
  destination: string,
  options: BackupLibraryOptions = {},
): Promise<{ totalPages: number }> {
  if (existsSync(destination) && !options.overwrite) {
    throw new BandshelfError('ALREADY_EXISTS', 'a file is already there; pass --overwrite to replace it', {
      file: destination,
    });
  }
  const temporary = `${destination}.${process.pid}.partial`;
  try {
    const result = await library.db.backup(temporary);
    renameSync(temporary, destination);
    return { totalPages: result.totalPages };
  } catch (error) {
    rmSync(temporary, { force: true });
    if (error instanceof BandshelfError) throw error;
    throw new BandshelfError('IO_ERROR', `the backup was not written: ${(error as Error).message}`, {
      file: destination,
      cause: error,
    });
  }
}

// Opens an existing library file, migrating its tables when it was written by an older bandshelf.
import { existsSync } from 'node:fs';
import { BandshelfError } from '../../error.js';
import type { Library } from '../types.js';
import { connectLibrary } from './connectLibrary.js';
import { LIBRARY_VERSION, migrateLibrary } from './migrateLibrary.js';
import { readSettings } from './readSettings.js';

export interface OpenLibraryOptions {
  /** Reading commands open read-only so they never take a write lock.
   * @default false */
  readonly?: boolean;
  /** Busy timeout for writers waiting on another process, ms.
   * @default 10000 */
  busyTimeoutMs?: number;
}

export function openLibrary(path: string, options: OpenLibraryOptions = {}): Library {
  if (!existsSync(path)) {
    throw new BandshelfError('NO_LIBRARY', 'no library here (create one with `bandshelf init`)', {
      file: path,
    });
  }
  const readonly = options.readonly ?? false;
  const db = connectLibrary(path, { readonly, busyTimeoutMs: options.busyTimeoutMs });
  try {
    const version = db.pragma('user_version', { simple: true }) as number;
    if (version === 0) {
      throw new BandshelfError('NO_LIBRARY', 'this SQLite file is not a bandshelf library', { file: path });
    }
    if (version < LIBRARY_VERSION) {
      if (readonly) {
        throw new BandshelfError(
          'NO_LIBRARY',
          `the library needs an upgrade of its tables (layout ${version} → ${LIBRARY_VERSION}); open it once with a writing command (add, edit, release)`,
          { file: path },
        );
      }
    }
    migrateLibrary(db, { file: path });
    const settings = readSettings(db, { file: path });
    return { db, path, readonly, ...settings };
  } catch (error) {
    db.close();
    throw error;
  }
}

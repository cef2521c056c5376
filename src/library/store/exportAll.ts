// Writes a library state as a folder `add` can read back: every entry's files in their original bytes, renamed
// after the entry id, beside a sidecar carrying its metadata, recipe and reading options. Adding the folder to an
// empty library reproduces every content hash (see the note on pinned references below).
import {
  existsSync,
  mkdirSync,
  mkdtempSync,
  readdirSync,
  renameSync,
  rmdirSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { BandshelfError } from '../../error.js';
import type { Library } from '../types.js';
import { canonicalJson } from './canonicalJson.js';
import { describeIoError } from './describeIoError.js';
import { stateSelect } from './stateSelect.js';

export interface ExportAllOptions {
  /** A release tag, or undefined / 'current' for the working state.
   * @default undefined */
  at?: string | null;
  /** Called after each entry. */
  progress?: (done: number, total: number, label: string) => void;
}

export interface ExportAllResult {
  entries: number;
  files: string[];
}

/** Renames the finished staging folder to `dir`; an empty `dir` (checked above) is replaced. */
function moveIntoPlace(staging: string, dir: string): void {
  try {
    renameSync(staging, dir);
  } catch (error) {
    // POSIX replaces an empty folder in one rename; where the system refuses, drop the empty folder and retry.
    if (!existsSync(dir) || readdirSync(dir).length > 0) {
      throw new BandshelfError('IO_ERROR', `cannot move the export into place: ${describeIoError(error)}`, {
        file: dir,
        cause: error,
      });
    }
    try {
      rmdirSync(dir);
      renameSync(staging, dir);
    } catch (again) {
      try {
        mkdirSync(dir, { recursive: true }); // leave the empty folder as it was found
      } catch {
        // The rename's own error, below, is the one worth reporting.
      }
      throw new BandshelfError('IO_ERROR', `cannot move the export into place: ${describeIoError(again)}`, {
        file: dir,
        cause: again,
      });
    }
  }
}

function extensionOf(name: string): string {
  const dot = name.lastIndexOf('.');
  return dot > 0 ? name.slice(dot) : '.txt';
}

/**
 * The folder must be new or empty: an export never mixes with (or overwrites) other files. Everything is written
 * into a hidden temporary sibling folder that is renamed to `dir` only at the end, so a failure part-way (a full
 * disk, an interrupted run) leaves no half-filled export behind: the temporary folder is removed and `dir` is as it
 * was. The sibling is hidden so `add` skips it should a crash leave one. A recipe that pins a
 * reference or EMSC spectrum keeps its revision number, so its content hash survives only where the referenced
 * entry gets that same revision number on re-import (revision 1 in an empty library).
 */
export function exportAll(library: Library, dir: string, options: ExportAllOptions = {}): ExportAllResult {
  if (existsSync(dir) && !statSync(dir).isDirectory()) {
    throw new BandshelfError('IO_ERROR', 'a file is there, not a folder; name a new or empty folder', {
      file: dir,
    });
  }
  if (existsSync(dir) && readdirSync(dir).length > 0) {
    throw new BandshelfError('OUT_NOT_EMPTY', 'the export folder is not empty; name a new or empty folder', {
      file: dir,
    });
  }
  const select = stateSelect(library, 'r.key, r.entry_id, r.meta, r.recipe, r.read_options', options);
  const rows = library.db.prepare(select.sql).all(...select.params) as {
    key: number;
    entry_id: string;
    meta: string;
    recipe: string;
    read_options: string;
  }[];
  const filesOf = library.db.prepare(
    `SELECT f.role, f.name, b.bytes FROM revision_files f JOIN files b ON b.sha256 = f.sha256
     WHERE f.revision_key = ? ORDER BY f.position`,
  );
  const parent = dirname(dir);
  // The first folder mkdirSync creates for the parent path (undefined when it existed): removed again on failure.
  let createdParent: string | undefined;
  let staging: string;
  try {
    createdParent = mkdirSync(parent, { recursive: true });
    staging = mkdtempSync(join(parent, `.${basename(dir)}.partial-`));
  } catch (error) {
    throw new BandshelfError(
      'IO_ERROR',
      `cannot create the folder: ${describeIoError(error, { writing: true })}`,
      {
        file: dir,
        cause: error,
      },
    );
  }
  const written: string[] = [];
  const write = (name: string, data: Uint8Array | string) => {
    try {
      writeFileSync(join(staging, name), data, { flag: 'wx' });
    } catch (error) {
      throw new BandshelfError('IO_ERROR', `cannot write: ${describeIoError(error, { writing: true })}`, {
        file: join(dir, name),
        cause: error,
      });
    }
    written.push(name);
  };
  try {
    rows.forEach((row, index) => {
      const files = filesOf.all(row.key) as { role: string; name: string; bytes: Buffer }[];
      const sidecar: Record<string, unknown> = {
        ...(JSON.parse(row.meta) as object),
        recipe: JSON.parse(row.recipe),
      };
      const read = JSON.parse(row.read_options) as Record<string, unknown>;
      if (Object.keys(read).length > 0) sidecar.read = read;
      const id = row.entry_id;
      if (files.length === 1 && files[0]!.role === 'data') {
        write(`${id}${extensionOf(files[0]!.name)}`, files[0]!.bytes);
      } else {
        const timeDomain: { sample: string[]; reference: string[] } = { sample: [], reference: [] };
        let s = 0;
        let r = 0;
        for (const f of files) {
          const name =
            f.role === 'sample-trace'
              ? `${id}.sample-${++s}${extensionOf(f.name)}`
              : `${id}.reference-${++r}${extensionOf(f.name)}`;
          write(name, f.bytes);
          (f.role === 'sample-trace' ? timeDomain.sample : timeDomain.reference).push(name);
        }
        sidecar.timeDomain = timeDomain;
      }
      // Canonical key order keeps exports diffable; indentation keeps them readable.
      write(`${id}.meta.json`, `${JSON.stringify(JSON.parse(canonicalJson(sidecar)), null, 2)}\n`);
      options.progress?.(index + 1, rows.length, id);
    });
    moveIntoPlace(staging, dir);
  } catch (error) {
    rmSync(createdParent ?? staging, { recursive: true, force: true });
    throw error;
  }
  return { entries: rows.length, files: written };
}

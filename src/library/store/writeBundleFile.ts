// Writes a bundle as gzip-compressed JSON, through a temporary sibling renamed into place, so a failure leaves
// no half-written bundle and an existing file is replaced only when asked.
import { existsSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { BandshelfError } from '../../error.js';
import type { Bundle } from '../../schema/bundle.js';
import { describeIoError } from './describeIoError.js';

export interface WriteBundleFileOptions {
  /** Replace an existing file.
   * @default false */
  force?: boolean;
  /** The file as the user named it, for errors.
   * @default the path */
  label?: string;
}

/** Returns the number of bytes written. */
export function writeBundleFile(bundle: Bundle, path: string, options: WriteBundleFileOptions = {}): number {
  const file = options.label ?? path;
  if (existsSync(path) && !options.force) {
    throw new BandshelfError('ALREADY_EXISTS', 'the file exists; add --force to overwrite it', { file });
  }
  const bytes = gzipSync(Buffer.from(JSON.stringify(bundle), 'utf8'));
  const staging = join(dirname(path), `.${basename(path)}.partial-${process.pid}`);
  try {
    writeFileSync(staging, bytes, { flag: 'wx' });
    renameSync(staging, path);
  } catch (error) {
    rmSync(staging, { force: true });
    throw new BandshelfError('IO_ERROR', `cannot write: ${describeIoError(error, { writing: true })}`, {
      file,
      cause: error,
    });
  }
  return bytes.length;
}

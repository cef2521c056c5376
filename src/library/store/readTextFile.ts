// Reads a UTF-8 text file the user named (recipe, --meta, manifest, sidecar); failure is one IO_ERROR naming it.
import { readFileSync } from 'node:fs';
import { BandshelfError } from '../../error.js';
import { describeIoError } from './describeIoError.js';

export interface ReadTextFileOptions {
  /** The file as the user named it, for errors.
   * @default the path */
  label?: string;
}

export function readTextFile(path: string, options: ReadTextFileOptions = {}): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (error) {
    throw new BandshelfError('IO_ERROR', `cannot read: ${describeIoError(error)}`, {
      file: options.label ?? path,
      cause: error,
    });
  }
}

// Reads a text file the user named (recipe, --meta, manifest, sidecar); failure is one IO_ERROR naming it.
import { readFileSync } from 'node:fs';
import { BandshelfError } from '../../error.js';
import { decodeText } from '../../formats/decodeText.js';
import { describeIoError } from './describeIoError.js';

export interface ReadTextFileOptions {
  /** The file as the user named it, for errors.
   * @default the path */
  label?: string;
  /** Called when the text was not UTF-8 (see decodeText). @default undefined (silent) */
  onWarning?: (message: string) => void;
}

/** Bytes through the one text decoder (BOM → UTF-8/UTF-16, valid UTF-8, else Windows-1252). */

export function readTextFile(path: string, options: ReadTextFileOptions = {}): string {
  let bytes: Buffer;
  try {
    bytes = readFileSync(path);
  } catch (error) {
    throw new BandshelfError('IO_ERROR', `cannot read: ${describeIoError(error)}`, {
      file: options.label ?? path,
      cause: error,
    });
  }
  const file = options.label ?? path;
  return decodeText(bytes, { file, ...(options.onWarning ? { onWarning: options.onWarning } : {}) });
}

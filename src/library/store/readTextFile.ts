// Reads a text file the user named (recipe, --meta, manifest, sidecar); failure is one error naming it.
import { decodeText } from '../../formats/decodeText.js';
import { readRegularFile } from './readRegularFile.js';

export interface ReadTextFileOptions {
  /** The file as the user named it, for errors.
   * @default the path */
  label?: string;
  /** Called when the text was not UTF-8 (see decodeText). @default undefined (silent) */
  onWarning?: (message: string) => void;
}

/** Bytes (a regular file within the size limit) through the one text decoder. */
export function readTextFile(path: string, options: ReadTextFileOptions = {}): string {
  const bytes = readRegularFile(path, { label: options.label ?? path });
  const file = options.label ?? path;
  return decodeText(bytes, { file, ...(options.onWarning ? { onWarning: options.onWarning } : {}) });
}

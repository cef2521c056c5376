// The one status line the matcher shows when a file cannot be matched (in the page or sent from its worker).
import { BandshelfError } from '../../error.js';

/** A BandshelfError as its one line (prefixed by the file name when it names no file); anything else plainly. */
export function matchErrorText(error: unknown, file: string): string {
  if (error instanceof BandshelfError) {
    return error.file === undefined ? `${file}: ${error.oneLine()}` : error.oneLine();
  }
  return `${file} could not be matched: ${error instanceof Error ? error.message : String(error)}`;
}

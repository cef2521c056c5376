// Reads the metadata fields of a sidecar (`serum-07.meta.json`), the part every caller needs.
import type { EntryMetaPatch } from '../schema/meta.js';
import { type ReadSidecarSectionsOptions, readSidecarSections } from './readSidecarSections.js';

export interface ReadSidecarOptions extends ReadSidecarSectionsOptions {}

/**
 * The sidecar's metadata fields, each validated (id and name may be absent: they default from the file name
 * later). The reserved keys `recipe` and `timeDomain` are validated too but not returned here.
 */
export function readSidecar(text: string, options: ReadSidecarOptions = {}): EntryMetaPatch {
  return readSidecarSections(text, options).meta;
}

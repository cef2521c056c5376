// Refuses a match the source cannot answer at all: no entries, or a forced id that is not one of its entries.
import { BandshelfError } from '../../error.js';
import type { MatchSource } from './types.js';

export interface CheckMatchSourceOptions {
  /** Entry ids forced into the mixture fit. @default [] */
  with?: readonly string[];
}

/**
 * EMPTY_LIBRARY for a source without entries; NOT_FOUND (field `with`) for a forced id it does not hold. Callers
 * that match a batch call it once before the first unknown, so a library-level problem is not reported per file.
 */
export function checkMatchSource(
  source: { entries: readonly { id: string }[]; at: MatchSource['at'] },
  options: CheckMatchSourceOptions = {},
): void {
  const where = source.at === null ? 'the library' : `release '${source.at}'`;
  if (source.entries.length === 0) {
    throw new BandshelfError('EMPTY_LIBRARY', `${where} holds no entries to match against`);
  }
  const ids = new Set(source.entries.map((e) => e.id));
  for (const id of new Set(options.with ?? [])) {
    if (!ids.has(id)) {
      throw new BandshelfError('NOT_FOUND', `\`with\` names '${id}', which is not an entry of ${where}`, {
        field: 'with',
      });
    }
  }
}

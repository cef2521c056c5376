// Tells apart the one failure a later pass of the same ingest may cure: a recipe naming an entry not yet added.
import { BandshelfError } from '../../error.js';

/** A NOT_FOUND on a recipe's reference or EMSC id may only mean that entry comes later in the same ingest. */
export function waitsForAnotherEntry(error: unknown): boolean {
  return (
    error instanceof BandshelfError &&
    error.code === 'NOT_FOUND' &&
    (error.field === 'reference.id' || error.field === 'emsc.id')
  );
}

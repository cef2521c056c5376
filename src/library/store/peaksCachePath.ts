// Where the sorted peak index of a library state is cached: beside the search matrices, one file per state key.
import { createHash } from 'node:crypto';

/** `<library>.cache/peaks-<hash of state key>.bin`; null for a library with no file (in memory). */
export function peaksCachePath(input: { libraryPath: string; stateKey: string }): string | null {
  if (input.libraryPath === '' || input.libraryPath === ':memory:') return null;
  const digest = createHash('sha256').update(`peaks|${input.stateKey}`).digest('hex').slice(0, 32);
  return `${input.libraryPath}.cache/peaks-${digest}.bin`;
}

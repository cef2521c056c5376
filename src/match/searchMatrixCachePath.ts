// Where a search matrix is cached on disk: a folder beside the library file, one file per matrix key.
import { createHash } from 'node:crypto';

/** `<library>.cache/search-<hash of key>.bin`: the key itself is long (it holds the mask), so it is hashed. */
export function searchMatrixCachePath(input: { libraryPath: string; key: string }): string {
  const digest = createHash('sha256').update(input.key).digest('hex').slice(0, 32);
  return `${input.libraryPath}.cache/search-${digest}.bin`;
}

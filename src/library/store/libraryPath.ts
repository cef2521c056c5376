// Where a command's `--library` option points: relative paths are read against the working directory.
import { isAbsolute, resolve } from 'node:path';

/** The default library file name, in the working directory. */
export const DEFAULT_LIBRARY = 'bandshelf.sqlite';

export function libraryPath(option: unknown, cwd: string): string {
  const given = typeof option === 'string' && option !== '' ? option : DEFAULT_LIBRARY;
  return isAbsolute(given) ? given : resolve(cwd, given);
}

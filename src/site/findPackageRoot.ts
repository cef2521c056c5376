// Finds bandshelf's own folder (templates, browser bundle, node_modules) from the running module's location.
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { BandshelfError } from '../error.js';

export interface FindPackageRootOptions {
  /** The package name to look for.
   * @default 'bandshelf' */
  name?: string;
}

/**
 * Walks up from `from` (a file URL or path) to the folder whose package.json is named `name`. The same code runs
 * from src/site/ under the test runner and from the bundle in dist/, so a fixed relative path would be wrong once.
 */
export function findPackageRoot(from: string, options: FindPackageRootOptions = {}): string {
  const name = options.name ?? 'bandshelf';
  let dir = dirname(from.startsWith('file:') ? fileURLToPath(from) : from);
  for (;;) {
    const manifest = join(dir, 'package.json');
    if (existsSync(manifest)) {
      try {
        if ((JSON.parse(readFileSync(manifest, 'utf8')) as { name?: string }).name === name) return dir;
      } catch {
        // An unreadable package.json on the way up is not ours; keep walking.
      }
    }
    const parent = dirname(dir);
    if (parent === dir)
      throw new BandshelfError('IO_ERROR', `cannot find the ${name} package folder`, { file: from });
    dir = parent;
  }
}

// Where a site build records the files it wrote: the list that lets the next build tell its own files from others.
import { join } from 'node:path';

export interface BuildManifestPathOptions {
  /** File name of the list inside the output folder.
   * @default '.bandshelf-site.json' */
  name?: string;
}

/** The manifest is JSON `{generator: 'bandshelf site', files: {path: sha256}}`, paths relative with `/`. */
export function buildManifestPath(out: string, options: BuildManifestPathOptions = {}): string {
  const name = options.name ?? '.bandshelf-site.json';
  return join(out, name);
}

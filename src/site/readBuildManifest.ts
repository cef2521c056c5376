// Reads the record an earlier `site` build left in its folder (its files' hashes and each entry page's input key).
import { existsSync, readFileSync } from 'node:fs';
import { buildManifestPath } from './buildManifestPath.js';

export interface BuildManifest {
  generator: 'bandshelf site';
  /** Relative path (with `/`) → SHA-256 of the bytes written. */
  files: Record<string, string>;
  /** Entry folder (`entries/<slug>/`) → the SHA-256 of everything its files were made from (older builds: none). */
  entries?: Record<string, string>;
}

export interface ReadBuildManifestOptions {
  /** The manifest's file name inside the folder.
   * @default '.bandshelf-site.json' */
  name?: string;
}

/** The folder's manifest, or undefined when it has none or one that is not a bandshelf site's. */
export function readBuildManifest(
  dir: string,
  options: ReadBuildManifestOptions = {},
): BuildManifest | undefined {
  const path = buildManifestPath(dir, options.name === undefined ? {} : { name: options.name });
  if (!existsSync(path)) return undefined;
  try {
    const parsed = JSON.parse(readFileSync(path, 'utf8')) as BuildManifest;
    return parsed && parsed.generator === 'bandshelf site' && typeof parsed.files === 'object'
      ? parsed
      : undefined;
  } catch {
    return undefined;
  }
}

// Records every file of a finished (or failed) build with its SHA-256, and removes folders the build left empty.
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, rmdirSync, statSync, writeFileSync } from 'node:fs';
import { basename, join, relative, sep } from 'node:path';
import { buildManifestPath } from './buildManifestPath.js';

export interface WriteBuildManifestOptions {
  /** Also remove folders that hold no file (an entry that left the library leaves its folder empty).
   * @default true */
  removeEmptyFolders?: boolean;
  /** Hashes already known (files linked from the previous build): not read again.
   * @default {} */
  known?: Record<string, string>;
  /** Each entry folder's input key, recorded for the next build.
   * @default {} */
  entries?: Record<string, string>;
}

/** Returns how many files (besides the manifest) the folder holds and their total size in bytes. */
export function writeBuildManifest(
  out: string,
  options: WriteBuildManifestOptions = {},
): { files: number; bytes: number } {
  const manifest = buildManifestPath(out);
  const own = basename(manifest);
  const removeEmpty = options.removeEmptyFolders ?? true;
  const files: string[] = [];
  const walk = (d: string): void => {
    for (const name of readdirSync(d).sort()) {
      const full = join(d, name);
      if (statSync(full).isDirectory()) walk(full);
      else files.push(relative(out, full).split(sep).join('/'));
    }
    if (removeEmpty && d !== out && readdirSync(d).length === 0) rmdirSync(d);
  };
  walk(out);
  const hashes: Record<string, string> = {};
  let bytes = 0;
  const known = options.known ?? {};
  for (const f of files) {
    if (f === own) continue;
    const hash = known[f];
    if (hash !== undefined) {
      bytes += statSync(join(out, f)).size;
      hashes[f] = hash;
      continue;
    }
    const content = readFileSync(join(out, f));
    bytes += content.byteLength;
    hashes[f] = createHash('sha256').update(content).digest('hex');
  }
  const record = { generator: 'bandshelf site', files: hashes, entries: options.entries ?? {} };
  writeFileSync(manifest, `${JSON.stringify(record, null, 1)}\n`);
  return { files: Object.keys(hashes).length, bytes };
}

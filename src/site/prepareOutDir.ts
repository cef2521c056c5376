// Makes the output folder ready for a build without ever deleting a file the build did not make, unless asked to.
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, realpathSync, rmSync, statSync } from 'node:fs';
import { homedir } from 'node:os';
import { basename, dirname, join, parse, relative, resolve, sep } from 'node:path';
import { BandshelfError } from '../error.js';
import { buildManifestPath } from './buildManifestPath.js';
import { readBuildManifest } from './readBuildManifest.js';

export interface PrepareOutDirOptions {
  /** Empty the folder even when it holds files an earlier build did not make.
   * @default false */
  clean?: boolean;
  /** Paths the folder must not contain or be (the library file, the templates), so --clean cannot delete them.
   * @default [] */
  protect?: string[];
  /** The working directory, which --clean never empties.
   * @default process.cwd() */
  cwd?: string;
  /** Check everything but delete nothing (the build then writes a sibling folder and swaps it in).
   * @default false */
  checkOnly?: boolean;
}

/** The real path of `p`, or of its nearest existing ancestor joined with the rest, so links cannot hide a target. */
function realOf(p: string): string {
  const abs = resolve(p);
  let head = abs;
  const rest: string[] = [];
  while (!existsSync(head)) {
    const up = dirname(head);
    if (up === head) return abs;
    rest.unshift(basename(head));
    head = up;
  }
  try {
    return join(realpathSync(head), ...rest);
  } catch {
    return abs;
  }
}

function listFiles(dir: string, base = dir): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir).sort()) {
    const full = join(dir, name);
    const st = statSync(full);
    if (st.isDirectory()) out.push(...listFiles(full, base));
    else out.push(relative(base, full).split(sep).join('/'));
  }
  return out;
}

function isInside(child: string, parent: string): boolean {
  const rel = relative(parent, child);
  return rel === '' || (!rel.startsWith('..') && !parse(rel).root);
}

/**
 * - A missing folder is created; an empty one is used as is.
 * - A folder holding exactly what an earlier build wrote (its manifest lists every file with the same bytes) has
 *   those files removed, so pages of entries that left the library do not linger.
 * - Anything else (a file the build did not make, or a built file someone changed) is refused with OUT_NOT_EMPTY
 *   unless `clean`, and `clean` empties only a folder an earlier build marked as its own (its manifest is there).
 * - Whatever the options, a folder that holds (after resolving links) a protected path, the working directory,
 *   the home folder or the root, or is one of them, is refused.
 */
export function prepareOutDir(out: string, options: PrepareOutDirOptions = {}): void {
  const dir = realOf(out);
  const cwd = realOf(options.cwd ?? process.cwd());
  if (existsSync(dir) && !statSync(dir).isDirectory()) {
    throw new BandshelfError('OUT_NOT_EMPTY', 'the output path exists and is not a folder', {
      file: out,
      field: '--out',
    });
  }
  const refuse = (what: string) =>
    new BandshelfError('OUT_NOT_EMPTY', `the output folder would contain ${what}; choose another folder`, {
      file: out,
      field: '--out',
    });
  for (const p of options.protect ?? []) {
    if (isInside(realOf(p), dir) || isInside(resolve(p), dir)) throw refuse(p);
  }
  for (const [p, what] of [
    [cwd, 'the working folder'],
    [realOf(homedir()), 'the home folder'],
    [parse(dir).root, 'the root folder'],
  ] as const) {
    if (isInside(p, dir)) throw refuse(what);
  }
  if (!existsSync(dir)) {
    if (!options.checkOnly) mkdirSync(dir, { recursive: true });
    return;
  }
  const top = readdirSync(dir).sort();
  if (top.length === 0) return;
  const manifest = readBuildManifest(dir);
  // Without a manifest every file is foreign: say so at once instead of walking what may be a large folder.
  const foreign =
    manifest === undefined
      ? top
      : listFiles(dir).filter((f) => {
          if (f === basename(buildManifestPath(dir))) return false;
          const expected = manifest.files[f];
          if (expected === undefined) return true;
          return (
            createHash('sha256')
              .update(readFileSync(join(dir, f)))
              .digest('hex') !== expected
          );
        });
  if (foreign.length > 0 && !(options.clean && manifest !== undefined)) {
    const shown =
      foreign.slice(0, 3).join(', ') + (foreign.length > 3 ? ` and ${foreign.length - 3} more` : '');
    throw new BandshelfError(
      'OUT_NOT_EMPTY',
      manifest === undefined
        ? `the output folder holds files no bandshelf site build made (${shown}); --clean empties only a folder an earlier \`site\` wrote: choose an empty or new folder`
        : `the output folder holds files this build did not make (${shown}); choose an empty folder or pass --clean to empty it`,
      { file: out, field: '--out' },
    );
  }
  if (options.checkOnly) return;
  if (foreign.length > 0) {
    for (const name of top) rmSync(join(dir, name), { recursive: true, force: true });
    return;
  }
  const files = listFiles(dir);
  // Folders stay: the build writes into the same ones, and removing then re-creating thousands costs seconds.
  for (const f of files) rmSync(join(dir, f), { force: true });
}

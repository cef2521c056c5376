// The spectrum files a command-line target names: the file itself, or a folder's spectrum files.
import { readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { BandshelfError } from '../error.js';
import { isSidecarName } from '../formats/isSidecarName.js';

export interface SpectrumFilesOfOptions {
  /** The folder relative targets are read against. @default process.cwd() */
  cwd?: string;
}

/** A folder's files (not recursive): no hidden files, sidecars or manifests; sorted by name, joined onto the target. */
export function spectrumFilesOf(target: string, options: SpectrumFilesOfOptions = {}): string[] {
  const full = resolve(options.cwd ?? process.cwd(), target);
  let stat: ReturnType<typeof statSync>;
  try {
    stat = statSync(full);
  } catch {
    throw new BandshelfError('IO_ERROR', 'no such file or folder', { file: target });
  }
  if (!stat.isDirectory()) return [target];
  const names = readdirSync(full)
    .filter((name) => !name.startsWith('.') && !isSidecarName(name) && name.toLowerCase() !== 'manifest.csv')
    .filter((name) => statSync(join(full, name)).isFile())
    .sort();
  if (names.length === 0)
    throw new BandshelfError('EMPTY_FILE', 'the folder holds no spectrum files', { file: target });
  return names.map((name) => join(target, name));
}

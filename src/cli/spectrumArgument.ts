// A spectrum named on the command line: a file (read like a match unknown) or a library entry `id` / `id@revision`.
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { BandshelfError } from '../error.js';
import { readEntry } from '../library/store/readEntry.js';
import type { Library } from '../library/types.js';
import type { Spectrum } from '../spectrum/types.js';
import { type ReadUnknownFileOptions, readUnknownFile } from './readUnknownFile.js';

export interface SpectrumArgumentOptions {
  /** The folder relative files are read against. @default process.cwd() */
  cwd?: string;
  /** Opens the library on first need (an argument that is not a file). @default undefined (files only) */
  library?: () => Library;
  /** A release tag for entry ids without `@revision`. @default undefined (working state) */
  at?: string;
  /** How a file is read (units, block, column), as for a `match` unknown. @default {} (as the file says) */
  read?: ReadUnknownFileOptions['read'];
}

export interface SpectrumArgument {
  /** As the user wrote it for a file's name, `id@revision` for an entry. */
  label: string;
  /** The original spectrum (file: as read; entry: as stored), cm⁻¹ ascending, absorbance. */
  original: Spectrum;
  /** The stored processed vector of an entry; undefined for a file. */
  processed?: Float64Array;
  saturated?: Uint8Array;
  /** SHA-256 of the file, or the revision's content hash. */
  hash: string;
  warnings: readonly string[];
}

/** An existing path is a file; anything else must be a library entry. A multi-block file gives its first block. */
export function spectrumArgument(argument: string, options: SpectrumArgumentOptions = {}): SpectrumArgument {
  const cwd = options.cwd ?? process.cwd();
  if (existsSync(resolve(cwd, argument))) {
    const [unknown] = readUnknownFile(argument, {
      cwd,
      ...(options.read === undefined ? {} : { read: options.read }),
    });
    return {
      label: unknown!.file,
      original: unknown!.spectrum,
      ...(unknown!.saturated === undefined ? {} : { saturated: unknown!.saturated }),
      hash: unknown!.hash,
      warnings: unknown!.warnings,
    };
  }
  const m = /^([^@\s]+)(?:@(\d+))?$/.exec(argument);
  if (m === null || options.library === undefined) {
    throw new BandshelfError('NOT_FOUND', 'no such file (nor a library entry id)', { file: argument });
  }
  const entry = readEntry(options.library(), m[1]!, {
    ...(m[2] === undefined ? {} : { revision: Number(m[2]) }),
    ...(m[2] === undefined && options.at !== undefined ? { at: options.at } : {}),
  });
  return {
    label: `${entry.id}@${entry.revision}`,
    original: entry.original,
    processed: entry.processed,
    hash: entry.hash,
    warnings: [],
  };
}

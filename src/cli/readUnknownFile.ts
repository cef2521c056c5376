// Reads one unknown spectrum file from disk into the match pipeline's unknowns (one per block), with its SHA-256.
import { createHash } from 'node:crypto';
import { basename, resolve } from 'node:path';
import { readSpectrumFile } from '../formats/readSpectrumFile.js';
import type { SpectrumReadOptions } from '../formats/types.js';
import { readRegularFile } from '../library/store/readRegularFile.js';
import type { MatchUnknown } from '../match/pipeline/types.js';

export interface ReadUnknownFileOptions {
  /** The folder a relative `file` is read against. @default process.cwd() */
  cwd?: string;
  /** Keep the path as given in `file` (else the file name only). @default false */
  keepPath?: boolean;
  /** Reading overrides passed to readSpectrumFile (units, block, column). @default {} (detected from the file) */
  read?: Pick<SpectrumReadOptions, 'xUnit' | 'yUnit' | 'block' | 'column'>;
  /** How the unknown was measured (`atr` gets the ATR correction, see MatchUnknown). @default the file's own label, if any */
  technique?: string;
}

/** The unknown names the file only (a path can carry a patient or study code) unless `keepPath`. */
export function readUnknownFile(file: string, options: ReadUnknownFileOptions = {}): MatchUnknown[] {
  const bytes = readRegularFile(resolve(options.cwd ?? process.cwd(), file), { label: file });
  const hash = createHash('sha256').update(bytes).digest('hex');
  const read = options.read ?? {};
  const parsed = readSpectrumFile(bytes, { ...read, file });
  return parsed.map((p) => {
    const title = typeof p.meta.title === 'string' ? p.meta.title : undefined;
    // The user's word first, then what the file says (a sidecar-less unknown rarely says it).
    const technique =
      options.technique ?? (typeof p.meta.technique === 'string' ? p.meta.technique : undefined);
    return {
      file: options.keepPath === true ? file : basename(file),
      ...(parsed.length > 1 && p.source.block !== undefined ? { block: p.source.block } : {}),
      ...(p.source.column === undefined ? {} : { column: p.source.column }),
      hash,
      ...(title === undefined ? {} : { title }),
      spectrum: p.spectrum,
      ...(p.saturated === undefined ? {} : { saturated: p.saturated }),
      warnings: p.warnings.map((w) => (w.line === undefined ? w.message : `line ${w.line}: ${w.message}`)),
      ...(p.meta.resolution === undefined ? {} : { resolution: p.meta.resolution }),
      ...(technique === undefined ? {} : { technique }),
    };
  });
}

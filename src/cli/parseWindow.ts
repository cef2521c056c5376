// A wavenumber window as people type it on the command line, `HIGH:LOW` (either order), refused clearly otherwise.
import { BandshelfError } from '../error.js';
import type { WavenumberWindow } from '../schema/recipe.js';

export interface ParseWindowOptions {
  /** The flag named in the refusal (without dashes). @default 'range' */
  flag?: string;
  /** The example shown in the refusal. @default '1800:900' */
  example?: string;
}

export function parseWindow(text: string, options: ParseWindowOptions = {}): WavenumberWindow {
  const flag = options.flag ?? 'range';
  const m = /^\s*(\d+(?:\.\d+)?)\s*:\s*(\d+(?:\.\d+)?)\s*$/.exec(text);
  const a = m ? Number(m[1]) : Number.NaN;
  const b = m ? Number(m[2]) : Number.NaN;
  if (!m || a === b) {
    throw new BandshelfError(
      'BAD_OPTION',
      `--${flag} takes two different wavenumbers as HIGH:LOW (e.g. ${options.example ?? '1800:900'}), not '${text}'`,
      { field: flag },
    );
  }
  return { min: Math.min(a, b), max: Math.max(a, b) };
}

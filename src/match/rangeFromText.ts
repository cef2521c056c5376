// One scoring window from its text, `HIGH:LOW` in cm⁻¹ (either order), as `match --range` and the matcher page take it.
import { BandshelfError } from '../error.js';
import type { WavenumberWindow } from '../schema/recipe.js';

export interface RangeFromTextOptions {
  /** How the message names what was given.
   * @default 'a range' */
  label?: string;
  /** The field a refusal names.
   * @default 'range' */
  field?: string;
}

/** Refuses anything but two different numbers with BAD_OPTION. */
export function rangeFromText(text: string, options: RangeFromTextOptions = {}): WavenumberWindow {
  const m = /^\s*([-+]?\d+(?:\.\d+)?)\s*:\s*([-+]?\d+(?:\.\d+)?)\s*$/.exec(text);
  const a = m ? Number(m[1]) : Number.NaN;
  const b = m ? Number(m[2]) : Number.NaN;
  if (!m || a === b) {
    throw new BandshelfError(
      'BAD_OPTION',
      `${options.label ?? 'a range'} takes two different wavenumbers as HIGH:LOW (e.g. 1800:900), not '${text}'`,
      { field: options.field ?? 'range' },
    );
  }
  return { min: Math.min(a, b), max: Math.max(a, b) };
}

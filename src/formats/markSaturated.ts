// Finds the points of a transmittance-derived spectrum that sit at the absorbance ceiling and words a warning.

import type { Spectrum } from '../spectrum/types.js';
import { ABSORBANCE_CEILING } from '../spectrum/types.js';
import type { ParseWarning } from './types.js';

export interface MarkSaturatedOptions {
  /** Absorbance ceiling the transmittance was clipped to. @default 4 */
  absorbanceCeiling?: number;
}

export interface MarkSaturatedResult {
  /** 1 per saturated point (index as spectrum.wavenumber); undefined when none is. */
  saturated?: Uint8Array;
  warning?: ParseWarning;
}

/** Points at or above the ceiling cannot be told apart from one another: the detector saw no light there. */
export function markSaturated(spectrum: Spectrum, options: MarkSaturatedOptions = {}): MarkSaturatedResult {
  const { absorbanceCeiling = ABSORBANCE_CEILING } = options;
  const { wavenumber, absorbance } = spectrum;
  const mask = new Uint8Array(absorbance.length);
  let count = 0;
  const ranges: string[] = [];
  let start = -1;
  for (let i = 0; i <= absorbance.length; i++) {
    const hit = i < absorbance.length && absorbance[i]! >= absorbanceCeiling;
    if (hit) {
      mask[i] = 1;
      count++;
      if (start < 0) start = i;
    } else if (start >= 0) {
      if (ranges.length < 10) ranges.push(span(wavenumber[start]!, wavenumber[i - 1]!));
      else if (ranges.length === 10) ranges.push('…');
      start = -1;
    }
  }
  if (count === 0) return {};
  return {
    saturated: mask,
    warning: {
      message: `${count} point${count === 1 ? '' : 's'} at or beyond the absorbance ceiling ${absorbanceCeiling} (transmittance ≤ ${(10 ** -absorbanceCeiling).toPrecision(1)}, noise of a saturated band) clipped and marked saturated, kept out of scoring: ${ranges.join(', ')} cm⁻¹`,
    },
  };
}

function span(a: number, b: number): string {
  const f = (v: number) => String(Number(v.toFixed(2)));
  return a === b ? f(a) : `${f(a)}–${f(b)}`;
}

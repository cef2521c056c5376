// Which abscissa unit a file's x values were more likely in, when read in one unit they miss the wavenumbers wanted.
import { wavenumberFromTerahertz } from '../spectrum/trace/wavenumberFromTerahertz.js';
import type { XUnit } from './types.js';

export interface LikelyXUnitOptions {
  /** The unit the values were read in. @default 'cm-1' */
  used?: XUnit;
  /** The wavenumber span (cm⁻¹) the spectrum should cover, such as a library's grid. @default 400–4000 cm⁻¹ */
  span?: { min: number; max: number };
}

export interface LikelyXUnit {
  /** The file's own x values, lowest and highest, in the unit they were read in. */
  values: { min: number; max: number };
  /** The other unit under which those values cover the most of `span`, or null when none covers any of it. */
  unit: XUnit | null;
  /** The wavenumber range (cm⁻¹) the values would have in that unit. */
  wavenumbers?: { min: number; max: number };
}

/** cm⁻¹ → the unit's value and back (λ = 10⁴/ν̃ µm = 10⁷/ν̃ nm; f = ν̃ · c; common practice). */
const PER_THZ = wavenumberFromTerahertz(1);
const FROM_CM: Record<XUnit, (v: number) => number> = {
  'cm-1': (v) => v,
  um: (v) => 1e4 / v,
  nm: (v) => 1e7 / v,
  thz: (v) => v / PER_THZ,
};
const TO_CM: Record<XUnit, (v: number) => number> = {
  'cm-1': (v) => v,
  um: (v) => 1e4 / v,
  nm: (v) => 1e7 / v,
  thz: (v) => v * PER_THZ,
};

/**
 * From the wavenumber range a spectrum was read to (cm⁻¹, `used` being the unit of the file), the file's own
 * x range and the unit that would put it most inside `span`: of the units that put at least half of the data
 * inside `span`, the one covering the most of it; none when no unit does.
 */
export function likelyXUnit(
  wavenumbers: { min: number; max: number },
  options: LikelyXUnitOptions = {},
): LikelyXUnit {
  const { used = 'cm-1', span = { min: 400, max: 4000 } } = options;
  const a = FROM_CM[used](wavenumbers.min);
  const b = FROM_CM[used](wavenumbers.max);
  const values = { min: Math.min(a, b), max: Math.max(a, b) };
  let best: LikelyXUnit = { values, unit: null };
  let bestCovered = 0;
  for (const unit of Object.keys(TO_CM) as XUnit[]) {
    if (unit === used || ((unit === 'um' || unit === 'nm') && values.min <= 0)) continue;
    const c = TO_CM[unit](values.min);
    const d = TO_CM[unit](values.max);
    const range = { min: Math.min(c, d), max: Math.max(c, d) };
    const covered = Math.min(range.max, span.max) - Math.max(range.min, span.min);
    // Most of the data must land inside the span: a far-infrared file is not a terahertz file in disguise.
    if (covered < 0.5 * (range.max - range.min)) continue;
    if (covered > bestCovered) {
      bestCovered = covered;
      best = { values, unit, wavenumbers: range };
    }
  }
  return best;
}

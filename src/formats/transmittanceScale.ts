// Decides whether transmittance values are a fraction (0–1) or a percentage (0–100), words first, then values.
import { BandshelfError } from '../error.js';
import { finiteRange } from '../spectrum/finiteRange.js';
import type { ParseWarning, YUnit } from './types.js';

export interface TransmittanceScaleOptions {
  /** What the file's own words say: 'percent' (`%T`, PERCENT …) or 'unstated' (TRANSMITTANCE, T). @default 'unstated' */
  stated?: 'percent' | 'unstated';
  /** Noise allowed either side of a scale, as a fraction of its full scale. @default 0.25 */
  margin?: number;
  /** File named in the error. @default undefined */
  file?: string;
  /** Line the unit was read from, for the warning and the error. @default undefined */
  line?: number;
}

export interface TransmittanceScaleResult {
  unit: Extract<YUnit, 'transmittance' | 'percent-transmittance'>;
  /** Which scale was chosen and why, when it was not beyond doubt. */
  warning?: ParseWarning;
}

/**
 * A fraction's values sit in [−m, 1 + m], a percentage's in [−100m, 100(1 + m)]: noise in a saturated band
 * dips below 0 and a noisy baseline rises past 100 %. The file's words win when the values fit them; values that
 * fit neither scale are not a transmittance → NOT_A_SPECTRUM (a single-beam spectrum or an interferogram is
 * the usual cause).
 */
export function transmittanceScale(
  y: Float64Array,
  options: TransmittanceScaleOptions = {},
): TransmittanceScaleResult {
  const { stated = 'unstated', margin = 0.25, file, line } = options;
  const { min, max } = finiteRange(y);
  const fitsFraction = min >= -margin && max <= 1 + margin;
  const fitsPercent = min >= -100 * margin && max <= 100 * (1 + margin);
  const range = `values from ${round(min)} to ${round(max)}`;
  if (stated === 'percent') {
    if (fitsPercent) return { unit: 'percent-transmittance' };
  } else if (fitsFraction) {
    return { unit: 'transmittance' };
  } else if (fitsPercent) {
    return {
      unit: 'percent-transmittance',
      warning: {
        line,
        message: `transmittance read as percent (0–100): ${range} lie beyond a fraction's 0–1 and within a percentage, allowing noise`,
      },
    };
  }
  throw new BandshelfError(
    'NOT_A_SPECTRUM',
    `${range} fit neither a transmittance fraction (0–1) nor a percentage (0–100); the file may hold a single-beam spectrum or an interferogram (give the y unit if it is a transmittance)`,
    { file, line, field: 'y' },
  );
}

function round(v: number): string {
  return Number.isFinite(v) ? String(Number(v.toPrecision(4))) : String(v);
}

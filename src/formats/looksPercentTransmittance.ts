// Whether values with no stated unit look like transmittance on a 0–100 scale: the hint given when they are read as absorbance.
import { finiteRange } from '../spectrum/finiteRange.js';

/**
 * Every finite value inside 0–100.5 and some well above what a fraction or an absorbance reaches (> 3): a hint
 * only, never a decision (a stated unit decides, see `transmittanceScale`).
 */
export function looksPercentTransmittance(y: ArrayLike<number>): boolean {
  const { min, max } = finiteRange(y);
  return min >= 0 && max <= 100.5 && max > 3;
}

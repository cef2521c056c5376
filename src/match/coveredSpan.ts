// The wavenumber range a set of grid points covers, counted over stretches of neighbouring points.

export interface CoveredSpanOptions {
  /**
   * Only points where this second mask is also set (an intersection), when given.
   * @default undefined
   */
  and?: ArrayLike<number>;
}

/**
 * `step` × the number of neighbouring pairs that are both set: a stretch 1750–1000 cm⁻¹ on a 2 cm⁻¹ grid is
 * 750 cm⁻¹, a lone point adds nothing, and a gap (an exclusion window) is not counted.
 */
export function coveredSpan(mask: ArrayLike<number>, step: number, options: CoveredSpanOptions = {}): number {
  const and = options.and;
  let pairs = 0;
  let previous = false;
  for (let i = 0; i < mask.length; i++) {
    const set = mask[i] !== 0 && (and === undefined || and[i] !== 0);
    if (set && previous) pairs++;
    previous = set;
  }
  return pairs * step;
}

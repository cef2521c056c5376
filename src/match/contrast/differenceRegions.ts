// The contiguous grid regions whose difference of means passes the false-discovery threshold, one sign each.

export interface DifferenceRegionsOptions {
  /**
   * Benjamini–Hochberg threshold: a point passes when q ≤ this.
   * @default 0.05
   */
  q?: number;
}

export interface DifferenceRegion {
  /** First and last grid index (inclusive), ascending wavenumber. */
  from: number;
  to: number;
  /** Index of the largest |difference| in the region. */
  peak: number;
  sign: 'higher' | 'lower';
  smallestQ: number;
}

/**
 * A region is a maximal run of adjacent passing points with the same sign of the difference: a sign change or an
 * untested point (NaN) ends it, so a band shift (one side up, the other down) gives two regions.
 */
export function differenceRegions(
  contrast: { difference: ArrayLike<number>; q: ArrayLike<number> },
  options: DifferenceRegionsOptions = {},
): DifferenceRegion[] {
  const threshold = options.q ?? 0.05;
  const { difference, q } = contrast;
  const regions: DifferenceRegion[] = [];
  let open: DifferenceRegion | null = null;
  for (let j = 0; j < difference.length; j++) {
    const d = difference[j]!;
    const passes = q[j]! <= threshold && d !== 0;
    const sign = d > 0 ? 'higher' : 'lower';
    if (open !== null && (!passes || sign !== open.sign)) {
      regions.push(open);
      open = null;
    }
    if (!passes) continue;
    if (open === null) open = { from: j, to: j, peak: j, sign, smallestQ: q[j]! };
    else {
      open.to = j;
      if (Math.abs(d) > Math.abs(difference[open.peak]!)) open.peak = j;
      open.smallestQ = Math.min(open.smallestQ, q[j]!);
    }
  }
  if (open !== null) regions.push(open);
  return regions;
}

// How much of what a fit leaves at a candidate's own bands, beyond the noise, the candidate itself explains.

export interface OwnBandShareInput {
  /** The candidate's column over the fit points (baseline projected out or not). */
  column: ArrayLike<number>;
  /** Residual of the fit without the candidate, over the same points. */
  without: ArrayLike<number>;
  /** Residual of the fit with the candidate. */
  with: ArrayLike<number>;
  /** Noise standard deviation per point (robust, from the residual's first differences). */
  noiseSigma: number;
}

export interface OwnBandShareOptions {
  /** A point belongs to the candidate's own bands where |column| reaches this fraction of its largest value. @default 0.2 */
  bandLevel?: number;
}

/**
 * Over B = the points where the candidate's column is at least `bandLevel` of its peak:
 * share = (Σ_B without² − Σ_B with²) / (Σ_B without² − |B|·σ²), clamped to [0, 1]; 0 when nothing beyond the noise is
 * left there (the candidate's bands show nothing the noise does not). A compound present in the sample accounts for most of what remains at its bands; one that only trims
 * another component's misfit (a band shifted or broadened between benches) explains a small part of it.
 */
export function ownBandShare(input: OwnBandShareInput, options: OwnBandShareOptions = {}): number {
  const level = options.bandLevel ?? 0.2;
  const { column, without, with: after, noiseSigma } = input;
  let peak = 0;
  for (let t = 0; t < column.length; t++) peak = Math.max(peak, Math.abs(column[t]!));
  if (!(peak > 0)) return 0;
  let before = 0;
  let left = 0;
  let points = 0;
  for (let t = 0; t < column.length; t++) {
    if (Math.abs(column[t]!) < level * peak) continue;
    before += without[t]! * without[t]!;
    left += after[t]! * after[t]!;
    points++;
  }
  const excess = before - points * noiseSigma * noiseSigma;
  if (!(excess > 0)) return 0;
  return Math.min(1, Math.max(0, (before - left) / excess));
}

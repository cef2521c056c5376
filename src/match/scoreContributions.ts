// Why a hit scores as it does: each spectral region's share of the Pearson correlation of unknown and reference.

/** A spectral region, cm⁻¹ (inclusive). */
export interface ContributionRegion {
  label: string;
  min: number;
  max: number;
}

/** The default regions: CH stretches, C=O, amide I/II, the fingerprint, C–O/phosphate and below. */
export const DEFAULT_CONTRIBUTION_REGIONS: readonly ContributionRegion[] = [
  { label: 'CH stretches', min: 2800, max: 3050 },
  { label: 'C=O', min: 1700, max: 1800 },
  { label: 'amide I/II', min: 1500, max: 1700 },
  { label: '1500–1200', min: 1200, max: 1500 },
  { label: 'C–O/phosphate', min: 900, max: 1200 },
  { label: 'below 900', min: 0, max: 900 },
];

export interface ScoreContributionsOptions {
  /**
   * Regions to split the correlation over; a point in several counts for the first. Points in none go to a final
   * `elsewhere` row, so the shares always add up to r.
   * @default DEFAULT_CONTRIBUTION_REGIONS
   */
  regions?: readonly ContributionRegion[];
  /**
   * 1 where a grid point takes part in the score (the match's scoring mask); every point where both are finite
   * when not given.
   * @default null
   */
  mask?: ArrayLike<number> | null;
}

export interface ScoreContribution extends ContributionRegion {
  /** Σ over the region of the products of the centred, unit-norm vectors; all shares sum to Pearson r. */
  share: number;
  /** Grid points of the region that took part. */
  points: number;
}

/**
 * Pearson r = Σ x̂ᵢ ŷᵢ with x̂, ŷ the vectors centred over the common points and scaled to unit norm, so r splits
 * exactly into sums over disjoint sets of points. Empty when fewer than two points are common or a vector is flat.
 */
export function scoreContributions(
  input: { wavenumber: ArrayLike<number>; unknown: ArrayLike<number>; reference: ArrayLike<number> },
  options: ScoreContributionsOptions = {},
): ScoreContribution[] {
  const regions = options.regions ?? DEFAULT_CONTRIBUTION_REGIONS;
  const mask = options.mask ?? null;
  const { wavenumber, unknown: x, reference: y } = input;
  const use = (i: number): boolean =>
    (mask === null || mask[i] !== 0) && Number.isFinite(x[i]!) && Number.isFinite(y[i]!);
  let n = 0;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < wavenumber.length; i++) {
    if (!use(i)) continue;
    n++;
    sx += x[i]!;
    sy += y[i]!;
  }
  if (n < 2) return [];
  const mx = sx / n;
  const my = sy / n;
  let xx = 0;
  let yy = 0;
  for (let i = 0; i < wavenumber.length; i++) {
    if (!use(i)) continue;
    xx += (x[i]! - mx) ** 2;
    yy += (y[i]! - my) ** 2;
  }
  if (!(xx > 0 && yy > 0)) return [];
  const scale = 1 / Math.sqrt(xx * yy);
  const rows: ScoreContribution[] = [
    ...regions.map((r) => ({ ...r, share: 0, points: 0 })),
    { label: 'elsewhere', min: Number.NaN, max: Number.NaN, share: 0, points: 0 },
  ];
  for (let i = 0; i < wavenumber.length; i++) {
    if (!use(i)) continue;
    const w = wavenumber[i]!;
    let k = regions.findIndex((r) => w >= r.min && w <= r.max);
    if (k < 0) k = regions.length;
    rows[k]!.share += (x[i]! - mx) * (y[i]! - my) * scale;
    rows[k]!.points++;
  }
  return rows.filter((r) => r.points > 0);
}

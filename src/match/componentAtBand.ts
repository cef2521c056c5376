// Which fitted mixture component carries a band: the component's scaled contribution against the band's height.
import type { MixtureCandidate, MixtureResult } from './types.js';

export interface ComponentAtBandOptions {
  /**
   * Share of the band's height (above the fitted baseline) a component's weight × vector must reach there to be
   * credited with the band: more than half means the component carries most of it.
   * @default 0.5
   */
  minShare?: number;
}

export interface ComponentAtBandInput {
  /** Wavenumbers of the grid (any order), cm⁻¹. */
  wavenumber: ArrayLike<number>;
  /** The unknown on the same grid. */
  absorbance: ArrayLike<number>;
  /** Band position, cm⁻¹. */
  position: number;
  mixture: Pick<MixtureResult, 'components' | 'baseline'>;
  /** The vectors the fit used, on the same grid; matched to components by id and revision. */
  vectors: readonly Pick<MixtureCandidate, 'id' | 'revision' | 'vector'>[];
}

export interface ComponentAtBand {
  id: string;
  revision: number;
  name?: string;
  /** The component's contribution at the band over the band's height above the fitted baseline. */
  share: number;
}

function nearestIndex(axis: ArrayLike<number>, position: number): number {
  let best = -1;
  let distance = Number.POSITIVE_INFINITY;
  for (let i = 0; i < axis.length; i++) {
    const d = Math.abs(axis[i]! - position);
    if (d < distance) {
      distance = d;
      best = i;
    }
  }
  return best;
}

/**
 * The band's height is the unknown minus the fit's polynomial baseline at the grid point nearest the band; the
 * component with the largest weight × vector there is credited when its share reaches `minShare`. Null when no
 * component does, when the band is not above the baseline, or when no vector was given for the components.
 */
export function componentAtBand(
  input: ComponentAtBandInput,
  options: ComponentAtBandOptions = {},
): ComponentAtBand | null {
  const minShare = options.minShare ?? 0.5;
  const i = nearestIndex(input.wavenumber, input.position);
  if (i < 0) return null;
  const b = input.mixture.baseline;
  let base = 0;
  if (b !== null) {
    const u = (input.wavenumber[i]! - b.centre) / b.halfWidth;
    for (let k = b.coefficients.length - 1; k >= 0; k--) base = base * u + b.coefficients[k]!;
  }
  const height = input.absorbance[i]! - base;
  if (!(height > 0)) return null;
  let best: ComponentAtBand | null = null;
  for (const c of input.mixture.components) {
    const v = input.vectors.find((x) => x.id === c.id && x.revision === c.revision);
    const value = v?.vector[i];
    if (value === undefined || !Number.isFinite(value)) continue;
    const share = (c.weight * value) / height;
    if (best === null || share > best.share) {
      best = { id: c.id, revision: c.revision, ...(c.name === undefined ? {} : { name: c.name }), share };
    }
  }
  return best !== null && best.share >= minShare ? best : null;
}

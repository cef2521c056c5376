// A seeded synthetic cohort of serum-film-like spectra on a grid (invented bands, labelled synthetic): per-band
// biological variation, a per-spectrum offset and slope, and white noise; one band may be raised in group A.
import type { Grid } from '../schema/recipe.js';
import { gridAxis } from '../spectrum/gridAxis.js';
import { seededRandom } from './seededRandom.js';

export const COHORT_GRID: Grid = { start: 1800, stop: 900, step: 2 };

/** Invented film bands: position, height, FWHM (cm⁻¹); positions follow rows of the shipped assignment table. */
export const COHORT_BANDS = [
  { position: 1740, height: 0.15, fwhm: 18 },
  { position: 1652, height: 1, fwhm: 30 },
  { position: 1545, height: 0.6, fwhm: 30 },
  { position: 1455, height: 0.2, fwhm: 20 },
  { position: 1395, height: 0.15, fwhm: 20 },
  { position: 1240, height: 0.15, fwhm: 40 },
  { position: 1080, height: 0.2, fwhm: 30 },
];

export interface SyntheticCohortOptions {
  /** Spectra per group. @default 20 */
  n?: number;
  /** Relative between-spectrum SD of each band's height. @default 0.1 */
  variation?: number;
  /** Index into COHORT_BANDS raised in group A, or null. @default null */
  raised?: number | null;
  /** How far the raised band's mean height moves, in its between-spectrum SDs. @default 2 */
  raisedBy?: number;
  /** RMS white noise, absorbance. @default 0.002 */
  noise?: number;
}

/** Two groups of grid vectors (ascending wavenumber) from one seed, as `contrastGroups` takes them. */
export function syntheticCohort(seed: number, options: SyntheticCohortOptions = {}) {
  const { normal } = seededRandom(seed);
  const axis = gridAxis(COHORT_GRID);
  const n = options.n ?? 20;
  const variation = options.variation ?? 0.1;
  const noise = options.noise ?? 0.002;
  const spectrum = (raise: boolean): Float64Array => {
    const v = new Float64Array(axis.length);
    const offset = 0.01 * normal();
    const slope = 0.00001 * normal();
    COHORT_BANDS.forEach((band, k) => {
      let factor = 1 + variation * normal();
      if (raise && k === options.raised) factor += (options.raisedBy ?? 2) * variation;
      const s = band.fwhm / (2 * Math.sqrt(2 * Math.LN2));
      for (let j = 0; j < axis.length; j++) {
        v[j] = v[j]! + factor * band.height * Math.exp(-((axis[j]! - band.position) ** 2) / (2 * s * s));
      }
    });
    for (let j = 0; j < axis.length; j++)
      v[j] = v[j]! + offset + slope * (axis[j]! - 1350) + noise * normal();
    return v;
  };
  const group = (prefix: string, raise: boolean) =>
    Array.from({ length: n }, (_, i) => ({
      file: `${prefix}-${String(i + 1).padStart(2, '0')}.csv`,
      hash: '0'.repeat(64),
      processed: spectrum(raise),
    }));
  return { a: group('a', options.raised !== undefined && options.raised !== null), b: group('b', false) };
}

// The s/m/w class of a band from its height relative to the strongest band of the same spectrum (one owner).
import type { BandStrength } from './types.js';

/** Bounds of the classes, relative to the strongest band: strong ≥ 0.6, medium ≥ 0.25, weak below. */
export const BAND_STRENGTH_BOUNDS = { strong: 0.6, medium: 0.25 } as const;

/**
 * Our own convention (IR tables use the letters qualitatively): strong ≥ 0.6 of the spectrum's strongest band,
 * medium ≥ 0.25, weak below. Used for a library entry's stored peaks and for the bands read off an unknown alike.
 */
export function bandStrength(relative: number): BandStrength {
  return relative >= BAND_STRENGTH_BOUNDS.strong ? 's' : relative >= BAND_STRENGTH_BOUNDS.medium ? 'm' : 'w';
}

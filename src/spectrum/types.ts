// Shared shapes of the spectrum layer: a spectrum is two parallel typed arrays, never an array of point objects.

/** Wavenumber in cm⁻¹, strictly ascending after `sortAndMerge`; absorbance (decadic) of the same length. */
export interface Spectrum {
  readonly wavenumber: Float64Array;
  readonly absorbance: Float64Array;
}

/**
 * The absorbance ceiling (A = 4, T = 10⁻⁴): a transmittance at or below it is the noise of a saturated band, clipped
 * to it on reading and kept out of scoring, peaks and the fit (common practice: a bench's photometric range ends near
 * A = 3–4).
 */
export const ABSORBANCE_CEILING = 4;

/** A band maximum found in a spectrum. Positions in cm⁻¹ with sub-point precision. */
export interface Peak {
  position: number;
  height: number;
  prominence: number;
  /** Full width at half prominence, cm⁻¹. */
  fwhm: number;
}

export type QcCode =
  | 'saturation'
  | 'negative-absorbance'
  | 'low-snr'
  | 'spikes'
  | 'coverage-gap'
  | 'coarse-spacing'
  | 'coarse-resolution'
  | 'narrow-coverage'
  | 'near-duplicate'
  | 'low-dynamic-range';

export interface QcFlag {
  code: QcCode;
  /** An error blocks an add unless forced; a warning is stored and shown. */
  level: 'error' | 'warning';
  message: string;
  /** The measured figure behind the flag (SNR, maximum absorbance, gap width …), where there is one. */
  value?: number;
}

/**
 * Refractive indices of the common ATR crystals in the mid-infrared (near 1000 cm⁻¹; Harrick, Internal Reflection
 * Spectroscopy, 1967, and common practice): each preset is used at 45° incidence unless the recipe gives an angle.
 */
export const ATR_CRYSTALS = {
  diamond: 2.4,
  znse: 2.4,
  ge: 4.0,
} as const;
export type AtrCrystal = keyof typeof ATR_CRYSTALS;

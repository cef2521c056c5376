// Shared shapes of the spectrum layer: a spectrum is two parallel typed arrays, never an array of point objects.

/** Wavenumber in cm⁻¹, strictly ascending after `sortAndMerge`; absorbance (decadic) of the same length. */
export interface Spectrum {
  readonly wavenumber: Float64Array;
  readonly absorbance: Float64Array;
}

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

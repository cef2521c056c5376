// Absorbance of a set of pseudo-Voigt bands on a wavenumber axis: the model behind every synthetic demo spectrum.

export interface Band {
  /** Centre, cm⁻¹. */
  position: number;
  /** Full width at half maximum, cm⁻¹. */
  fwhm: number;
  /** Peak height relative to the strongest band of the compound. */
  height: number;
}

export interface BandProfileOptions {
  /** Lorentzian fraction of the pseudo-Voigt shape (condensed-phase bands are mostly Lorentzian-Gaussian mixes).
   * @default 0.5 */
  lorentzianFraction?: number;
  /** Height of the strongest band in absorbance units.
   * @default 1 */
  scale?: number;
}

export function bandProfile(
  wavenumber: Float64Array,
  bands: readonly Band[],
  options: BandProfileOptions = {},
): Float64Array {
  const eta = options.lorentzianFraction ?? 0.5;
  const scale = options.scale ?? 1;
  const out = new Float64Array(wavenumber.length);
  for (const band of bands) {
    const hw = band.fwhm / 2;
    const sigma2 = (band.fwhm / (2 * Math.sqrt(2 * Math.LN2))) ** 2;
    const h = band.height * scale;
    for (let i = 0; i < wavenumber.length; i++) {
      const d = wavenumber[i]! - band.position;
      const lorentz = (hw * hw) / (d * d + hw * hw);
      const gauss = Math.exp((-d * d) / (2 * sigma2));
      out[i] = out[i]! + h * (eta * lorentz + (1 - eta) * gauss);
    }
  }
  return out;
}

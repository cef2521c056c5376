// ATR correction: turns an ATR absorbance spectrum into its transmission equivalent by undoing the penetration
// depth's growth with wavelength.
import { penetrationDepth } from './penetrationDepth.js';
import { ATR_CRYSTALS, type AtrCrystal, type Spectrum } from './types.js';

export interface AtrCorrectOptions {
  /** Crystal preset, for its refractive index. @default 'diamond' */
  crystal?: AtrCrystal;
  /** Refractive index of the crystal, overriding the preset's. @default ATR_CRYSTALS[crystal] */
  crystalIndex?: number;
  /** Refractive index of the sample. @default 1.5 */
  sampleIndex?: number;
  /** Angle of incidence, degrees. @default 45 */
  angle?: number;
  /** Wavenumber (cm⁻¹) at which the corrected absorbance equals the measured one. @default 1000 */
  referenceWavenumber?: number;
}

/**
 * A(ν̃) · d_p(ν̃_ref) / d_p(ν̃), with d_p Harrick's penetration depth (see `penetrationDepth`): an ATR spectrum
 * samples a layer whose thickness grows as λ, so its bands at low wavenumber are too strong next to a transmission
 * spectrum's. With a constant sample index the factor is ν̃ / ν̃_ref whatever the crystal (the crystal sets only
 * the absolute depth, which normalisation removes); anomalous dispersion near strong bands is not modelled. The
 * input is not modified.
 */
export function atrCorrect(spectrum: Spectrum, options: AtrCorrectOptions = {}): Spectrum {
  const depthOptions = {
    crystalIndex: options.crystalIndex ?? ATR_CRYSTALS[options.crystal ?? 'diamond'],
    sampleIndex: options.sampleIndex ?? 1.5,
    angle: options.angle ?? 45,
  };
  const atReference = penetrationDepth(options.referenceWavenumber ?? 1000, depthOptions);
  const x = spectrum.wavenumber;
  const absorbance = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) {
    absorbance[i] = (spectrum.absorbance[i]! * atReference) / penetrationDepth(x[i]!, depthOptions);
  }
  return { wavenumber: x.slice(), absorbance };
}

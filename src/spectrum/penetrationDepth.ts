// Penetration depth of the evanescent wave at an ATR crystal: how far into the sample an ATR spectrum looks.

export interface PenetrationDepthOptions {
  /** Refractive index of the crystal (n₁). @default 2.4 (diamond) */
  crystalIndex?: number;
  /** Refractive index of the sample (n₂). @default 1.5 (organic and dried biological material, common practice) */
  sampleIndex?: number;
  /** Angle of incidence inside the crystal, degrees. @default 45 */
  angle?: number;
}

/**
 * Harrick's penetration depth d_p = λ / (2π n₁ √(sin²θ − (n₂/n₁)²)) in µm at the wavenumber ν̃ (cm⁻¹), with λ the
 * vacuum wavelength 10⁴/ν̃ µm (Harrick, Internal Reflection Spectroscopy, 1967). NaN when the angle is at or below
 * the critical angle (no total internal reflection) or the wavenumber is not positive.
 */
export function penetrationDepth(wavenumber: number, options: PenetrationDepthOptions = {}): number {
  const n1 = options.crystalIndex ?? 2.4;
  const n2 = options.sampleIndex ?? 1.5;
  const theta = ((options.angle ?? 45) * Math.PI) / 180;
  const s = Math.sin(theta);
  const root = s * s - (n2 / n1) ** 2;
  if (!(root > 0) || !(wavenumber > 0)) return Number.NaN;
  const lambda = 1e4 / wavenumber;
  return lambda / (2 * Math.PI * n1 * Math.sqrt(root));
}

// Converts a Whittaker stiffness given in wavenumber units into the per-point λ the banded solver takes.

export interface LambdaPerPointOptions {
  /**
   * Order d of the differences penalised.
   * @default 2
   */
  differences?: 1 | 2;
  /**
   * Point spacing h in cm⁻¹; undefined means λ is already per point and is returned unchanged.
   * @default undefined
   */
  spacing?: number;
}

/**
 * The Whittaker objective Σ wᵢ(yᵢ − zᵢ)² + λₚ Σ (Δᵈz)ᵢ² approximates, at point spacing h, the continuous
 * (1/h)·[∫ w (y − z)² dν̃ + λ ∫ (z⁽ᵈ⁾)² dν̃] with Δᵈz ≈ hᵈ z⁽ᵈ⁾ and Σ ≈ (1/h)∫: multiplying through by h,
 * λₚ = λ·h^(−2d) (Eilers, Anal. Chem. 75:3631, 2003, the penalty as a discretised roughness integral).
 * λ in cm^(2d) thus equals the per-point λ of a 1 cm⁻¹ spectrum.
 */
export function lambdaPerPoint(lambda: number, options: LambdaPerPointOptions = {}): number {
  const spacing = options.spacing;
  if (spacing === undefined) return lambda;
  return lambda * spacing ** (-2 * (options.differences ?? 2));
}

// Detection limit of one mixture component in the ICH Q2(R1) form 3.3 σ / S.

export interface DetectionLimitInput {
  /** Noise standard deviation of one effective independent point (processed units). */
  sigma: number;
  /**
   * Sensitivity S: the response norm per unit weight that the fit can attribute to this component alone, i.e.
   * 1/√((AᵀA)⁻¹ⱼⱼ) over the baseline-projected columns (the part no other component or baseline term can mimic).
   */
  sensitivity: number;
  /** Σ|vector| of the component over the fit points (its signal per unit weight). */
  area: number;
  /** Summed area of the fitted components (weight × area), the signal shares are taken of. */
  signal: number;
}

export interface DetectionLimitOptions {
  /** The ICH multiplier (3.3 ≈ 2 × 1.645 for 5 % false positives and negatives, ICH Q2(R1) §6.3). @default 3.3 */
  factor?: number;
}

export interface DetectionLimit {
  /** Smallest detectable weight. */
  weight: number;
  /** That weight's share of the signal, if the component were present at it. */
  share: number;
}

/** LOD weight = factor × σ / S; its share = LOD·area / (signal + LOD·area). */
export function detectionLimit(
  input: DetectionLimitInput,
  options: DetectionLimitOptions = {},
): DetectionLimit {
  const factor = options.factor ?? 3.3;
  const weight =
    input.sensitivity > 0 ? (factor * input.sigma) / input.sensitivity : Number.POSITIVE_INFINITY;
  const part = weight * input.area;
  const share = Number.isFinite(part) ? part / (input.signal + part) : 1;
  return { weight, share };
}

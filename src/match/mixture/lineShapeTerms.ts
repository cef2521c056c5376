// First and second derivatives of a reference on the grid: the terms that let a fitted band shift and broaden a little.

export interface LineShapeTermsOptions {
  /** Grid step, cm⁻¹: the derivatives are per cm⁻¹ (their scale does not change a fit; it names the shift). @default 1 */
  step?: number;
}

/**
 * v(ν − δ) ≈ v − δ·v′ and a slightly broader or narrower band ≈ v + κ·v″ (first terms of a Taylor expansion), so a
 * reference measured on another bench — shifted by a fraction of the point spacing, a little broader or with another
 * Lorentzian share — is fitted by v plus free multiples of v′ and v″. Both integrate to ~0 over a band, so they leave
 * the component's area, and so its share, unchanged. Central differences over covered neighbours; a point without
 * both neighbours (an edge, a gap) gets 0, so the terms never reach outside what the reference covers.
 */
export function lineShapeTerms(
  vector: ArrayLike<number>,
  options: LineShapeTermsOptions = {},
): [Float64Array, Float64Array] {
  const step = options.step ?? 1;
  const n = vector.length;
  const first = new Float64Array(n);
  const second = new Float64Array(n);
  for (let i = 1; i < n - 1; i++) {
    const a = vector[i - 1]!;
    const m = vector[i]!;
    const b = vector[i + 1]!;
    if (!(Number.isFinite(a) && Number.isFinite(m) && Number.isFinite(b))) continue;
    first[i] = (b - a) / (2 * step);
    second[i] = (b - 2 * m + a) / (step * step);
  }
  return [first, second];
}

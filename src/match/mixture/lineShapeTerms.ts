// First and second derivatives of a reference on the grid: the terms that let a fitted band shift and broaden a little.
import FFT from 'fft.js';

export interface LineShapeTermsOptions {
  /** Grid step, cm⁻¹: the derivatives are per cm⁻¹ (their scale does not change a fit; it names the shift). @default 1 */
  step?: number;
  /** Add the first-order term of a Lorentzian (homogeneous) broadening as a third term. @default true */
  lorentzian?: boolean;
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
): Float64Array[] {
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
  if (options.lorentzian === false) return [first, second];
  return [first, second, lorentzianBroadening(vector, step)];
}

/**
 * d/dγ (L_γ ⊗ v) at γ = 0 for a Lorentzian L of half-width γ: in Fourier space the kernel is e^{−γ|ω|}, so the term
 * is −|ω|·V(ω) (the Gaussian's e^{−σ²ω²/2} gives −ω²/2·V, the second derivative). Points outside the reference's
 * coverage count as 0 and get 0; the record is padded to twice its length with a raised-cosine blend between its ends.
 */
function lorentzianBroadening(vector: ArrayLike<number>, step: number): Float64Array {
  const n = vector.length;
  let size = 2;
  while (size < 2 * n) size *= 2;
  const value = (i: number): number => (Number.isFinite(vector[i]!) ? vector[i]! : 0);
  const data = new Float64Array(2 * size);
  for (let i = 0; i < n; i++) data[2 * i] = value(i);
  const pad = size - n;
  for (let j = 0; j < pad; j++) {
    const u = (j + 1) / (pad + 1);
    data[2 * (n + j)] = value(n - 1) + (value(0) - value(n - 1)) * 0.5 * (1 - Math.cos(Math.PI * u));
  }
  const fft = new FFT(size);
  const spectrum = new Float64Array(2 * size);
  fft.transform(spectrum, data);
  for (let k = 0; k < size; k++) {
    const f = k <= size / 2 ? k : size - k;
    const omega = (2 * Math.PI * f) / (size * step);
    spectrum[2 * k] = -omega * spectrum[2 * k]!;
    spectrum[2 * k + 1] = -omega * spectrum[2 * k + 1]!;
  }
  const back = new Float64Array(2 * size);
  fft.inverseTransform(back, spectrum);
  return Float64Array.from({ length: n }, (_, i) => (Number.isFinite(vector[i]!) ? back[2 * i]! : 0));
}

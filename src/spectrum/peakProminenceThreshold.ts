// The default prominence a maximum needs to count as a band: scaled to the data's range and its noise.
export interface PeakProminenceThresholdOptions {
  /**
   * Fraction of the spectrum's range (largest − smallest finite value), so the threshold follows the data
   * whatever its units or normalisation.
   * @default 0.01
   */
  relativeProminence?: number;
  /**
   * Multiple of the noise standard deviation estimated from the data (median absolute second difference of
   * consecutive finite points / (0.6745·√6), which band shapes barely move). White noise alone makes maxima
   * of about 6–8 σ prominence over a few thousand points; 10 σ is also the level ICH Q2(R1) takes as a
   * quantitation limit.
   * @default 10
   */
  noiseFactor?: number;
}

/** max(relativeProminence × range, noiseFactor × σ̂) over the finite values of `absorbance`; 0 for flat data. */
export function peakProminenceThreshold(
  absorbance: Float64Array,
  options: PeakProminenceThresholdOptions = {},
): number {
  const n = absorbance.length;
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < n; i++) {
    const v = absorbance[i]!;
    if (!Number.isFinite(v)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (!(hi > lo)) return 0;
  const d2 = new Float64Array(Math.max(0, n - 2));
  let count = 0;
  for (let i = 1; i < n - 1; i++) {
    const v = absorbance[i - 1]! - 2 * absorbance[i]! + absorbance[i + 1]!;
    if (Number.isFinite(v)) d2[count++] = Math.abs(v);
  }
  let sigma = 0;
  if (count > 0) {
    const sorted = d2.subarray(0, count).sort();
    const mid = count >> 1;
    const median = count % 2 === 1 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
    // A second difference of white noise has variance 6σ²; 0.6745 turns a median absolute value into σ.
    sigma = median / (0.6745 * Math.sqrt(6));
  }
  return Math.max((options.relativeProminence ?? 0.01) * (hi - lo), (options.noiseFactor ?? 10) * sigma);
}

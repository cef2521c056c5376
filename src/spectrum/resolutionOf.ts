// A spectrum's instrument resolution in cm⁻¹: the stated value when there is one, else estimated from its sampling.

import type { Spectrum } from './types.js';

export interface ResolutionOfOptions {
  /**
   * The resolution the file or the metadata states, cm⁻¹ (JCAMP-DX `##RESOLUTION=`, a sidecar or manifest field).
   * Anything but a finite positive number counts as not stated.
   * @default undefined (estimate it)
   */
  stated?: unknown;
  /**
   * Without a stated value, the estimate is this many median point spacings: a sampled spectrum shows no detail
   * finer than two points (Nyquist), and an FTIR spectrum zero-filled by 2 has about two points per resolution
   * element (common practice). A spectrum exported on a finer interpolated axis is sharper-looking than it is, so
   * the estimate can be too fine; it is flagged as estimated.
   * @default 2
   */
  factor?: number;
}

export interface Resolution {
  /** Full width at half maximum of the instrument line shape, cm⁻¹. */
  value: number;
  /** True when `value` was estimated from the point spacing rather than stated. */
  estimated: boolean;
}

/**
 * The stated resolution, or `factor` × the median spacing of the points (sorted first; repeated wavenumbers ignored)
 * marked as estimated. A spectrum of fewer than two distinct points has no spacing: its estimate is NaN.
 */
export function resolutionOf(spectrum: Spectrum, options: ResolutionOfOptions = {}): Resolution {
  const stated = options.stated;
  if (typeof stated === 'number' && Number.isFinite(stated) && stated > 0) {
    return { value: stated, estimated: false };
  }
  const x = Float64Array.from(spectrum.wavenumber).sort();
  const steps: number[] = [];
  for (let i = 1; i < x.length; i++) {
    const d = x[i]! - x[i - 1]!;
    if (d > 0) steps.push(d);
  }
  if (steps.length === 0) return { value: Number.NaN, estimated: true };
  steps.sort((a, b) => a - b);
  const median =
    steps.length % 2 === 1
      ? steps[steps.length >> 1]!
      : (steps[steps.length / 2 - 1]! + steps[steps.length / 2]!) / 2;
  return { value: (options.factor ?? 2) * median, estimated: true };
}

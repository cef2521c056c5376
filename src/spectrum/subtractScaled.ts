// One spectrum minus a scaled reference, the scale fitted by least squares in a window or given: a difference spectrum.
import { BandshelfError } from '../error.js';
import type { WavenumberWindow } from '../schema/recipe.js';
import { fitReferences } from './fitReferences.js';
import { interpolateAtWavenumbers } from './interpolateAtWavenumbers.js';
import type { Spectrum } from './types.js';

export interface SubtractScaledOptions {
  /** 'auto' fits the scale in `window`; a number is used as given. @default 'auto' */
  scale?: 'auto' | number;
  /** Where the scale is fitted, cm⁻¹ (the water combination band). @default { min: 1900, max: 2300 } */
  window?: WavenumberWindow;
  /** Reference points further apart than this (cm⁻¹) are not interpolated across. @default 16 */
  maxGap?: number;
  /** The file the spectrum came from, for error messages. @default undefined */
  file?: string;
}

export interface SubtractScaledResult {
  /** spectrum − scale × reference, at the spectrum's wavenumbers the reference covers. */
  spectrum: Spectrum;
  scale: number;
  /** Ordinary least-squares standard error of the scale; null for a given scale. */
  standardError: number | null;
  /** Points of the fit inside the window; 0 for a given scale. */
  points: number;
}

/**
 * With `scale: 'auto'` the fit is `spectrum ≈ s·reference + a + b·(ν̃ − ν̃̄)` over the window (fitReferences: the
 * offset and slope keep a tilted baseline from biasing s; only s·reference is subtracted). Its standard error
 * assumes independent residuals of equal variance, so it is a lower bound on real, correlated spectra.
 */
export function subtractScaled(
  spectrum: Spectrum,
  reference: Spectrum,
  options: SubtractScaledOptions = {},
): SubtractScaledResult {
  const scale = options.scale ?? 'auto';
  const window = options.window ?? { min: 1900, max: 2300 };
  const maxGap = options.maxGap ?? 16;
  let result: SubtractScaledResult;
  if (scale === 'auto') {
    const fit = fitReferences(spectrum, [reference], [window], {
      maxGap,
      ...(options.file === undefined ? {} : { file: options.file }),
    });
    result = {
      spectrum: fit.spectrum,
      scale: fit.scales[0]!,
      standardError: fit.standardErrors[0]!,
      points: fit.points,
    };
  } else {
    if (!Number.isFinite(scale)) {
      throw new BandshelfError('BAD_OPTION', `the scale must be a finite number, not ${scale}`, {
        field: 'scale',
      });
    }
    const r = interpolateAtWavenumbers(reference, spectrum.wavenumber, { maxGap });
    const keep: number[] = [];
    for (let i = 0; i < r.length; i++) if (!Number.isNaN(r[i]!)) keep.push(i);
    result = {
      spectrum: {
        wavenumber: Float64Array.from(keep, (i) => spectrum.wavenumber[i]!),
        absorbance: Float64Array.from(keep, (i) => spectrum.absorbance[i]! - scale * r[i]!),
      },
      scale,
      standardError: null,
      points: 0,
    };
  }
  if (result.spectrum.wavenumber.length < 2) {
    throw new BandshelfError('SMALL_OVERLAP', 'the reference covers fewer than two points of the spectrum', {
      ...(options.file === undefined ? {} : { file: options.file }),
    });
  }
  return result;
}

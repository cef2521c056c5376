// Named starting recipes for `init --preset`: the sample forms whose processing differs most.
import type { RecipeInput } from './recipe.js';

/**
 * `liquid-biofluid`: a liquid serum, plasma, urine or saliva spectrum is mostly water. Liquid water (library entry
 * `water-liquid`, to be added first) is fitted with an offset and a slope on the 2300–1900 cm⁻¹ combination band,
 * where the solutes hardly absorb (common practice), and subtracted before the baseline step when its scale is at
 * least 3 standard errors above 0 (a dried or water-free spectrum is not given a water band that noise and baseline
 * made up; 3σ as a detection criterion, common practice); a water-vapour entry can
 * be appended to `subtract.references`. `dried-film`: a dried film has little water left; no subtraction, a
 * rubber-band baseline and amide I band normalisation, which takes out the film's thickness. Both bring every
 * spectrum to a common 4 cm⁻¹ resolution (Gaussian line shape) first: biofluid spectra are usually recorded at 4 cm⁻¹
 * (Baker et al., Nature Protocols 9:1771, 2014, from memory) and their bands are 10 cm⁻¹ wide or more, so degrading
 * a sharper bench to 4 cm⁻¹ loses nothing a biofluid band shows and takes the instrument out of the comparison.
 */
export const RECIPE_PRESETS = {
  'liquid-biofluid': {
    version: 2,
    resolution: { target: 4 },
    subtract: { references: [{ id: 'water-liquid' }], windows: [{ min: 1900, max: 2300 }], minZ: 3 },
    baseline: { method: 'rubberband' },
    smooth: { width: 9, order: 2 },
    normalise: { method: 'vector' },
  },
  'dried-film': {
    version: 2,
    resolution: { target: 4 },
    baseline: { method: 'rubberband' },
    smooth: { width: 9, order: 2 },
    normalise: { method: 'band', window: { min: 1600, max: 1700 } },
  },
} as const satisfies Record<string, RecipeInput>;
export type RecipePresetName = keyof typeof RECIPE_PRESETS;

// The model behind one synthetic reference of the benchmarks (invented, labelled synthetic): its class, Gaussian
// bands, sloping offset and noise level, with its random stream left positioned for the per-point noise.
import { seededRandom } from '../src/demo/seededRandom.js';

export interface SyntheticReferenceModelOptions {
  /** Seed of entry 0; entry k draws from `seed + 7919 k`, so two benchmarks can keep their own streams.
   * @default 0x5ca1e */
  seed?: number;
}

export interface SyntheticReferenceModel {
  cls: string;
  bands: { centre: number; width: number; height: number }[];
  /** Absorbance offset and slope per cm⁻¹ of the baseline. */
  offset: number;
  slope: number;
  /** Half-range of the (triangular-ish, three-uniform) noise, absorbance. */
  noise: number;
  /** The entry's stream, positioned after the model's own draws. */
  rnd: () => number;
}

/**
 * Band centres (cm⁻¹) per class, from the band-assignment table of the project's outside references (Barth 2007;
 * Movasaghi, Rehman & Rehman 2008): proteins amide A/I/II/III, lipids CH₂ stretches and ester C=O, carbohydrates
 * C–O stretches, nucleic acids PO₂⁻ stretches, metabolites and drugs a scatter of fingerprint bands.
 */
const CLASS_BANDS: Record<string, number[]> = {
  protein: [3300, 2960, 1652, 1545, 1450, 1400, 1240],
  lipid: [3010, 2922, 2852, 1740, 1467, 1170],
  carbohydrate: [3350, 2930, 1150, 1080, 1050, 1025],
  'nucleic-acid': [3300, 1715, 1650, 1240, 1080, 970],
  metabolite: [3200, 1620, 1577, 1468, 1417, 1160, 1043],
  drug: [3300, 1760, 1680, 1600, 1510, 1370, 1240, 1010],
};
const CLASSES = Object.keys(CLASS_BANDS);

/** Entry k's class (cycling through six), its class bands jittered, 3–7 bands of its own, baseline and noise. */
export function syntheticReferenceModel(
  k: number,
  options: SyntheticReferenceModelOptions = {},
): SyntheticReferenceModel {
  const rnd = seededRandom((options.seed ?? 0x5ca1e) + k * 7919).uniform;
  const cls = CLASSES[k % CLASSES.length]!;
  const bands = CLASS_BANDS[cls]!.map((c) => ({
    centre: c + (rnd() - 0.5) * 16,
    width: 8 + rnd() * 22,
    height: 0.05 + rnd() * 0.6,
  }));
  // A few bands of its own, so no two entries are near-duplicates.
  for (let j = 0; j < 3 + Math.floor(rnd() * 5); j++) {
    bands.push({ centre: 650 + rnd() * 3300, width: 5 + rnd() * 25, height: 0.02 + rnd() * 0.3 });
  }
  const offset = rnd() * 0.05;
  const slope = (rnd() - 0.5) * 2e-5;
  const noise = 2e-4 + rnd() * 3e-4;
  return { cls, bands, offset, slope, noise, rnd };
}

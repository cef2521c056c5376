// One synthetic reference spectrum as CSV text for the scale benchmarks (invented, labelled synthetic): by default
// 3,350 points from 650 to 3999 cm⁻¹ at 1 cm⁻¹, Gaussian bands at class-typical positions plus a few of its own, a
// sloping offset and noise. The same k and options always give the same bytes.
import { seededRandom } from '../src/demo/seededRandom.js';

export interface SyntheticReferenceCsvOptions {
  /** Points in the file.
   * @default 3350 */
  points?: number;
  /** Lowest wavenumber, cm⁻¹.
   * @default 650 */
  start?: number;
  /** Spacing of the points, cm⁻¹.
   * @default 1 */
  step?: number;
  /** Decimals of the absorbance column.
   * @default 6 */
  decimals?: number;
  /** Seed of entry 0; entry k draws from `seed + 7919 k`, so two benchmarks can keep their own streams.
   * @default 0x5ca1e */
  seed?: number;
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

export function syntheticReferenceCsv(
  k: number,
  options: SyntheticReferenceCsvOptions = {},
): { id: string; class: string; csv: string } {
  const { points = 3350, start = 650, step = 1, decimals = 6, seed = 0x5ca1e } = options;
  const rnd = seededRandom(seed + k * 7919).uniform;
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
  const lines = ['wavenumber_cm-1,absorbance'];
  for (let i = 0; i < points; i++) {
    const x = start + step * i;
    let y = offset + slope * (x - start) + (rnd() + rnd() + rnd() - 1.5) * noise;
    for (const b of bands) y += b.height * Math.exp(-0.5 * ((x - b.centre) / b.width) ** 2);
    lines.push(`${x},${y.toFixed(decimals)}`);
  }
  return { id: `synthetic-${String(k).padStart(7, '0')}`, class: cls, csv: `${lines.join('\n')}\n` };
}

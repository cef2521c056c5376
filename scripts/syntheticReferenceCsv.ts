// One synthetic reference spectrum as CSV text for the scale benchmarks (invented, labelled synthetic): by default
// 3,350 points from 650 to 3999 cm⁻¹ at 1 cm⁻¹, Gaussian bands at class-typical positions plus a few of its own, a
// sloping offset and noise. The same k and options always give the same bytes.
import { syntheticReferenceModel } from './syntheticReferenceModel.js';

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

export function syntheticReferenceCsv(
  k: number,
  options: SyntheticReferenceCsvOptions = {},
): { id: string; class: string; csv: string } {
  const { points = 3350, start = 650, step = 1, decimals = 6, seed = 0x5ca1e } = options;
  const { cls, bands, offset, slope, noise, rnd } = syntheticReferenceModel(k, { seed });
  const lines = ['wavenumber_cm-1,absorbance'];
  for (let i = 0; i < points; i++) {
    const x = start + step * i;
    let y = offset + slope * (x - start) + (rnd() + rnd() + rnd() - 1.5) * noise;
    for (const b of bands) y += b.height * Math.exp(-0.5 * ((x - b.centre) / b.width) ** 2);
    lines.push(`${x},${y.toFixed(decimals)}`);
  }
  return { id: `synthetic-${String(k).padStart(7, '0')}`, class: cls, csv: `${lines.join('\n')}\n` };
}

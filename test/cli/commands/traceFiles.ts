// Writes field-resolved sample and reference traces for tests: a Gaussian reference pulse and a sample pulse that is
// the reference attenuated in field (so the absorbance is flat and known) plus an optional free-induction decay.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

export interface TracePairOptions {
  /** Power attenuation of the sample relative to the reference (10⁴ → 4 absorbance units). @default 10000 */
  attenuation?: number;
  /** Delay step, fs. @default 0.5 */
  step?: number;
  /**
   * Number of samples. 4096 at 0.5 fs is a 2 ps window: zero-filled twice its spectrum has points 8.1 cm⁻¹ apart,
   * inside the recipe's 16 cm⁻¹ maximum gap (2048 points, 16.3 cm⁻¹ apart, would leave the whole grid not covered).
   * @default 4096
   */
  points?: number;
  /** Pulse FWHM in time, fs. @default 8 */
  fwhm?: number;
  /** Write a sidecar naming both files (for folder adds). @default true */
  sidecar?: boolean;
}

/** Returns the sample and reference paths; writes `<id>-sample.csv`, `<id>-reference.csv` and `<id>.meta.json`. */
export function writeTracePair(dir: string, id: string, options: TracePairOptions = {}) {
  mkdirSync(dir, { recursive: true });
  const step = options.step ?? 0.5;
  const n = options.points ?? 4096;
  const fwhm = options.fwhm ?? 8;
  const fieldScale = 1 / Math.sqrt(options.attenuation ?? 10000);
  const sigma = fwhm / (2 * Math.sqrt(2 * Math.LN2));
  const t0 = 200;
  // A carrier at 1500 cm⁻¹ (45 THz) keeps the pulse's power inside the mid-infrared.
  const f0 = 1500 * 0.0299792458; // THz = cm⁻¹ × c (cm/ps)
  const ref = ['delay_fs,field'];
  const sam = ['delay_fs,field'];
  for (let i = 0; i < n; i++) {
    const t = i * step;
    const e = Math.exp(-((t - t0) ** 2) / (2 * sigma * sigma)) * Math.cos(2 * Math.PI * f0 * 1e-3 * (t - t0));
    ref.push(`${t},${e.toExponential(12)}`);
    sam.push(`${t},${(e * fieldScale).toExponential(12)}`);
  }
  const sample = join(dir, `${id}-sample.csv`);
  const reference = join(dir, `${id}-reference.csv`);
  writeFileSync(sample, `${sam.join('\n')}\n`);
  writeFileSync(reference, `${ref.join('\n')}\n`);
  if (options.sidecar ?? true) {
    writeFileSync(
      join(dir, `${id}.meta.json`),
      JSON.stringify({
        id,
        name: `${id} (synthetic trace)`,
        technique: 'field-resolved',
        synthetic: true,
        timeDomain: { sample: [`${id}-sample.csv`], reference: [`${id}-reference.csv`] },
      }),
    );
  }
  return { sample, reference };
}

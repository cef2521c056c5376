// The demo's synthetic cohort: two groups of invented dried serum-film spectra as CSV texts, one group with more lipid.
import { gridAxis } from '../spectrum/gridAxis.js';
import { bandProfile } from './bandProfile.js';
import { demoCompounds } from './demoCompounds.js';
import { seededRandom } from './seededRandom.js';

export interface DemoCohortFilesOptions {
  /** Films per group. @default 20 */
  perGroup?: number;
  /** Relative between-film SD of each component's amount. @default 0.1 */
  variation?: number;
  /** How far the triolein amount of the "cases" films is raised, in its between-film SDs. @default 3 */
  raisedBy?: number;
  /** @default 12 */
  seed?: number;
}

/** Amounts of the demo compounds in an invented serum film (arbitrary units, synthetic). */
const FILM: Record<string, number> = {
  'albumin-human': 1,
  'igg-human': 0.4,
  triolein: 0.15,
  cholesterol: 0.05,
  glucose: 0.08,
  urea: 0.05,
};

/**
 * `cases/film-NN.csv` and `controls/film-NN.csv` (paths relative to the cohort folder): Σ amount × compound, each
 * amount varying by `variation` between films, triolein raised in the cases, a sloped baseline and noise, on
 * 4000–600 cm⁻¹ at 2 cm⁻¹. Labelled synthetic in every file's first line.
 */
export function demoCohortFiles(options: DemoCohortFilesOptions = {}): Map<string, string> {
  const n = options.perGroup ?? 20;
  const variation = options.variation ?? 0.1;
  const raisedBy = options.raisedBy ?? 3;
  const rng = seededRandom(options.seed ?? 12);
  const axis = gridAxis({ start: 4000, stop: 600, step: 2 });
  const profiles = new Map(
    Object.keys(FILM).map((id) => {
      const compound = demoCompounds.find((c) => c.id === id)!;
      return [id, bandProfile(axis, compound.bands)];
    }),
  );
  const files = new Map<string, string>();
  for (const group of ['cases', 'controls'] as const) {
    for (let i = 0; i < n; i++) {
      const y = new Float64Array(axis.length);
      for (const [id, amount] of Object.entries(FILM)) {
        let factor = 1 + variation * rng.normal();
        if (group === 'cases' && id === 'triolein') factor += raisedBy * variation;
        const profile = profiles.get(id)!;
        for (let j = 0; j < y.length; j++) y[j] = y[j]! + amount * factor * profile[j]!;
      }
      const offset = 0.02 + 0.01 * rng.normal();
      const slope = 0.000005 * (1 + 0.2 * rng.normal());
      const lines = [`# synthetic demo serum film (${group}), invented data`, 'wavenumber_cm-1,absorbance'];
      for (let j = y.length - 1; j >= 0; j--) {
        const value = y[j]! + offset + slope * (axis[j]! - 600) + 0.0005 * rng.normal();
        lines.push(`${axis[j]},${value.toFixed(6)}`);
      }
      files.set(`${group}/film-${String(i + 1).padStart(2, '0')}.csv`, `${lines.join('\n')}\n`);
    }
  }
  return files;
}

// The synthetic library of the site and matcher benchmarks: N invented spectra of six classes, ingested once by the
// real CLI into a folder under the system's temporary directory and kept there for later runs.
import { existsSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { seededRandom } from '../src/demo/seededRandom.js';
import { syntheticReferenceCsv } from './syntheticReferenceCsv.js';
import { syntheticReferenceModel } from './syntheticReferenceModel.js';

export interface SyntheticSiteLibraryOptions {
  /** Runs the CLI with these arguments (exiting on failure); `what` names the step in a failure message. */
  run: (args: string[], what: string) => unknown;
}

/** Bump when the generator changes, so a cached synthetic library is rebuilt. */
const GENERATOR_VERSION = 2;

/** The site benchmarks' own stream of synthetic references. */
const SEED = 0x5eed;

/** One synthetic entry: a CSV file (1701 points, 600–4000 cm⁻¹ at 2 cm⁻¹, absorbance to 5 decimals) and a sidecar. */
function writeSyntheticEntry(dir: string, k: number): void {
  const { class: cls, csv } = syntheticReferenceCsv(k, {
    points: 1701,
    start: 600,
    step: 2,
    decimals: 5,
    seed: SEED,
  });
  const id = `synthetic-${String(k).padStart(6, '0')}`;
  writeFileSync(join(dir, `${id}.csv`), csv);
  writeFileSync(
    join(dir, `${id}.meta.json`),
    JSON.stringify({
      id,
      name: `Synthetic ${cls} ${k}`,
      class: cls,
      technique: k % 7 === 0 ? 'transmission' : 'atr',
      sampleForm: ['dried film', 'liquid', 'powder'][k % 3],
      tags: ['synthetic', `batch-${k % 25}`],
      synthetic: true,
      notes: 'Invented for the site benchmark (synthetic).',
    }),
  );
}

/**
 * An unknown made of three library entries (0.5, 0.3, 0.2) plus one band no entry has at 1780 cm⁻¹ and noise: the
 * matcher's full report then has a mixture of several components and an unexplained band to find.
 */
function writeMixtureUnknown(path: string, entries: number): void {
  const parts = [1, 2, 3].map((j) => Math.floor((j * entries) / 4));
  const weights = [0.5, 0.3, 0.2];
  const models = parts.map((k) => syntheticReferenceModel(k, { seed: SEED }));
  const rnd = seededRandom(0xbe11).uniform;
  const lines = ['wavenumber_cm-1,absorbance'];
  for (let i = 0; i < 1701; i++) {
    const x = 600 + 2 * i;
    let y = 0.02 + 0.05 * Math.exp(-0.5 * ((x - 1780) / 9) ** 2) + (rnd() + rnd() + rnd() - 1.5) * 3e-4;
    models.forEach((m, n) => {
      let v = m.offset + m.slope * (x - 600);
      for (const b of m.bands) v += b.height * Math.exp(-0.5 * ((x - b.centre) / b.width) ** 2);
      y += weights[n]! * v;
    });
    lines.push(`${x},${y.toFixed(5)}`);
  }
  writeFileSync(path, `${lines.join('\n')}\n`);
}

/** The library (made once) and the path of its synthetic mixture unknown. */
export function syntheticSiteLibrary(
  entries: number,
  options: SyntheticSiteLibraryOptions,
): { library: string; mixtureUnknown: string } {
  const run = options.run;
  const dir = join(tmpdir(), `bandshelf-bench-site-${entries}-v${GENERATOR_VERSION}`);
  const library = join(dir, 'library.sqlite');
  const mixtureUnknown = join(dir, 'unknown-synthetic-mixture.csv');
  const done = join(dir, 'complete');
  if (existsSync(done)) {
    if (!existsSync(mixtureUnknown)) writeMixtureUnknown(mixtureUnknown, entries);
    return { library, mixtureUnknown };
  }
  rmSync(dir, { recursive: true, force: true });
  const files = join(dir, 'files');
  mkdirSync(files, { recursive: true });
  process.stderr.write(`bench: generating ${entries} synthetic spectra in ${dir} (kept for later runs) …\n`);
  for (let k = 0; k < entries; k++) writeSyntheticEntry(files, k);
  run(['init', '--library', library], 'init');
  const start = performance.now();
  run(['add', files, '--library', library, '--force', '--message', 'site benchmark', '--json'], 'add');
  process.stderr.write(`bench: ingested in ${((performance.now() - start) / 1000).toFixed(0)} s\n`);
  rmSync(files, { recursive: true, force: true });
  writeMixtureUnknown(mixtureUnknown, entries);
  writeFileSync(done, '');
  return { library, mixtureUnknown };
}

// A small real library for the match, bands and identify CLI tests: invented compounds (synthetic) as CSV files,
// a 4-component mixture with a 5 % spike, noise and a sloped baseline, and a few awkward unknowns.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { seededRandom } from '../../src/demo/seededRandom.js';
import { type Band, bandshelf, syntheticSpectrum, writeSpectrumCsv } from './bandshelfCli.js';

const b = (position: number, height: number, fwhm: number): Band => ({ position, height, fwhm });

/** Invented reference compounds; band positions follow the shipped assignment table's rows. */
export const COMPOUNDS: Record<string, Band[]> = {
  albumin: [b(3300, 0.3, 150), b(2960, 0.15, 20), b(1652, 1, 30), b(1545, 0.6, 30), b(1240, 0.2, 40)],
  triolein: [b(3008, 0.1, 12), b(2922, 1, 16), b(2852, 0.7, 14), b(1740, 0.6, 18), b(1467, 0.2, 12)],
  glycogen: [b(3350, 0.4, 200), b(1150, 0.6, 25), b(1080, 1, 30), b(1025, 0.9, 25)],
  lactate: [b(1577, 0.5, 14), b(1417, 1, 14), b(1124, 0.4, 12), b(1043, 0.5, 12)],
  urea: [b(3440, 0.5, 60), b(1620, 0.6, 20), b(1468, 1, 18), b(1160, 0.4, 14)],
  dmso: [b(2990, 0.2, 14), b(1015, 1, 14), b(950, 0.5, 12)],
  rna: [b(1715, 0.5, 20), b(1236, 0.8, 24), b(1120, 0.5, 20), b(1080, 1, 24), b(970, 0.4, 16)],
};

/** Shares of the summed band area in the mixture unknown: lactate is the 5 % spike. */
export const MIXTURE_SHARES: Record<string, number> = {
  albumin: 0.5,
  triolein: 0.25,
  glycogen: 0.2,
  lactate: 0.05,
};

function bandArea(bands: readonly Band[]): number {
  // ∫ of a Gaussian = height × fwhm × √(π / (4 ln 2)).
  return bands.reduce((s, band) => s + band.height * band.fwhm * Math.sqrt(Math.PI / (4 * Math.LN2)), 0);
}

/** Writes the mixture unknown: Σ weight × compound, a sloped baseline and seeded noise. */
function writeMixture(path: string): void {
  const rng = seededRandom(7);
  const lines = ['wavenumber_cm-1,absorbance'];
  const parts = Object.entries(MIXTURE_SHARES).map(([id, share]) => {
    const bands = COMPOUNDS[id]!;
    const scale = share / bandArea(bands);
    return syntheticSpectrum(
      bands.map((band) => ({ ...band, height: band.height * scale * 100 })),
      { noise: 0, offset: 0 },
    );
  });
  const x = parts[0]!.x;
  x.forEach((w, i) => {
    let y = 0.01 + 0.00003 * (4000 - w) + 0.0004 * rng.normal();
    for (const p of parts) y += p.y[i]!;
    lines.push(`${w},${y.toFixed(6)}`);
  });
  writeFileSync(path, `${lines.join('\n')}\n`);
}

export interface MatchFixture {
  dir: string;
  library: string;
  /** Unknown files, relative to `dir`. */
  unknowns: {
    mixture: string;
    urea: string;
    lactateQcl: string;
    narrow: string;
    garbage: string;
    folder: string;
  };
}

/** Writes the files and builds `<dir>/<name>` with the real CLI (init + add); `leaveOut` skips compounds. */
export function buildMatchFixture(
  dir: string,
  options: { name?: string; leaveOut?: string[] } = {},
): MatchFixture {
  const name = options.name ?? 'lib.sqlite';
  const refs = join(dir, `refs-${name}`);
  mkdirSync(refs, { recursive: true });
  Object.entries(COMPOUNDS).forEach(([id, bands], k) => {
    if (options.leaveOut?.includes(id)) return;
    writeSpectrumCsv(join(refs, `${id}.csv`), bands, { noise: 0.0002, seed: 10 + k });
  });
  const folder = join(dir, 'unknowns');
  mkdirSync(folder, { recursive: true });
  writeMixture(join(folder, 'serum-mix.csv'));
  writeSpectrumCsv(join(folder, 'urea-film.csv'), COMPOUNDS.urea!, { noise: 0.0005, seed: 99, offset: 0.05 });
  // A tunable-laser-like spectrum: 1750–1000 cm⁻¹ only.
  writeSpectrumCsv(join(folder, 'lactate-qcl.csv'), COMPOUNDS.lactate!, {
    start: 1750,
    stop: 1000,
    noise: 0.0005,
  });
  writeSpectrumCsv(join(dir, 'narrow.csv'), COMPOUNDS.lactate!, { start: 1100, stop: 1000, noise: 0.0005 });
  writeFileSync(join(dir, 'garbage.csv'), 'hello,world\nfoo,bar\n');
  const init = bandshelf(['init', '--library', name], { cwd: dir });
  if (init.code !== 0) throw new Error(`init failed: ${init.stderr}`);
  const add = bandshelf(['add', `refs-${name}`, '--library', name, '--class', 'other'], { cwd: dir });
  if (add.code !== 0) throw new Error(`add failed: ${add.stderr}`);
  return {
    dir,
    library: name,
    unknowns: {
      mixture: 'unknowns/serum-mix.csv',
      urea: 'unknowns/urea-film.csv',
      lactateQcl: 'unknowns/lactate-qcl.csv',
      narrow: 'narrow.csv',
      garbage: 'garbage.csv',
      folder: 'unknowns',
    },
  };
}

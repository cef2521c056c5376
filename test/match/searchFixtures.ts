// Seeded synthetic search sets for the similarity-search tests: families of similar band spectra on a small grid.

import type { ScoringSet } from '../../src/match/searchTypes.js';
import type { Grid } from '../../src/schema/recipe.js';
import { gridAxis } from '../../src/spectrum/gridAxis.js';
import { gridLength } from '../../src/spectrum/gridLength.js';
import { mulberry32 } from '../mulberry32.js';

/** mulberry32: a small seeded generator, identical on every machine. */
export function seeded(seed: number): () => number {
  return mulberry32(seed);
}

export interface FixtureOptions {
  rows: number;
  grid?: Grid;
  seed?: number;
  /** Members per family of similar spectra. */
  family?: number;
  exclude?: { min: number; max: number }[];
}

/** Sums of Gaussian bands, jittered within a family, vector-normalised like the default recipe; NaN in exclusions. */
export function syntheticSet(options: FixtureOptions): ScoringSet & { axis: Float64Array } {
  const grid = options.grid ?? { start: 1800, stop: 800, step: 4 };
  const random = seeded(options.seed ?? 7);
  const exclude = options.exclude ?? [];
  const axis = gridAxis(grid);
  const cols = gridLength(grid);
  const processed = new Float32Array(options.rows * cols);
  const family = options.family ?? 5;
  let bands: { centre: number; width: number; height: number }[] = [];
  for (let r = 0; r < options.rows; r++) {
    if (r % family === 0) {
      bands = Array.from({ length: 6 }, () => ({
        centre: axis[0]! + random() * (axis[cols - 1]! - axis[0]!),
        width: 8 + random() * 30,
        height: 0.2 + random(),
      }));
    }
    const row = vectorFromBands(axis, bands, random, 0.05);
    for (let i = 0; i < cols; i++) {
      const w = axis[i]!;
      processed[r * cols + i] = exclude.some((x) => w >= x.min && w <= x.max) ? Number.NaN : row[i]!;
    }
  }
  return {
    grid,
    recipe: { exclude },
    stateKey: `synthetic-${options.rows}-${options.seed ?? 7}`,
    entries: Array.from({ length: options.rows }, (_, r) => ({
      id: `ref-${r}`,
      revision: 1,
      name: `reference ${r}`,
      class: r % 2 === 0 ? 'protein' : 'lipid',
    })),
    processed,
    axis,
  };
}

/** One spectrum from band parameters with relative jitter, a small offset and noise, unit norm. */
export function vectorFromBands(
  axis: Float64Array,
  bands: { centre: number; width: number; height: number }[],
  random: () => number,
  jitter: number,
): Float64Array {
  const out = new Float64Array(axis.length);
  for (const band of bands) {
    const centre = band.centre + (random() - 0.5) * 4 * jitter * 10;
    const width = band.width * (1 + (random() - 0.5) * jitter);
    const height = band.height * (1 + (random() - 0.5) * 2 * jitter);
    for (let i = 0; i < axis.length; i++) {
      out[i] = out[i]! + height * Math.exp(-0.5 * ((axis[i]! - centre) / width) ** 2);
    }
  }
  let ss = 0;
  for (let i = 0; i < axis.length; i++) {
    out[i] = out[i]! + 0.01 + 0.002 * (random() - 0.5);
    ss += out[i]! ** 2;
  }
  const inv = 1 / Math.sqrt(ss);
  for (let i = 0; i < axis.length; i++) out[i] = out[i]! * inv;
  return out;
}

/** The finite values of two vectors where both are finite and the mask (if any) is set, as plain arrays. */
export function shared(
  a: ArrayLike<number>,
  b: ArrayLike<number>,
  keep?: (i: number) => boolean,
): [number[], number[]] {
  const x: number[] = [];
  const y: number[] = [];
  for (let i = 0; i < a.length; i++) {
    if (!Number.isFinite(a[i]!) || !Number.isFinite(b[i]!) || (keep && !keep(i))) continue;
    x.push(a[i]!);
    y.push(b[i]!);
  }
  return [x, y];
}

// Band-level contrast: each band's integrated area (above a local straight baseline) per spectrum, compared between
// the groups by Welch's t-test, with Benjamini–Hochberg over the bands — far fewer tests than grid points.
import jStatModule from 'jstat';
import type { WavenumberWindow } from '../../schema/recipe.js';
import { findPeaks } from '../../spectrum/findPeaks.js';
import { benjaminiHochberg } from './benjaminiHochberg.js';
import { hedgesG } from './hedgesG.js';
import { welchTTest } from './welchTTest.js';

const { jStat } = jStatModule;

export interface BandAreaTestsInput {
  /** The spectra of each group in the statistics, on the grid (ascending, NaN = not covered). */
  a: readonly ArrayLike<number>[];
  b: readonly ArrayLike<number>[];
  /** The grid's wavenumbers, ascending, cm⁻¹. */
  axis: Float64Array;
}

export interface BandAreaTestsOptions {
  /** Windows to test, cm⁻¹, fixed before looking at the data. @default [] (the bands of the pooled mean) */
  windows?: readonly WavenumberWindow[];
  /** Half-width of a window found on the pooled mean, in that band's FWHM (±1 FWHM holds 98 % of a Gaussian).
   * @default 1 */
  halfWidth?: number;
  /** Only windows whose centre lies inside one of these, cm⁻¹. @default [] (anywhere) */
  ranges?: readonly WavenumberWindow[];
  /** Coverage of the interval of the area difference. @default 0.95 */
  level?: number;
}

export interface BandAreaTest {
  /** The window's centre (the pooled mean's band maximum, or the middle of a given window), cm⁻¹. */
  position: number;
  min: number;
  max: number;
  origin: 'pooled-mean' | 'given';
  /** Mean integrated area per group, absorbance × cm⁻¹. */
  meanA: number;
  meanB: number;
  difference: number;
  lower: number;
  upper: number;
  t: number;
  df: number;
  p: number;
  q: number;
  g: number;
}

/** Windows centred on the bands of the mean of all spectra, groups ignored: a choice blind to the labels. */
function pooledMeanWindows(
  input: BandAreaTestsInput,
  halfWidth: number,
): (WavenumberWindow & { position: number })[] {
  const all = [...input.a, ...input.b];
  const mean = new Float64Array(input.axis.length);
  for (const v of all) for (let j = 0; j < mean.length; j++) mean[j] = mean[j]! + v[j]! / all.length;
  return findPeaks({ wavenumber: input.axis, absorbance: mean }).map((p) => ({
    position: p.position,
    min: p.position - halfWidth * p.fwhm,
    max: p.position + halfWidth * p.fwhm,
  }));
}

/** Σ (v − the straight line through the means of the window's three first and three last points) × step. */
function bandArea(v: ArrayLike<number>, from: number, to: number, step: number): number {
  const edge = (start: number) => (v[start]! + v[start + 1]! + v[start + 2]!) / 3;
  const left = edge(from);
  const right = edge(to - 2);
  const span = to - 1 - (from + 1);
  let area = 0;
  for (let j = from; j <= to; j++) area += v[j]! - (left + ((right - left) * (j - from - 1)) / span);
  return area * step;
}

/**
 * The band-level test. Assumes what the pointwise test does (independent spectra, approximately normal group means,
 * unequal variances allowed) for each window's area. Windows found on the pooled mean are chosen without the group
 * labels, so under the null the choice does not favour any difference (independent filtering: Bourgon, Gentleman &
 * Huber, PNAS 107:9546, 2010). Windows reaching past the grid, narrower than 7 points, or with a spectrum not
 * covered inside are left out. q: Benjamini–Hochberg over the windows tested.
 */
export function bandAreaTests(input: BandAreaTestsInput, options: BandAreaTestsOptions = {}): BandAreaTest[] {
  const { axis } = input;
  const level = options.level ?? 0.95;
  const given = options.windows ?? [];
  const ranges = options.ranges ?? [];
  const windows =
    given.length > 0
      ? given.map((w) => ({
          min: Math.min(w.min, w.max),
          max: Math.max(w.min, w.max),
          position: (w.min + w.max) / 2,
        }))
      : pooledMeanWindows(input, options.halfWidth ?? 1);
  const step = axis.length > 1 ? axis[1]! - axis[0]! : 1;
  const tests: Omit<BandAreaTest, 'q'>[] = [];
  for (const w of windows) {
    if (ranges.length > 0 && !ranges.some((r) => w.position >= r.min && w.position <= r.max)) continue;
    const from = axis.findIndex((x) => x >= w.min - 1e-9);
    let to = axis.length - 1;
    while (to >= 0 && axis[to]! > w.max + 1e-9) to--;
    if (from < 0 || to - from + 1 < 7 || axis[0]! > w.min + step || axis[axis.length - 1]! < w.max - step)
      continue;
    const covered = (v: ArrayLike<number>) => {
      for (let j = from; j <= to; j++) if (!Number.isFinite(v[j]!)) return false;
      return true;
    };
    if (![...input.a, ...input.b].every(covered)) continue;
    const areasA = Float64Array.from(input.a, (v) => bandArea(v, from, to, step));
    const areasB = Float64Array.from(input.b, (v) => bandArea(v, from, to, step));
    const t = welchTTest(areasA, areasB);
    const half =
      Number.isFinite(t.df) && t.standardError > 0
        ? jStat.studentt.inv((1 + level) / 2, t.df) * t.standardError
        : 0;
    tests.push({
      position: w.position,
      min: axis[from]!,
      max: axis[to]!,
      origin: given.length > 0 ? 'given' : 'pooled-mean',
      meanA: t.difference + areasB.reduce((s, x) => s + x, 0) / areasB.length,
      meanB: areasB.reduce((s, x) => s + x, 0) / areasB.length,
      difference: t.difference,
      lower: t.difference - half,
      upper: t.difference + half,
      t: t.t,
      df: t.df,
      p: t.p,
      g: hedgesG(areasA, areasB),
    });
  }
  const q = benjaminiHochberg(tests.map((t) => t.p));
  return tests.map((t, i) => ({ ...t, q: q[i]! })).sort((x, y) => y.position - x.position);
}

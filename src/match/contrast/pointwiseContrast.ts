// Two groups of grid vectors compared at every grid point: means, SDs, Welch's t, its interval, q-values, Hedges' g.
import jStatModule from 'jstat';
import { benjaminiHochberg } from './benjaminiHochberg.js';
import { hedgesG } from './hedgesG.js';
import { welchTTest } from './welchTTest.js';

const { jStat } = jStatModule;

export interface PointwiseContrastOptions {
  /**
   * Coverage of the interval of the difference of means.
   * @default 0.95
   */
  level?: number;
  /**
   * 1 for each grid point to test; the others keep their means, SDs and difference but no test, interval or g (NaN)
   * and stay out of the FDR's m. @default every point
   */
  mask?: Uint8Array;
}

/** One Float64Array per quantity, one value per grid point; NaN where a group has fewer than two values (or untested). */
export interface PointwiseContrast {
  meanA: Float64Array;
  sdA: Float64Array;
  meanB: Float64Array;
  sdB: Float64Array;
  /** Mean A − mean B. */
  difference: Float64Array;
  /** Welch interval of the difference: difference ∓ t(1 − (1 − level)/2, df) · SE. */
  lower: Float64Array;
  upper: Float64Array;
  t: Float64Array;
  df: Float64Array;
  p: Float64Array;
  /** Benjamini–Hochberg q-values over the tested points. */
  q: Float64Array;
  g: Float64Array;
  /** Points tested. */
  tested: number;
}

function valuesAt(vectors: readonly ArrayLike<number>[], j: number): number[] {
  const out: number[] = [];
  for (const v of vectors) {
    const x = v[j]!;
    if (!Number.isNaN(x)) out.push(x);
  }
  return out;
}

function meanSd(values: readonly number[]): [number, number] {
  let s = 0;
  for (const v of values) s += v;
  const mean = s / values.length;
  let ss = 0;
  for (const v of values) ss += (v - mean) ** 2;
  return [mean, Math.sqrt(ss / (values.length - 1))];
}

/**
 * At each point only the spectra that cover it take part; a point where either group has fewer than two values is
 * not tested (NaN throughout) and does not count in the Benjamini–Hochberg m. A point where both groups are constant
 * and equal gets p = 1 and no interval.
 */
export function pointwiseContrast(
  groupA: readonly ArrayLike<number>[],
  groupB: readonly ArrayLike<number>[],
  options: PointwiseContrastOptions = {},
): PointwiseContrast {
  const level = options.level ?? 0.95;
  const cols = groupA[0]?.length ?? groupB[0]?.length ?? 0;
  const make = () => new Float64Array(cols).fill(Number.NaN);
  const out = {
    meanA: make(),
    sdA: make(),
    meanB: make(),
    sdB: make(),
    difference: make(),
    lower: make(),
    upper: make(),
    t: make(),
    df: make(),
    p: make(),
    g: make(),
  };
  let tested = 0;
  const quantile = 1 - (1 - level) / 2;
  const mask = options.mask;
  for (let j = 0; j < cols; j++) {
    const a = valuesAt(groupA, j);
    const b = valuesAt(groupB, j);
    if (a.length < 2 || b.length < 2) continue;
    [out.meanA[j], out.sdA[j]] = meanSd(a);
    [out.meanB[j], out.sdB[j]] = meanSd(b);
    out.difference[j] = out.meanA[j]! - out.meanB[j]!;
    if (mask !== undefined && mask[j] !== 1) continue;
    tested++;
    const w = welchTTest(a, b);
    out.t[j] = w.t;
    out.df[j] = w.df;
    out.p[j] = w.p;
    if (w.standardError > 0) {
      const half = jStat.studentt.inv(quantile, w.df) * w.standardError;
      out.lower[j] = w.difference - half;
      out.upper[j] = w.difference + half;
    }
    out.g[j] = hedgesG(a, b);
  }
  return { ...out, q: benjaminiHochberg(out.p), tested };
}

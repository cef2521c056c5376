// Each spectrum's distance from its group's median spectrum, and which distances are outliers by a robust z.

export interface RobustDistancesOptions {
  /**
   * Modified z-score above which a spectrum is an outlier (Iglewicz & Hoaglin, "How to Detect and Handle
   * Outliers", ASQC 1993, recommend 3.5).
   * @default 3.5
   */
  cutoff?: number;
}

export interface RobustDistances {
  /** RMS of (spectrum − median spectrum) over the points every spectrum covers, one per spectrum. */
  distance: number[];
  /** 0.6745 · (distance − median) / MAD; null when the MAD is 0. */
  robustZ: (number | null)[];
  outlier: boolean[];
}

function median(values: number[]): number {
  const s = [...values].sort((x, y) => x - y);
  const m = s.length >> 1;
  return s.length % 2 === 1 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/**
 * The median spectrum is taken point by point; a point counts only where every spectrum has a value, so a
 * spectrum with narrower coverage is not made distant by its gaps. Only distances far *above* the median flag a
 * spectrum: being close to the median is never suspicious.
 */
export function robustDistances(
  vectors: readonly ArrayLike<number>[],
  options: RobustDistancesOptions = {},
): RobustDistances {
  const cutoff = options.cutoff ?? 3.5;
  const n = vectors.length;
  if (n === 0) return { distance: [], robustZ: [], outlier: [] };
  const cols = vectors[0]!.length;
  const sums = new Float64Array(n);
  let used = 0;
  const column: number[] = new Array(n);
  for (let j = 0; j < cols; j++) {
    let complete = true;
    for (let i = 0; i < n; i++) {
      const v = vectors[i]![j]!;
      if (Number.isNaN(v)) {
        complete = false;
        break;
      }
      column[i] = v;
    }
    if (!complete) continue;
    const m = median(column);
    for (let i = 0; i < n; i++) sums[i] = sums[i]! + (column[i]! - m) ** 2;
    used++;
  }
  const distance = Array.from(sums, (s) => (used === 0 ? 0 : Math.sqrt(s / used)));
  const centre = median(distance);
  const mad = median(distance.map((d) => Math.abs(d - centre)));
  const robustZ = distance.map((d) => (mad > 0 ? (0.6745 * (d - centre)) / mad : null));
  return { distance, robustZ, outlier: robustZ.map((z) => z !== null && z > cutoff) };
}

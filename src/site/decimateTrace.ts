// Thins a trace for display: per bucket the lowest and highest point, so band maxima and minima survive.

export interface DecimateTraceOptions {
  /**
   * At most this many points come back (plus one break marker per not-covered gap; a trace broken into more than
   * maxPoints / 2 runs keeps only the ends of each run and may exceed it). A plot some 1000 px wide
   * shows no more than two distinct values per pixel column, so more points add bytes, not detail.
   * @default 1200
   */
  maxPoints?: number;
}

export interface DecimatedTrace {
  /** Ascending as the input; NaN in `y` marks a break (a not-covered gap) the plot must not bridge. */
  x: Float64Array;
  y: Float64Array;
}

/**
 * Min–max decimation: the finite runs of the trace are cut into buckets of consecutive points, and each bucket
 * keeps its minimum and its maximum in their original order. Every band maximum above the bucket's other points
 * is therefore kept exactly (position and height), unlike plain striding, which can skip the top of a narrow band.
 * The first and last point of each run are always kept so the covered range is drawn in full.
 */
export function decimateTrace(
  x: Float64Array,
  y: Float64Array,
  options: DecimateTraceOptions = {},
): DecimatedTrace {
  const maxPoints = Math.max(4, Math.floor(options.maxPoints ?? 1200));
  const n = Math.min(x.length, y.length);
  // Runs of finite points; a NaN (not covered) separates runs.
  const runs: [number, number][] = [];
  let start = -1;
  for (let i = 0; i < n; i++) {
    const finite = Number.isFinite(y[i]!) && Number.isFinite(x[i]!);
    if (finite && start < 0) start = i;
    if (!finite && start >= 0) {
      runs.push([start, i]);
      start = -1;
    }
  }
  if (start >= 0) runs.push([start, n]);
  const finiteCount = runs.reduce((sum, [a, b]) => sum + (b - a), 0);
  const outX: number[] = [];
  const outY: number[] = [];
  const breakMarker = (): void => {
    if (outX.length > 0) {
      outX.push(Number.NaN);
      outY.push(Number.NaN);
    }
  };
  if (finiteCount <= maxPoints) {
    for (const [a, b] of runs) {
      breakMarker();
      for (let i = a; i < b; i++) {
        outX.push(x[i]!);
        outY.push(y[i]!);
      }
    }
    return { x: Float64Array.from(outX), y: Float64Array.from(outY) };
  }
  // Each bucket yields two points, each run its two ends besides: share the budget by run length.
  const budget = maxPoints - 2 * runs.length;
  for (const [a, b] of runs) {
    breakMarker();
    const length = b - a;
    const buckets = Math.max(0, Math.floor((budget * length) / finiteCount / 2));
    outX.push(x[a]!);
    outY.push(y[a]!);
    if (length > 2) {
      const inner = length - 2;
      for (let k = 0; k < buckets; k++) {
        const from = a + 1 + Math.floor((k * inner) / buckets);
        const to = a + 1 + Math.floor(((k + 1) * inner) / buckets);
        if (to <= from) continue;
        let lo = from;
        let hi = from;
        for (let i = from + 1; i < to; i++) {
          if (y[i]! < y[lo]!) lo = i;
          if (y[i]! > y[hi]!) hi = i;
        }
        const first = Math.min(lo, hi);
        const second = Math.max(lo, hi);
        outX.push(x[first]!);
        outY.push(y[first]!);
        if (second !== first) {
          outX.push(x[second]!);
          outY.push(y[second]!);
        }
      }
    }
    if (length > 1) {
      outX.push(x[b - 1]!);
      outY.push(y[b - 1]!);
    }
  }
  return { x: Float64Array.from(outX), y: Float64Array.from(outY) };
}

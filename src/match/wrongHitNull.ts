// The library's own distribution of best wrong hits: each entry matched against the rest, its own substance left out.

export interface WrongHitNullOptions {
  /**
   * Most entries matched against the rest; a larger library is sampled at evenly spaced rows (deterministic,
   * so the same library state always gives the same null).
   * @default 2000
   */
  maxRows?: number;
  /**
   * Fewest grid points two rows must share to be compared.
   * @default 10
   */
  minPoints?: number;
}

export interface WrongHitNullInput {
  /** Grid points per row. */
  cols: number;
  /** rows × cols, row-major, NaN where not covered (a search set's `processed`). */
  processed: ArrayLike<number>;
  /** One per row; rows of the same substance (equal id, or equal name ignoring case and spaces) never count. */
  entries: readonly { id: string; name: string; cas?: string }[];
}

export interface WrongHitNull {
  metric: 'pearson';
  /** Best wrong Pearson r of each sampled entry, ascending. */
  scores: Float64Array;
  /** Entries in the library, and how many were matched against the rest. */
  entries: number;
  sampled: number;
}

const substanceKey = (e: { id: string; name: string; cas?: string }): string[] => [
  `id:${e.id}`,
  ...(e.name.trim() === '' ? [] : [`name:${e.name.toLowerCase().replace(/\s+/g, ' ').trim()}`]),
  ...(e.cas === undefined || e.cas === '' ? [] : [`cas:${e.cas}`]),
];

/**
 * Pure and browser-safe. Each pair is scored by the Pearson correlation over the grid points both rows cover
 * (the match's own default metric, computed exactly per pair); an entry's best wrong hit is its highest r against
 * any entry of another substance. O(sampled × rows × cols); computed once per library state (the CLI caches it).
 */
export function wrongHitNull(input: WrongHitNullInput, options: WrongHitNullOptions = {}): WrongHitNull {
  const maxRows = options.maxRows ?? 2000;
  const minPoints = options.minPoints ?? 10;
  const { cols, processed, entries } = input;
  const rows = entries.length;
  const keys = entries.map(substanceKey);
  const step = rows > maxRows ? rows / maxRows : 1;
  const sample: number[] = [];
  for (let t = 0; t < rows && sample.length < maxRows; t += step) sample.push(Math.floor(t));
  // Rows that cover every grid point share one set of points with each other: their Pearson r is the dot product of
  // their centred, unit-norm vectors, computed once per row (the same r as the pairwise sums, to rounding).
  const unit = fullRowsUnit(processed, rows, cols);
  const scores: number[] = [];
  for (const a of sample) {
    const own = new Set(keys[a]);
    let best = Number.NEGATIVE_INFINITY;
    const ua = unit[a];
    for (let b = 0; b < rows; b++) {
      if (b === a || keys[b]!.some((k) => own.has(k))) continue;
      const ub = unit[b];
      let r: number;
      if (ua !== undefined && ub !== undefined && cols >= minPoints) {
        r = 0;
        for (let i = 0; i < cols; i++) r += ua[i]! * ub[i]!;
      } else r = pairPearson(processed, a * cols, b * cols, cols, minPoints);
      if (r > best) best = r;
    }
    if (Number.isFinite(best)) scores.push(best);
  }
  return {
    metric: 'pearson',
    scores: Float64Array.from(scores).sort(),
    entries: rows,
    sampled: scores.length,
  };
}

function pairPearson(x: ArrayLike<number>, a: number, b: number, cols: number, minPoints: number): number {
  let n = 0;
  let sa = 0;
  let sb = 0;
  for (let i = 0; i < cols; i++) {
    const u = x[a + i]!;
    const v = x[b + i]!;
    if (Number.isNaN(u) || Number.isNaN(v)) continue;
    n++;
    sa += u;
    sb += v;
  }
  if (n < minPoints) return Number.NaN;
  const ma = sa / n;
  const mb = sb / n;
  let sab = 0;
  let saa = 0;
  let sbb = 0;
  for (let i = 0; i < cols; i++) {
    const u = x[a + i]!;
    const v = x[b + i]!;
    if (Number.isNaN(u) || Number.isNaN(v)) continue;
    sab += (u - ma) * (v - mb);
    saa += (u - ma) ** 2;
    sbb += (v - mb) ** 2;
  }
  return saa > 0 && sbb > 0 ? sab / Math.sqrt(saa * sbb) : Number.NaN;
}

/** Centred, unit-norm copy of each row that covers every grid point (undefined for the others and flat rows). */
function fullRowsUnit(x: ArrayLike<number>, rows: number, cols: number): (Float64Array | undefined)[] {
  const out: (Float64Array | undefined)[] = [];
  for (let r = 0; r < rows; r++) {
    const v = new Float64Array(cols);
    let mean = 0;
    let full = true;
    for (let i = 0; i < cols; i++) {
      const u = x[r * cols + i]!;
      if (Number.isNaN(u)) {
        full = false;
        break;
      }
      v[i] = u;
      mean += u;
    }
    if (!full) {
      out.push(undefined);
      continue;
    }
    mean /= cols;
    let norm = 0;
    for (let i = 0; i < cols; i++) {
      v[i] = v[i]! - mean;
      norm += v[i]! * v[i]!;
    }
    if (!(norm > 0)) {
      out.push(undefined);
      continue;
    }
    const k = 1 / Math.sqrt(norm);
    for (let i = 0; i < cols; i++) v[i] = v[i]! * k;
    out.push(v);
  }
  return out;
}

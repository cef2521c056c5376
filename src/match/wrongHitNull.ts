// The library's own distribution of best wrong hits: each entry matched against the rest, its own substance left out.
import type { Grid, WavenumberWindow } from '../schema/recipe.js';
import { scoringMask } from './scoringMask.js';
import type { Hit } from './searchTypes.js';

/**
 * Scores a block of processed rows (at most 32, all of one coverage) against every row of the set as the match
 * does, returning each query's best `k` hits, best first.
 */
export type WrongHitSearch = (queries: readonly Float32Array[], k: number) => readonly (readonly Hit[])[];

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
  /**
   * The match's own search (kernels, search matrix). With it, the sampled rows are those of the coverage most
   * sample points share (so one search matrix serves them all; a sample point of another coverage moves on to the
   * next row of that coverage before the next sample point), scored in blocks of 32 against every row over the
   * points both cover outside the recipe's exclusion windows, as a match scores; no row but the sampled ones is
   * read. Without it, or when fewer than half the sample points find such a row, each pair is scored exactly in
   * plain JS over the points both rows cover.
   * @default undefined
   */
  search?: WrongHitSearch;
}

export interface WrongHitNullInput {
  /** Grid points per row. */
  cols: number;
  /** rows × cols, row-major, NaN where not covered (a search set's `processed`; with `search`, read only on the
   * plain-JS path). */
  processed: ArrayLike<number>;
  /** Row r alone (a lazily read set's reader). @default a view on `processed` */
  row?: (r: number) => ArrayLike<number>;
  /** The grid and the recipe's exclusion windows: with `search`, a row's coverage is where it is finite outside
   * them. @default every point counts */
  grid?: Grid;
  exclude?: readonly WavenumberWindow[];
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
 * any entry of another substance. O(sampled × rows × cols), at kernel speed with `search`; computed once per
 * library state (the CLI caches it).
 */
export function wrongHitNull(input: WrongHitNullInput, options: WrongHitNullOptions = {}): WrongHitNull {
  const maxRows = options.maxRows ?? 2000;
  const minPoints = options.minPoints ?? 10;
  const { cols, entries } = input;
  const rows = entries.length;
  const keys = entries.map(substanceKey);
  const step = rows > maxRows ? rows / maxRows : 1;
  const sample: number[] = [];
  for (let t = 0; t < rows && sample.length < maxRows; t += step) sample.push(Math.floor(t));
  if (options.search !== undefined && cols >= minPoints) {
    const viaSearch = searchedNull(input, keys, sample, step, options.search);
    if (viaSearch !== null) return viaSearch;
  }
  // Rows that cover every grid point share one set of points with each other: their Pearson r is the dot product of
  // their centred, unit-norm vectors, computed once per row (the same r as the pairwise sums, to rounding).
  const processed = input.processed;
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

/** The kernel path; null when fewer than half the sample points find a fully covered, non-flat row. */
function searchedNull(
  input: WrongHitNullInput,
  keys: string[][],
  sample: readonly number[],
  step: number,
  search: WrongHitSearch,
): WrongHitNull | null {
  const { cols, entries } = input;
  const rows = entries.length;
  const row =
    input.row ?? ((r: number) => Array.prototype.slice.call(input.processed, r * cols, (r + 1) * cols));
  // How many other rows share a substance key with each row: a query needs that many hits, plus itself, plus one.
  const byKey = new Map<string, Set<number>>();
  keys.forEach((ks, r) => {
    for (const k of ks) {
      const members = byKey.get(k) ?? new Set<number>();
      members.add(r);
      byKey.set(k, members);
    }
  });
  const scored =
    input.grid === undefined
      ? new Uint8Array(cols).fill(1)
      : scoringMask(new Float64Array(cols), input.grid, { exclude: input.exclude ?? [] });
  // One search matrix serves every query of one coverage: the coverage most sample points share is the one used.
  const atPoint = sample.map((r) => coverageOf(row(r), scored));
  const tally = new Map<string, number>();
  for (const c of atPoint) if (c !== null) tally.set(c.key, (tally.get(c.key) ?? 0) + 1);
  let common = '';
  for (const [key, count] of tally) if (count > (tally.get(common) ?? 0)) common = key;
  const chosen: { row: number; vector: Float32Array }[] = [];
  sample.forEach((point, j) => {
    const end = Math.min(rows, Math.max(point + 1, Math.floor(point + step)));
    for (let r = point; r < end; r++) {
      const c = r === point ? atPoint[j]! : coverageOf(row(r), scored);
      if (c !== null && c.key === common) {
        chosen.push({ row: r, vector: c.vector });
        break;
      }
    }
  });
  if (chosen.length * 2 < sample.length || chosen.length === 0) return null;
  const scores: number[] = [];
  for (let first = 0; first < chosen.length; first += 32) {
    const block = chosen.slice(first, first + 32);
    const own = block.map((c) => {
      const same = new Set<number>();
      for (const k of keys[c.row]!) for (const r of byKey.get(k)!) same.add(r);
      same.add(c.row);
      return same;
    });
    const k = Math.min(rows, Math.max(...own.map((s) => s.size)) + 1);
    let hits: readonly (readonly Hit[] | null)[];
    try {
      hits = search(
        block.map((c) => c.vector),
        k,
      );
    } catch {
      // A row the search refuses (flat outside the exclusion windows) loses only itself: score the block singly.
      hits = block.map((c) => {
        try {
          return search([c.vector], k)[0]!;
        } catch {
          return null;
        }
      });
    }
    block.forEach((_, j) => {
      const wrong = hits[j]?.find((h) => !own[j]!.has(h.row));
      if (wrong !== undefined && Number.isFinite(wrong.rawScore)) scores.push(wrong.rawScore);
    });
  }
  return {
    metric: 'pearson',
    scores: Float64Array.from(scores).sort(),
    entries: rows,
    sampled: scores.length,
  };
}

/** The row as float32 and its scored points (finite, outside the exclusions) as index runs; null when flat there. */
function coverageOf(
  values: ArrayLike<number>,
  scored: Uint8Array,
): { key: string; vector: Float32Array } | null {
  const vector = Float32Array.from(values);
  const runs: number[] = [];
  let sum = 0;
  let n = 0;
  let open = false;
  for (let i = 0; i <= scored.length; i++) {
    const on = i < scored.length && scored[i] !== 0 && !Number.isNaN(vector[i]!);
    if (on !== open) runs.push(i);
    open = on;
    if (on) {
      sum += vector[i]!;
      n++;
    }
  }
  const mean = sum / n;
  let ss = 0;
  let power = 0;
  for (let i = 0; i < scored.length; i++) {
    if (scored[i] === 0 || Number.isNaN(vector[i]!)) continue;
    ss += (vector[i]! - mean) ** 2;
    power += vector[i]! ** 2;
  }
  // The search refuses a flat query (under 1e-20 of its power left after centring); a flat row has no best r.
  return n > 0 && ss > 1e-12 * power ? { key: runs.join(','), vector } : null;
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

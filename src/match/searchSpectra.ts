// Full-spectrum similarity search: scores processed queries against every row of a search set and ranks the hits.
import { BandshelfError } from '../error.js';
import type { WavenumberWindow } from '../schema/recipe.js';
import { gridLength } from '../spectrum/gridLength.js';
import { buildSearchMatrix } from './buildSearchMatrix.js';
import { coveredSpan } from './coveredSpan.js';
import { derivativeVector } from './derivativeVector.js';
import { maskedRowScore } from './maskedRowScore.js';
import { matrixScores } from './matrixScores.js';
import { metricPreparation } from './metricPreparation.js';
import { processedRow } from './processedRow.js';
import { rowStatus } from './rowStatus.js';
import { scoringMask } from './scoringMask.js';
import { searchMatrixKey } from './searchMatrixKey.js';
import {
  type Hit,
  type KernelRunner,
  type MatrixPreparation,
  type MatrixSource,
  type Metric,
  MIN_OVERLAP_DEFAULT,
  type QuerySummary,
  type ScoringSet,
  type SearchMatrix,
} from './searchTypes.js';
import { topK } from './topK.js';

export interface SearchSpectraOptions {
  /**
   * Similarity measure (see `Metric`).
   * @default 'pearson'
   */
  metric?: Metric;
  /**
   * Wavenumber windows to score over (either order, inclusive); empty scores the whole grid. The recipe's
   * exclusion windows are always left out.
   * @default []
   */
  ranges?: readonly WavenumberWindow[];
  /**
   * Hits per query.
   * @default 10
   */
  k?: number;
  /**
   * Least wavenumber range, cm⁻¹, a query must cover inside the ranges (else SMALL_OVERLAP), and a reference
   * must share with it (else the reference is left out of the ranking).
   * @default MIN_OVERLAP_DEFAULT (200)
   */
  minOverlap?: number;
  /**
   * `auto` scans the int8 copy for single queries when the matrix carries one (large sets) and rescores every
   * row that could rank exactly, so the hits equal the exact scan's; `exact` always scans float32.
   * @default 'auto'
   */
  precision?: 'auto' | 'exact' | 'int8';
  /**
   * Savitzky–Golay first-derivative filter of the `derivative` metric.
   * @default { window: 9, order: 2 }
   */
  derivative?: { window: number; order: number };
  /**
   * Supplies search matrices (e.g. from a disk cache); by default they are built in memory and kept for the
   * set's lifetime (two per set at most).
   * @default undefined
   */
  matrices?: MatrixSource;
  /**
   * Chooses where the kernels run for a matrix (e.g. a worker pool); by default the calling thread.
   * @default undefined
   */
  runner?: (matrix: SearchMatrix) => KernelRunner;
  /**
   * Called once per query with what its search did.
   * @default undefined
   */
  onQuery?: (index: number, summary: QuerySummary) => void;
}

/** Below this fraction of its power left after centring, a vector counts as flat. */
const FLAT = 1e-20;

const METRICS: readonly Metric[] = ['pearson', 'derivative', 'cosine', 'euclidean'];

const memo = new WeakMap<ScoringSet, Map<string, SearchMatrix>>();

/** The default source: build in memory, keep the two most recently used matrices of each set. */
function memoisedMatrix(set: ScoringSet, preparation: MatrixPreparation, mask: Uint8Array, key: string) {
  let kept = memo.get(set);
  if (kept === undefined) {
    kept = new Map();
    memo.set(set, kept);
  }
  const found = kept.get(key);
  if (found !== undefined) {
    kept.delete(key);
    kept.set(key, found);
    return found;
  }
  const built = buildSearchMatrix(set, { preparation, mask });
  kept.set(key, built);
  while (kept.size > 2) kept.delete(kept.keys().next().value!);
  return built;
}

/**
 * `queries` are processed vectors on the set's grid (the library recipe applied; NaN where not covered). Each
 * query is scored over its mask (covered ∩ ranges ∖ exclusions). References covering the whole mask are scored by
 * one matrix pass (queries sharing a mask in blocks of up to 32, reading each row once per block); references
 * covering part of it are scored exactly over the shared points, and left out below `minOverlap`.
 *
 * Negative correlations: `score` clamps them to 0 so the 0–1 scale reads as likeness; ranking and `rawScore` use
 * the signed value.
 */
export function searchSpectra(
  set: ScoringSet,
  queries: readonly ArrayLike<number>[],
  options: SearchSpectraOptions = {},
): Hit[][] {
  const metric = options.metric ?? 'pearson';
  if (!METRICS.includes(metric)) {
    throw new BandshelfError('BAD_OPTION', `unknown metric "${metric}"; use one of ${METRICS.join(', ')}`, {
      field: 'metric',
    });
  }
  const k = options.k ?? 10;
  if (!Number.isInteger(k) || k < 1) {
    throw new BandshelfError('BAD_OPTION', `the number of hits must be a whole number ≥ 1, not ${k}`, {
      field: 'k',
    });
  }
  const minOverlap = options.minOverlap ?? MIN_OVERLAP_DEFAULT;
  if (!Number.isFinite(minOverlap) || minOverlap < 0) {
    throw new BandshelfError('BAD_OPTION', `the minimum overlap must be ≥ 0 cm⁻¹, not ${minOverlap}`, {
      field: 'minOverlap',
    });
  }
  const rows = set.entries.length;
  if (rows === 0) throw new BandshelfError('EMPTY_LIBRARY', 'the library has no entries to search');
  const cols = gridLength(set.grid);
  // A set with a row reader may hold its rows on disk; each row it hands out has `cols` values.
  if (set.row === undefined && set.processed.length !== rows * cols) {
    throw new BandshelfError(
      'BAD_FORMAT',
      `the search set holds ${set.processed.length} values, not ${rows} rows × ${cols} grid points`,
      { field: 'processed' },
    );
  }
  const step = set.grid.step;
  const ranges = checkRanges(options.ranges ?? [], set);
  const derivative = options.derivative ?? { window: 9, order: 2 };
  const preparation = metricPreparation(metric, { derivative });
  const source = options.matrices ?? memoisedMatrix;

  // Transform and mask every query first, so a bad one fails before any work.
  const prepared = queries.map((query, q) => {
    const where = queries.length > 1 ? `query ${q + 1} of ${queries.length}` : 'the unknown';
    if (query.length !== cols) {
      throw new BandshelfError(
        'BAD_FORMAT',
        `${where} has ${query.length} values, the library grid ${cols}: process it onto the grid first`,
        { field: 'query' },
      );
    }
    const vector = preparation.derivative
      ? derivativeVector(query, { ...preparation.derivative, step })
      : Float64Array.from(query);
    const mask = scoringMask(vector, set.grid, { ranges, exclude: set.recipe.exclude });
    const overlap = coveredSpan(mask, step);
    if (overlap < minOverlap || overlap === 0) {
      throw new BandshelfError(
        'SMALL_OVERLAP',
        `${where} covers only ${overlap} cm⁻¹ inside the scoring ranges${describeRanges(ranges)}; at least ` +
          `${minOverlap} cm⁻¹ are needed: widen the ranges or lower the minimum overlap`,
      );
    }
    const key = searchMatrixKey({ stateKey: set.stateKey, preparation, mask });
    return { vector, mask, overlap, key, where };
  });

  const hits: Hit[][] = new Array(queries.length);
  const groups = new Map<string, number[]>();
  prepared.forEach((p, q) => {
    const group = groups.get(p.key);
    if (group) group.push(q);
    else groups.set(p.key, [q]);
  });
  for (const members of groups.values()) {
    const first = prepared[members[0]!]!;
    const matrix = source(set, preparation, first.mask, first.key);
    if (matrix.key !== first.key || matrix.layout.rows !== rows || matrix.layout.cols !== cols) {
      throw new Error(`the matrix source returned a matrix for another key or shape (${matrix.key})`);
    }
    const vectors = members.map((q) => prepareQuery(prepared[q]!, matrix, preparation.centring));
    const precision = options.precision ?? 'auto';
    const scored = matrixScores(matrix, vectors, {
      ...(options.runner ? { runner: options.runner(matrix) } : {}),
      precision: precision === 'exact' ? 'exact' : 'int8',
      exactTop: k + 1,
    });
    const status = new Uint8Array(matrix.memory.buffer, matrix.layout.status, rows).slice();
    members.forEach((q, j) => {
      const p = prepared[q]!;
      const result = scored[j]!;
      const raw = new Float64Array(rows).fill(Number.NaN);
      const overlap = new Float64Array(rows);
      let full = 0;
      let partial = 0;
      let dropped = 0;
      for (let r = 0; r < rows; r++) {
        const s = status[r]!;
        if (s === rowStatus.full) {
          raw[r] = Math.max(-1, Math.min(1, result.scores[r]!));
          overlap[r] = p.overlap;
          full++;
        } else if (s === rowStatus.partial) {
          const row = processedRow(set, r);
          const values = preparation.derivative
            ? derivativeVector(row, { ...preparation.derivative, step })
            : row;
          const exact = maskedRowScore(values, p.vector, p.mask, { centring: preparation.centring, step });
          if (Number.isFinite(exact.score) && exact.overlap >= minOverlap && exact.overlap > 0) {
            raw[r] = exact.score;
            overlap[r] = exact.overlap;
            partial++;
          } else dropped++;
        } else dropped++;
      }
      const ranked = rankHits(set, raw, overlap, metric, k);
      hits[q] = ranked.hits;
      options.onQuery?.(q, {
        metric,
        overlap: p.overlap,
        points: matrix.points,
        fullRows: full,
        partialRows: partial,
        dropped,
        path: result.path,
        rescored: result.rescored,
        mean: ranked.mean,
        sd: ranked.sd,
      });
    });
  }
  return hits;
}

function checkRanges(ranges: readonly WavenumberWindow[], set: ScoringSet): WavenumberWindow[] {
  const lo = Math.min(set.grid.start, set.grid.stop);
  const hi = Math.max(set.grid.start, set.grid.stop);
  return ranges.map((range) => {
    const min = Math.min(range.min, range.max);
    const max = Math.max(range.min, range.max);
    if (!Number.isFinite(min) || !Number.isFinite(max) || max <= min) {
      throw new BandshelfError(
        'BAD_OPTION',
        `a scoring range needs two different wavenumbers, not ${min}:${max}`,
        {
          field: 'ranges',
        },
      );
    }
    if (max < lo || min > hi) {
      throw new BandshelfError(
        'BAD_OPTION',
        `the range ${max}:${min} cm⁻¹ lies outside the library grid (${hi}–${lo} cm⁻¹)`,
        { field: 'ranges' },
      );
    }
    return { min, max };
  });
}

function describeRanges(ranges: readonly WavenumberWindow[]): string {
  if (ranges.length === 0) return '';
  return ` (${ranges.map((r) => `${r.max}–${r.min}`).join(', ')} cm⁻¹)`;
}

/** The query prepared like the matrix rows: centred (or not) and unit norm over the mask, zero elsewhere. */
function prepareQuery(
  p: { vector: Float64Array; mask: Uint8Array; where: string },
  matrix: SearchMatrix,
  centring: MatrixPreparation['centring'],
): Float32Array {
  const { vector, mask } = p;
  const out = new Float32Array(matrix.layout.stride);
  let count = 0;
  let sum = 0;
  for (let i = 0; i < mask.length; i++) {
    if (mask[i] === 0) continue;
    count++;
    sum += vector[i]!;
  }
  const mean = centring === 'centred' ? sum / count : 0;
  let ss = 0;
  let power = 0;
  for (let i = 0; i < mask.length; i++) {
    if (mask[i] === 0) continue;
    ss += (vector[i]! - mean) ** 2;
    power += vector[i]! ** 2;
  }
  // Relative to the signal's power: a constant vector leaves only rounding (≈ 1e-32 of it) after centring.
  if (!(ss > FLAT * power)) {
    throw new BandshelfError(
      'NOT_A_SPECTRUM',
      `${p.where} is flat over the scoring ranges: there is nothing to correlate`,
      { field: 'query' },
    );
  }
  const inv = 1 / Math.sqrt(ss);
  for (let i = 0; i < mask.length; i++) if (mask[i] !== 0) out[i] = (vector[i]! - mean) * inv;
  return out;
}

/** The k best rows with their standing among all scored rows. */
function rankHits(
  set: ScoringSet,
  raw: Float64Array,
  overlap: Float64Array,
  metric: Metric,
  k: number,
): { hits: Hit[]; mean: number; sd: number } {
  const euclidean = metric === 'euclidean';
  // For euclidean the row value is the cosine of the unit vectors; the distance follows from ‖a − b‖² = 2 − 2cos.
  const reported = (r: number) => (euclidean ? Math.sqrt(Math.max(0, 2 - 2 * raw[r]!)) : raw[r]!);
  // One pass in double precision: scores lie in [−1, 2], so sum and sum of squares lose nothing that matters.
  let n = 0;
  let sum = 0;
  let sum2 = 0;
  for (let r = 0; r < raw.length; r++) {
    const c = raw[r]!;
    if (Number.isNaN(c)) continue;
    const v = euclidean ? Math.sqrt(Math.max(0, 2 - 2 * c)) : c;
    n++;
    sum += v;
    sum2 += v * v;
  }
  const mean = n > 0 ? sum / n : Number.NaN;
  const sd = n > 1 ? Math.sqrt(Math.max(0, (sum2 - sum * mean) / (n - 1))) : Number.NaN;
  const order = topK(raw, { k: k + 1 });
  const hits: Hit[] = [];
  for (let j = 0; j < Math.min(k, order.length); j++) {
    const r = order[j]!;
    const entry = set.entries[r]!;
    const value = reported(r);
    const next = order[j + 1];
    const gap = next === undefined ? null : Math.abs(value - reported(next));
    // The hit's own score is left out of the spread it is measured against, else a clear best hit inflates the
    // sd and caps its own z near √(n − 1)·…; mean and sd are those of the other n − 1 scores.
    const m1 = n > 2 ? (sum - value) / (n - 1) : Number.NaN;
    const sd1 =
      n > 2 ? Math.sqrt(Math.max(0, (sum2 - value * value - (sum - value) * m1) / (n - 2))) : Number.NaN;
    const z = n > 2 && sd1 > 0 ? ((euclidean ? -1 : 1) * (value - m1)) / sd1 : null;
    hits.push({
      id: entry.id,
      revision: entry.revision,
      name: entry.name,
      class: entry.class,
      row: r,
      score: euclidean ? value : Math.max(0, value),
      rawScore: value,
      overlap: overlap[r]!,
      gapToNext: gap,
      z,
    });
  }
  return { hits, mean, sd };
}

// Scores prepared queries against every row of a search matrix: exact float32, blocked batch, or an int8 scan
// with exact rescoring of every row that could still rank.
import { instantiateScoreKernels } from './instantiateScoreKernels.js';
import { jsScoreKernels } from './jsScoreKernels.js';
import { rowStatus } from './rowStatus.js';
import type { KernelRunner, SearchMatrix } from './searchTypes.js';
import { singleThreadRunner } from './singleThreadRunner.js';
import { topK } from './topK.js';

export interface MatrixScoresOptions {
  /**
   * Where the kernels run; by default on the calling thread (WebAssembly SIMD, or JavaScript without it).
   * @default undefined
   */
  runner?: KernelRunner;
  /**
   * `int8` scans the int8 copy (when the matrix has one; single queries and blocks alike) and rescores exactly;
   * `exact` scans the float32 rows.
   * @default 'exact'
   */
  precision?: 'exact' | 'int8';
  /**
   * With `int8`, the number of top rows that must come out exactly as the float32 scan would rank them.
   * @default 11
   */
  exactTop?: number;
  /**
   * Give up on the int8 scan and scan float32 when more than this fraction of rows would need rescoring.
   * @default 0.25
   */
  maxRescoreFraction?: number;
}

export interface MatrixScores {
  /** One float32 score per row (the dot product of prepared vectors); meaningful for `full` rows only. */
  scores: Float32Array;
  path: 'exact' | 'exact-batch' | 'int8+exact' | 'int8+exact-batch';
  /** Rows rescored in float32 after the int8 scan. */
  rescored: number;
}

/**
 * Slack added to the int8 error bound for float32 rounding. The float32 kernel adds 16 partial sums of stride/16
 * products, so on unit vectors its worst-case error is about (stride/16 + 4) · 2⁻²⁴ ≈ 7e-6 at stride 1712 (and
 * stays under this slack up to stride ~25,000); the int8 path's conversions and scalings add a few ulps more.
 */
const ROUNDING_SLACK = 1e-4;

const defaultRunners = new WeakMap<WebAssembly.Memory, KernelRunner>();

function defaultRunner(memory: WebAssembly.Memory): KernelRunner {
  let runner = defaultRunners.get(memory);
  if (runner === undefined) {
    runner = singleThreadRunner(instantiateScoreKernels(memory) ?? jsScoreKernels(memory));
    defaultRunners.set(memory, runner);
  }
  return runner;
}

/**
 * `queries` are prepared vectors (layout.stride values, zero outside the mask, prepared like the rows), so each
 * score is the matrix row's dot product with one of them.
 *
 * The int8 scan is exact by construction for the top `exactTop` rows: with r̂ and x̂ the dequantised row and
 * query, |r·x − r̂·x̂| ≤ ‖r − r̂‖‖x‖ + ‖r̂‖‖x − x̂‖ (Cauchy–Schwarz), a bound b_r known per row. Every row whose
 * upper bound reaches the exactTop-th best lower bound is rescored in float32; no other row can rank there.
 */
export function matrixScores(
  matrix: SearchMatrix,
  queries: readonly Float32Array[],
  options: MatrixScoresOptions = {},
): MatrixScores[] {
  const runner = options.runner ?? defaultRunner(matrix.memory);
  const { layout } = matrix;
  const { rows, stride } = layout;
  const int8 = options.precision === 'int8' && layout.i8 >= 0;
  const results: MatrixScores[] = [];
  for (let first = 0; first < queries.length; first += layout.batch) {
    const block = queries.slice(first, first + layout.batch);
    if (block.length === 1) {
      writeQuery(matrix, 0, block[0]!);
      if (int8) {
        const { norm, error, scale } = quantiseQuery(matrix, 0, block[0]!);
        runner.run('dotI8', rows, [
          layout.i8,
          stride,
          layout.query16,
          layout.int8Scale,
          scale,
          layout.scores,
        ]);
        results.push(rescore(matrix, runner, readPlane(matrix, 0), 0, norm, error, options, 'int8+exact'));
      } else {
        runner.run('dotF32', rows, [layout.f32, stride, layout.queries, layout.scores]);
        results.push({ scores: readPlane(matrix, 0), path: 'exact', rescored: 0 });
      }
      continue;
    }
    // The batch kernels take queries four at a time; pad the block with zero queries.
    const padded = Math.ceil(block.length / 4) * 4;
    for (let q = 0; q < padded; q++) writeQuery(matrix, q, block[q] ?? null);
    if (int8) {
      const quantised = Array.from({ length: padded }, (_, q) => quantiseQuery(matrix, q, block[q] ?? null));
      const scales = new Float32Array(matrix.memory.buffer, layout.queryScales, padded);
      quantised.forEach((x, q) => {
        scales[q] = x.scale;
      });
      runner.run('dotI8Batch', rows, [
        layout.i8,
        stride,
        layout.query16,
        padded,
        layout.int8Scale,
        layout.queryScales,
        layout.scores,
        rows,
      ]);
      // Copy every plane out before rescoring, which reuses the scratch.
      const planes = block.map((_, q) => readPlane(matrix, q));
      for (let q = 0; q < block.length; q++) {
        const x = quantised[q]!;
        results.push(rescore(matrix, runner, planes[q]!, q, x.norm, x.error, options, 'int8+exact-batch'));
      }
    } else {
      runner.run('dotF32Batch', rows, [layout.f32, stride, layout.queries, padded, layout.scores, rows]);
      for (let q = 0; q < block.length; q++) {
        results.push({ scores: readPlane(matrix, q), path: 'exact-batch', rescored: 0 });
      }
    }
  }
  return results;
}

function writeQuery(matrix: SearchMatrix, slot: number, query: Float32Array | null): void {
  const { stride, queries } = matrix.layout;
  const view = new Float32Array(matrix.memory.buffer, queries + slot * stride * 4, stride);
  if (query === null) view.fill(0);
  else view.set(query.subarray(0, stride));
}

function readPlane(matrix: SearchMatrix, plane: number): Float32Array {
  const { rows, scores } = matrix.layout;
  return new Float32Array(matrix.memory.buffer, scores + plane * rows * 4, rows).slice();
}

/**
 * Writes the int16 copy of a query into its slot and returns its scale, its norm and the norm of its rounding
 * error. An int32 lane of the batch kernel sums stride/4 products of |int8| ≤ 127 and |int16| ≤ qmax (the
 * single-query kernel fewer), which bounds qmax.
 */
function quantiseQuery(
  matrix: SearchMatrix,
  slot: number,
  query: Float32Array | null,
): { scale: number; norm: number; error: number } {
  const { stride } = matrix.layout;
  const q16 = new Int16Array(matrix.memory.buffer, matrix.layout.query16 + slot * stride * 2, stride);
  if (query === null) {
    q16.fill(0);
    return { scale: 0, norm: 0, error: 0 };
  }
  const qmax = Math.min(32767, Math.floor((2 ** 31 - 1) / ((127 * stride) / 4)));
  let peak = 0;
  for (let i = 0; i < stride; i++) peak = Math.max(peak, Math.abs(query[i] ?? 0));
  const scale = Math.fround(peak > 0 ? peak / qmax : 1);
  let norm2 = 0;
  let error2 = 0;
  for (let i = 0; i < stride; i++) {
    const x = query[i] ?? 0;
    const q = Math.max(-qmax, Math.min(qmax, Math.round(x / scale)));
    q16[i] = q;
    norm2 += x * x;
    error2 += (x - q * scale) ** 2;
  }
  return { scale, norm: Math.sqrt(norm2), error: Math.sqrt(error2) };
}

/**
 * Turns int8 estimates into scores whose top `exactTop` are exact: every full row whose upper bound reaches the
 * exactTop-th best lower bound is rescored in float32 against the query in float32 slot `slot`.
 */
function rescore(
  matrix: SearchMatrix,
  runner: KernelRunner,
  scores: Float32Array,
  slot: number,
  xNorm: number,
  xErr: number,
  options: MatrixScoresOptions,
  path: 'int8+exact' | 'int8+exact-batch',
): MatrixScores {
  const { layout } = matrix;
  const { rows, stride } = layout;
  const buffer = matrix.memory.buffer;
  const vector = layout.queries + slot * stride * 4;
  const status = new Uint8Array(buffer, layout.status, rows);
  const rowError = new Float32Array(buffer, layout.int8Error, rows);
  const rowNorm = new Float32Array(buffer, layout.int8Norm, rows);
  const bound = new Float32Array(rows);
  const lower = new Float32Array(rows).fill(Number.NaN);
  for (let r = 0; r < rows; r++) {
    if (status[r] !== rowStatus.full) continue;
    const b = rowError[r]! * xNorm + rowNorm[r]! * xErr + ROUNDING_SLACK;
    bound[r] = b;
    lower[r] = scores[r]! - b;
  }
  const exactTop = Math.max(1, options.exactTop ?? 11);
  const best = topK(lower, { k: exactTop });
  // With fewer full rows than exactTop every full row is rescored.
  const threshold = best.length < exactTop ? Number.NEGATIVE_INFINITY : lower[best[exactTop - 1]!]!;
  const list = new Uint32Array(buffer, layout.rowList, rows);
  let count = 0;
  for (let r = 0; r < rows; r++) {
    if (status[r] === rowStatus.full && scores[r]! + bound[r]! >= threshold) list[count++] = r;
  }
  if (count > (options.maxRescoreFraction ?? 0.25) * rows) {
    runner.run('dotF32', rows, [layout.f32, stride, vector, layout.scores]);
    return { scores: readPlane(matrix, 0), path: 'exact', rescored: 0 };
  }
  runner.run('dotF32Rows', count, [layout.f32, stride, vector, layout.rowList, layout.rowScores]);
  const exact = new Float32Array(buffer, layout.rowScores, count);
  for (let j = 0; j < count; j++) scores[list[j]!] = exact[j]!;
  return { scores, path, rescored: count };
}

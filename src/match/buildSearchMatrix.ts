// Builds the search matrix of a search set: every row prepared over the scoring mask, float32 (and int8), in one
// WebAssembly memory the kernels scan.
import { BandshelfError } from '../error.js';
import { gridLength } from '../spectrum/gridLength.js';
import { allocateMatrixMemory } from './allocateMatrixMemory.js';
import { coveredSpan } from './coveredSpan.js';
import { derivativeVector } from './derivativeVector.js';
import { processedRow } from './processedRow.js';
import { rowStatus } from './rowStatus.js';
import { searchMatrixKey } from './searchMatrixKey.js';
import { searchMatrixLayout } from './searchMatrixLayout.js';
import type { MatrixPreparation, ScoringSet, SearchMatrix } from './searchTypes.js';

export interface BuildSearchMatrixOptions {
  /**
   * How rows are prepared (what a dot product with a prepared query then means).
   * @default { centring: 'centred', derivative: null }
   */
  preparation?: MatrixPreparation;
  /**
   * Grid points to score over (one byte per point); by default every point outside the recipe's exclusions.
   * @default undefined
   */
  mask?: Uint8Array;
  /**
   * Also keep an int8 copy (per-row scale) for the reduced-precision scan; worth it on large sets only.
   * @default rows >= 4096
   */
  int8?: boolean;
  /**
   * Back the matrix by a shared memory, so worker threads can scan it.
   * @default false
   */
  shared?: boolean;
  /**
   * Rows already prepared in a matrix of the same preparation and mask (an earlier state of the library):
   * `rows[r]` is row r's index there, or −1 for a row prepared from the set. Reused rows are copied, never read
   * from the set, so an add extends the cached matrix without reading the library's vectors.
   * @default undefined
   */
  reuse?: { matrix: SearchMatrix; rows: Int32Array };
}

/**
 * A row whose coverage holds the whole mask is written prepared: (v − mean)/‖v − mean‖ over the mask for
 * `centred`, v/‖v‖ for `unit`, zero elsewhere and in the padding. The dot product of two prepared vectors is
 * then exactly Pearson's r (or the cosine) over the mask. Rows covering part of the mask are marked partial and
 * left zero (the search scores them exactly, few as they are); rows with under 3 points, or flat, are empty.
 */
export function buildSearchMatrix(set: ScoringSet, options: BuildSearchMatrixOptions = {}): SearchMatrix {
  const preparation = options.preparation ?? { centring: 'centred', derivative: null };
  const rows = set.entries.length;
  const cols = gridLength(set.grid);
  if (set.row === undefined && set.processed.length !== rows * cols) {
    throw new BandshelfError(
      'BAD_FORMAT',
      `the search set holds ${set.processed.length} values, not ${rows} rows × ${cols} grid points`,
      { field: 'processed' },
    );
  }
  const mask = options.mask ?? defaultMask(set, cols);
  if (mask.length !== cols) {
    throw new BandshelfError('BAD_FORMAT', `the mask has ${mask.length} points, the grid ${cols}`, {
      field: 'mask',
    });
  }
  const int8 = options.int8 ?? rows >= 4096;
  const layout = searchMatrixLayout({ rows, cols }, { int8 });
  const memory = allocateMatrixMemory(layout, { shared: options.shared ?? false });
  const { stride } = layout;
  const buffer = memory.buffer;
  const status = new Uint8Array(buffer, layout.status, rows);
  new Uint8Array(buffer, layout.mask, cols).set(mask);
  const matrix = new Float32Array(buffer, layout.f32, rows * stride);
  const scale = new Float32Array(buffer, layout.int8Scale, rows);
  const error = new Float32Array(buffer, layout.int8Error, rows);
  const norm = new Float32Array(buffer, layout.int8Norm, rows);
  const quantised = int8 ? new Int8Array(buffer, layout.i8, rows * stride) : null;

  const reuse = options.reuse ?? null;
  if (reuse !== null) checkReusable(reuse, { rows, cols, mask, preparation });
  const index = Int32Array.from(maskIndices(mask));
  const m = index.length;
  const centred = preparation.centring === 'centred';
  const scratch = new Float64Array(cols);
  for (let r = 0; r < rows; r++) {
    const from = reuse === null ? -1 : reuse.rows[r]!;
    if (reuse !== null && from >= 0) {
      copyRow(reuse.matrix, from, { status, matrix, scale, error, norm, quantised }, r, stride);
      if (quantised && status[r] === rowStatus.full && reuse.matrix.layout.i8 < 0)
        quantiseRow(matrix, quantised, r * stride, index, r, scale, error, norm);
      continue;
    }
    const source = processedRow(set, r);
    // One element type in the loops below keeps them monomorphic (and fast) for both preparations.
    let v: Float64Array = scratch;
    if (preparation.derivative)
      v = derivativeVector(source, { ...preparation.derivative, step: set.grid.step });
    else scratch.set(source);
    let covered = 0;
    let sum = 0;
    for (let j = 0; j < m; j++) {
      const x = v[index[j]!]!;
      if (Number.isFinite(x)) {
        covered++;
        sum += x;
      }
    }
    if (covered < m) {
      status[r] = covered >= 3 ? rowStatus.partial : rowStatus.empty;
      continue;
    }
    const mean = centred ? sum / m : 0;
    let ss = 0;
    let power = 0;
    for (let j = 0; j < m; j++) {
      const x = v[index[j]!]!;
      ss += (x - mean) ** 2;
      power += x * x;
    }
    // Flat relative to its power: a constant row leaves only rounding after centring.
    if (!(ss > 1e-20 * power) || m < 3) {
      status[r] = rowStatus.empty;
      continue;
    }
    status[r] = rowStatus.full;
    const inv = 1 / Math.sqrt(ss);
    const base = r * stride;
    for (let j = 0; j < m; j++) {
      const i = index[j]!;
      matrix[base + i] = (v[i]! - mean) * inv;
    }
    if (quantised) quantiseRow(matrix, quantised, base, index, r, scale, error, norm);
  }
  return {
    key: searchMatrixKey({ stateKey: set.stateKey, preparation, mask }),
    preparation,
    layout,
    memory,
    points: m,
    overlap: coveredSpan(mask, set.grid.step),
  };
}

function checkReusable(
  reuse: { matrix: SearchMatrix; rows: Int32Array },
  want: { rows: number; cols: number; mask: Uint8Array; preparation: MatrixPreparation },
): void {
  const { layout, memory, preparation } = reuse.matrix;
  const old = new Uint8Array(memory.buffer, layout.mask, layout.cols);
  const same =
    reuse.rows.length === want.rows &&
    layout.cols === want.cols &&
    JSON.stringify(preparation) === JSON.stringify(want.preparation) &&
    old.every((v, i) => v === want.mask[i]);
  if (!same) throw new Error('a matrix is reused only for the same grid, preparation and mask');
  for (const from of reuse.rows) {
    if (from >= layout.rows) throw new Error(`row ${from} is not in the reused matrix`);
  }
}

/** Row `from` of an earlier matrix into row `r`: status, float32 values and, where both keep it, the int8 copy. */
function copyRow(
  source: SearchMatrix,
  from: number,
  to: {
    status: Uint8Array;
    matrix: Float32Array;
    scale: Float32Array;
    error: Float32Array;
    norm: Float32Array;
    quantised: Int8Array | null;
  },
  r: number,
  stride: number,
): void {
  const { layout, memory } = source;
  const buffer = memory.buffer;
  to.status[r] = new Uint8Array(buffer, layout.status, layout.rows)[from]!;
  to.matrix.set(new Float32Array(buffer, layout.f32 + from * stride * 4, stride), r * stride);
  if (to.quantised && layout.i8 >= 0) {
    to.quantised.set(new Int8Array(buffer, layout.i8 + from * stride, stride), r * stride);
    to.scale[r] = new Float32Array(buffer, layout.int8Scale, layout.rows)[from]!;
    to.error[r] = new Float32Array(buffer, layout.int8Error, layout.rows)[from]!;
    to.norm[r] = new Float32Array(buffer, layout.int8Norm, layout.rows)[from]!;
  }
}

function defaultMask(set: ScoringSet, cols: number): Uint8Array {
  const mask = new Uint8Array(cols).fill(1);
  const lo = Math.min(set.grid.start, set.grid.stop);
  for (let i = 0; i < cols; i++) {
    const w = lo + i * set.grid.step;
    if (set.recipe.exclude.some((x) => w >= Math.min(x.min, x.max) && w <= Math.max(x.min, x.max)))
      mask[i] = 0;
  }
  return mask;
}

function maskIndices(mask: Uint8Array): number[] {
  const out: number[] = [];
  for (let i = 0; i < mask.length; i++) if (mask[i] !== 0) out.push(i);
  return out;
}

/**
 * int8 with one scale per row (max |value| ↦ 127). The norms of the rounding error and of the dequantised row
 * are kept: they bound how far a reduced-precision score can be from the float32 one (Cauchy–Schwarz).
 */
function quantiseRow(
  matrix: Float32Array,
  quantised: Int8Array,
  base: number,
  index: Int32Array,
  r: number,
  scale: Float32Array,
  error: Float32Array,
  norm: Float32Array,
): void {
  let peak = 0;
  for (let j = 0; j < index.length; j++) {
    const a = Math.abs(matrix[base + index[j]!]!);
    if (a > peak) peak = a;
  }
  const s = Math.fround(peak / 127);
  const inv = 1 / s;
  let e2 = 0;
  let n2 = 0;
  for (let j = 0; j < index.length; j++) {
    const i = index[j]!;
    const x = matrix[base + i]!;
    // |x| ≤ peak, so |x/s| ≤ 127 up to rounding; the clamp only guards that last ulp.
    const q = Math.min(127, Math.max(-127, Math.round(x * inv)));
    quantised[base + i] = q;
    const back = q * s;
    e2 += (x - back) * (x - back);
    n2 += back * back;
  }
  scale[r] = s;
  error[r] = Math.sqrt(e2);
  norm[r] = Math.sqrt(n2);
}

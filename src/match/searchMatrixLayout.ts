// Where a search matrix keeps its parts in one WebAssembly memory: scratch first, then the cached region.
import type { SearchMatrixLayout } from './searchTypes.js';

export interface SearchMatrixLayoutOptions {
  /**
   * Reserve an int8 copy of the rows for the reduced-precision scan.
   * @default false
   */
  int8?: boolean;
  /**
   * Largest block of queries scored in one pass over the rows.
   * @default 32
   */
  batch?: number;
}

const WASM_PAGE = 65536;

/** 64-byte alignment keeps every SIMD load inside one cache line. */
function align(bytes: number): number {
  return Math.ceil(bytes / 64) * 64;
}

export function searchMatrixLayout(
  size: { rows: number; cols: number },
  options: SearchMatrixLayoutOptions = {},
): SearchMatrixLayout {
  const { rows, cols } = size;
  const batch = options.batch ?? 32;
  const stride = Math.ceil(cols / 16) * 16;
  // Offset 0 stays unused so a zero pointer never aliases real data.
  const queries = 64;
  const query16 = align(queries + batch * stride * 4);
  const queryScales = align(query16 + batch * stride * 2);
  const scores = align(queryScales + batch * 4);
  const rowList = align(scores + batch * rows * 4);
  const rowScores = align(rowList + rows * 4);
  // The cached region starts on a page boundary so a cache file maps onto it in whole pages.
  const cached = Math.ceil((rowScores + rows * 4) / WASM_PAGE) * WASM_PAGE;
  const status = cached;
  const mask = align(status + rows);
  const int8Scale = align(mask + stride);
  const int8Error = align(int8Scale + rows * 4);
  const int8Norm = align(int8Error + rows * 4);
  const f32 = align(int8Norm + rows * 4);
  const i8 = options.int8 ? align(f32 + rows * stride * 4) : -1;
  const end = i8 >= 0 ? align(i8 + rows * stride) : align(f32 + rows * stride * 4);
  return {
    rows,
    cols,
    stride,
    batch,
    queries,
    query16,
    queryScales,
    scores,
    rowList,
    rowScores,
    cached,
    status,
    mask,
    int8Scale,
    int8Error,
    int8Norm,
    f32,
    i8,
    end,
  };
}

// Allocates the WebAssembly memory for a search matrix layout, refusing sizes a 32-bit memory cannot hold.
import { BandshelfError } from '../error.js';
import type { SearchMatrixLayout } from './searchTypes.js';

export interface AllocateMatrixMemoryOptions {
  /**
   * Back it by a SharedArrayBuffer so worker threads can scan it.
   * @default false
   */
  shared?: boolean;
}

const WASM_PAGE = 65536;
/** 4 GiB: the most a 32-bit WebAssembly memory addresses. */
const MAX_PAGES = 65536;

export function allocateMatrixMemory(
  layout: SearchMatrixLayout,
  options: AllocateMatrixMemoryOptions = {},
): WebAssembly.Memory {
  const pages = Math.ceil(layout.end / WASM_PAGE);
  if (pages > MAX_PAGES) {
    throw new BandshelfError(
      'FILE_TOO_LARGE',
      `${layout.rows} spectra × ${layout.cols} points need ${(layout.end / 2 ** 30).toFixed(1)} GiB for the ` +
        'search matrix and at most 4 GiB fits: search a release with fewer entries',
      { field: 'library' },
    );
  }
  // A fixed size: the kernels and the workers hold on to one buffer, which growing would replace.
  return new WebAssembly.Memory({ initial: pages, maximum: pages, shared: options.shared ?? false });
}

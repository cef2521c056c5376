// Loads the site's published search set (vectors, peaks, recipe) and builds the match source over it; the page and
// the matcher's worker both call it, each with its own way of loading a data script.
import type { MatchSource } from '../../match/pipeline/types.js';
import { decodeSearchMatrix } from '../decodeSearchMatrix.js';
import { base64Bytes } from './base64Bytes.js';
import type { PublishedSearchSet } from './matchSpectrumFile.js';
import { type PublishedEntryDocument, publishedMatchSource } from './publishedMatchSource.js';

/** Loads the data script at `src` (relative to `base`'s page) and resolves with the value it stores under `key`. */
export type DataLoader = <T>(src: string, key: string) => Promise<T>;

export interface LoadPublishedSetOptions {
  /** How a data script is loaded: a <script> tag in a page, importScripts in a worker. */
  load: DataLoader;
  /** The site root relative to the page (the body's `data-base`), prefixed to entry folders.
   * @default '' */
  base?: string;
}

type MatrixMeta = Omit<PublishedSearchSet, 'processed'> & { rows: number; cols: number };

export interface PublishedData {
  set: PublishedSearchSet;
  source: MatchSource;
}

/** `matrixScript` is the URL of `assets/search-matrix.js`. */
export async function loadPublishedSet(
  matrixScript: string,
  options: LoadPublishedSetOptions,
): Promise<PublishedData> {
  const { meta, matrix } = await options.load<{ meta: MatrixMeta; matrix: string }>(
    matrixScript,
    'search-matrix',
  );
  const decoded = decodeSearchMatrix(base64Bytes(matrix));
  if (decoded.rows !== meta.rows || decoded.cols !== meta.cols) {
    throw new Error('the matrix and its description disagree; rebuild the site');
  }
  const set: PublishedSearchSet = { ...meta, processed: decoded.matrix };
  const base = options.base ?? '';
  // An entry's data script sits in its folder under the folder's own name.
  const loadEntry = (path: string): Promise<PublishedEntryDocument> => {
    const slug = path.replace(/\/$/, '').split('/').pop() ?? '';
    return options
      .load<{ document: PublishedEntryDocument }>(`${base}${path}${slug}.data.js`, `entry:${slug}`)
      .then((d) => d.document);
  };
  return { set, source: publishedMatchSource(set, { loadEntry }) };
}

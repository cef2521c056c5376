// Loads the site's published search set (vectors, peaks, recipe) and builds the match source over it; the page and
// the matcher's worker both call it. Served over http the binary matrix and its description are fetched as they are
// (no base64, no script to parse); opened from disk, where browsers refuse fetch, the one data script is loaded.
import type { MatchSource } from '../../match/pipeline/types.js';
import { decodeSearchMatrix } from '../decodeSearchMatrix.js';
import { base64Bytes } from './base64Bytes.js';
import type { PublishedSearchSet } from './matchSpectrumFile.js';
import { type PublishedEntryDocument, publishedMatchSource } from './publishedMatchSource.js';

/** Loads the data script at `src` (relative to `base`'s page) and resolves with the value it stores under `key`. */
export type DataLoader = <T>(src: string, key: string) => Promise<T>;

/** Where the published matrix is: the data script, and beside it the binary file and its JSON description. */
export interface PublishedMatrixFiles {
  /** `assets/search-matrix.js`: description and base64 matrix in one script (works from file://). */
  script: string;
  /** `assets/search-matrix.bin` (the layout of encodeSearchMatrix). */
  binary: string;
  /** `assets/search-matrix.json`. */
  json: string;
}

export interface LoadPublishedSetOptions {
  /** How a data script is loaded: a <script> tag in a page, importScripts in a worker. */
  load: DataLoader;
  /** The site root relative to the page (the body's `data-base`), prefixed to entry folders.
   * @default '' */
  base?: string;
  /**
   * Fetch the binary matrix and its description (a page or worker served over http); the data script is loaded only
   * when a fetch fails. False from file://, where browsers refuse fetch.
   * @default false
   */
  fetch?: boolean;
}

type MatrixMeta = Omit<PublishedSearchSet, 'processed'> & { rows: number; cols: number };

export interface PublishedData {
  set: PublishedSearchSet;
  source: MatchSource;
}

async function fetched(files: PublishedMatrixFiles): Promise<{ meta: MatrixMeta; bytes: Uint8Array }> {
  const get = async (url: string): Promise<Response> => {
    const response = await fetch(url);
    if (!response.ok) throw new Error(`${url}: HTTP ${response.status}`);
    return response;
  };
  const [meta, bytes] = await Promise.all([
    get(files.json).then((r) => r.json() as Promise<MatrixMeta>),
    get(files.binary).then(async (r) => new Uint8Array(await r.arrayBuffer())),
  ]);
  return { meta, bytes };
}

async function scripted(
  files: PublishedMatrixFiles,
  load: DataLoader,
): Promise<{ meta: MatrixMeta; bytes: Uint8Array }> {
  const { meta, matrix } = await load<{ meta: MatrixMeta; matrix: string }>(files.script, 'search-matrix');
  return { meta, bytes: base64Bytes(matrix) };
}

export async function loadPublishedSet(
  files: PublishedMatrixFiles,
  options: LoadPublishedSetOptions,
): Promise<PublishedData> {
  const { meta, bytes } =
    options.fetch === true
      ? await fetched(files).catch(() => scripted(files, options.load))
      : await scripted(files, options.load);
  const decoded = decodeSearchMatrix(bytes);
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

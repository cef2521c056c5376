// The messages between the matcher page and its worker (one owner for both sides' shapes).
import type { PublishedMatrixFiles } from './loadPublishedSet.js';
import type { FileMatch, MatchSpectrumFileOptions, PublishedSearchSet } from './matchSpectrumFile.js';

/** What the page may ask of a match run in the worker (the worker keeps its own source). */
export type WorkerMatchOptions = Omit<MatchSpectrumFileOptions, 'source'>;

/** The published entries as the page lists and links them (the vectors stay in the worker). */
export type PublishedEntryRow = PublishedSearchSet['entries'][number];

/** A match from the worker, with the processed vectors of its hits for the page's overlay plot. */
export type WorkerMatch = FileMatch & { vectors: Record<string, Float32Array> };

export type WorkerRequest =
  | { kind: 'init'; files: PublishedMatrixFiles; base: string; fetch: boolean }
  | { kind: 'match'; id: number; bytes: Uint8Array; file: string; options: WorkerMatchOptions }
  /** The page's answer to a `load`: the value the data script stored, or why it could not be loaded. */
  | { kind: 'loaded'; id: number; value?: unknown; message?: string };

export type WorkerReply =
  | { kind: 'ready'; entries: PublishedEntryRow[] }
  | { kind: 'failed'; message: string }
  /** The worker (started from a Blob URL, so without importScripts of the site's files) asks the page for a data script. */
  | { kind: 'load'; id: number; src: string; key: string }
  | { kind: 'result'; id: number; result: WorkerMatch }
  | { kind: 'error'; id: number; message: string };

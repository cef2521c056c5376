// The messages between the matcher page and its worker (one owner for both sides' shapes).
import type { FileMatch, MatchSpectrumFileOptions } from './matchSpectrumFile.js';

/** What the page may ask of a match run in the worker (the worker keeps its own source). */
export type WorkerMatchOptions = Omit<MatchSpectrumFileOptions, 'source'>;

export type WorkerRequest =
  | { kind: 'init'; matrixScript: string; base: string }
  | { kind: 'match'; id: number; bytes: Uint8Array; file: string; options: WorkerMatchOptions };

export type WorkerReply =
  | { kind: 'ready'; rows: number }
  | { kind: 'failed'; message: string }
  | { kind: 'result'; id: number; result: FileMatch }
  | { kind: 'error'; id: number; message: string };

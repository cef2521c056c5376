// Starts the matcher's Web Worker and resolves once it holds the published data; rejects where the browser refuses
// a worker (Chromium does for a page opened from file://), so the page can fall back to its own thread.
import type { PublishedMatrixFiles } from './loadPublishedSet.js';
import type {
  PublishedEntryRow,
  WorkerMatch,
  WorkerMatchOptions,
  WorkerReply,
  WorkerRequest,
} from './workerMessages.js';

export interface StartMatchWorkerOptions {
  /** Absolute URLs of the published matrix files. */
  files: PublishedMatrixFiles;
  /** Fetch the binary matrix (served over http). @default true */
  fetch?: boolean;
  /** Absolute URL of the site root (entry folders are relative to it). */
  base: string;
  /** Give up on a worker that has not loaded the data by then, ms.
   * @default 60000 */
  timeout?: number;
}

export interface MatchWorker {
  /** The published entries the worker loaded. */
  entries: PublishedEntryRow[];
  /** Rejects with the status line to show (the worker formats a failed match as the page would). */
  match(bytes: Uint8Array, file: string, options: WorkerMatchOptions): Promise<WorkerMatch>;
}

export function startMatchWorker(url: string, options: StartMatchWorkerOptions): Promise<MatchWorker> {
  return new Promise<MatchWorker>((resolve, reject) => {
    let worker: Worker;
    try {
      worker = new Worker(url);
    } catch (error) {
      reject(error instanceof Error ? error : new Error(String(error)));
      return;
    }
    const pending = new Map<number, { ok: (r: WorkerMatch) => void; fail: (e: Error) => void }>();
    let next = 1;
    let ready = false;
    const timer = setTimeout(() => {
      if (!ready) {
        worker.terminate();
        reject(new Error('the worker did not start in time'));
      }
    }, options.timeout ?? 60000);
    const send = (message: WorkerRequest, transfer: Transferable[] = []): void =>
      worker.postMessage(message, transfer);
    worker.addEventListener('error', (event) => {
      event.preventDefault();
      const error = new Error(event.message || 'the worker could not run');
      if (!ready) {
        clearTimeout(timer);
        worker.terminate();
        reject(error);
      }
      for (const p of pending.values()) p.fail(error);
      pending.clear();
    });
    worker.addEventListener('message', (event: MessageEvent<WorkerReply>) => {
      const reply = event.data;
      if (reply.kind === 'ready') {
        ready = true;
        clearTimeout(timer);
        resolve({
          entries: reply.entries,
          match: (bytes, file, matchOptions) =>
            new Promise<WorkerMatch>((ok, fail) => {
              const id = next++;
              pending.set(id, { ok, fail });
              const copy = bytes.slice();
              send({ kind: 'match', id, bytes: copy, file, options: matchOptions }, [copy.buffer]);
            }),
        });
      } else if (reply.kind === 'failed') {
        clearTimeout(timer);
        worker.terminate();
        reject(new Error(reply.message));
      } else {
        const p = pending.get(reply.id);
        pending.delete(reply.id);
        if (reply.kind === 'result') p?.ok(reply.result);
        else p?.fail(new Error(reply.message));
      }
    });
    send({ kind: 'init', files: options.files, base: options.base, fetch: options.fetch ?? true });
  });
}

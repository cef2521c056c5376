// Starts the matcher's Web Worker from a Blob URL of its source (Chromium allows that from file://, where it refuses
// `new Worker(fileUrl)`), answers the worker's requests for data scripts, and resolves once it holds the published
// data; rejects where the browser refuses the worker, so the page can fall back to its own thread.
import type { DataLoader, PublishedMatrixFiles } from './loadPublishedSet.js';
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
  /** Loads a data script in the page (a <script> tag) for the worker. */
  load: DataLoader;
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

/** `source` is the worker bundle's text (from assets/bandshelf-worker-source.js). */
export function startMatchWorker(source: string, options: StartMatchWorkerOptions): Promise<MatchWorker> {
  return new Promise<MatchWorker>((resolve, reject) => {
    let worker: Worker;
    try {
      const url = URL.createObjectURL(new Blob([source], { type: 'text/javascript' }));
      worker = new Worker(url);
      URL.revokeObjectURL(url);
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
      if (reply.kind === 'load') {
        const { id } = reply;
        options.load<unknown>(reply.src, reply.key).then(
          (value) => send({ kind: 'loaded', id, value }),
          (error: unknown) =>
            send({ kind: 'loaded', id, message: error instanceof Error ? error.message : String(error) }),
        );
      } else if (reply.kind === 'ready') {
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

// Entry of the matcher's Web Worker (assets/bandshelf-worker.js): loads the published data (data scripts by importScripts) and
// runs matchSpectrumFile off the page's thread, so parsing and scoring never freeze the page; served over http it
// fetches the binary matrix instead.
import { loadPublishedSet, type PublishedData } from './loadPublishedSet.js';
import { matchErrorText } from './matchErrorText.js';
import { matchSpectrumFile } from './matchSpectrumFile.js';
import type { WorkerReply, WorkerRequest } from './workerMessages.js';

interface WorkerScope {
  importScripts(...urls: string[]): void;
  postMessage(message: WorkerReply): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<WorkerRequest>) => void): void;
  __bandshelf?: Record<string, unknown>;
}

const scope = globalThis as unknown as WorkerScope;
let data: Promise<PublishedData> | undefined;

/** A data script, loaded synchronously into this worker's global (the same script a page loads with a tag). */
function load<T>(src: string, key: string): Promise<T> {
  try {
    if (!(key in (scope.__bandshelf ?? {}))) scope.importScripts(src);
    const value = scope.__bandshelf?.[key];
    return value === undefined
      ? Promise.reject(new Error(`${src} did not hold ${key}`))
      : Promise.resolve(value as T);
  } catch (error) {
    return Promise.reject(error instanceof Error ? error : new Error(String(error)));
  }
}

scope.addEventListener('message', (event) => {
  const request = event.data;
  if (request.kind === 'init') {
    data = loadPublishedSet(request.files, { load, base: request.base, fetch: request.fetch });
    data.then(
      ({ set }) => scope.postMessage({ kind: 'ready', entries: set.entries }),
      (error: unknown) =>
        scope.postMessage({
          kind: 'failed',
          message: error instanceof Error ? error.message : String(error),
        }),
    );
    return;
  }
  const { id, bytes, file, options } = request;
  (data ?? Promise.reject(new Error('the worker was not started')))
    .then(async ({ set, source }) => {
      const result = await matchSpectrumFile(bytes, file, set, { ...options, source });
      // The page keeps no matrix: it gets the vectors its overlay plot draws (the hits') with the result.
      const cols = set.processed.length / Math.max(1, set.entries.length);
      const rowOf = new Map(set.entries.map((e, i) => [e.id, i]));
      const vectors: Record<string, Float32Array> = {};
      for (const h of result.report.hits) {
        const row = rowOf.get(h.id);
        if (row !== undefined) vectors[h.id] = set.processed.slice(row * cols, (row + 1) * cols);
      }
      return { ...result, vectors };
    })
    .then(
      (result) => scope.postMessage({ kind: 'result', id, result }),
      (error: unknown) => scope.postMessage({ kind: 'error', id, message: matchErrorText(error, file) }),
    );
});

// Entry of the matcher's Web Worker (started from a Blob URL of assets/bandshelf-worker-source.js): loads the published
// data (data scripts through the page, which loads them with a <script> tag) and runs matchSpectrumFile off the
// page's thread, so parsing and scoring never freeze the page; served over http it fetches the binary matrix instead.
import { loadPublishedSet, type PublishedData } from './loadPublishedSet.js';
import { matchErrorText } from './matchErrorText.js';
import { matchSpectrumFile } from './matchSpectrumFile.js';
import type { WorkerReply, WorkerRequest } from './workerMessages.js';

interface WorkerScope {
  postMessage(message: WorkerReply): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<WorkerRequest>) => void): void;
}

const scope = globalThis as unknown as WorkerScope;
let data: Promise<PublishedData> | undefined;

const asked = new Map<number, { ok: (value: unknown) => void; fail: (error: Error) => void }>();
let nextLoad = 1;

/**
 * A data script's value, loaded by the page (a Blob-URL worker cannot importScripts the site's files from file://)
 * and posted here; each script is asked for once.
 */
const loaded = new Map<string, Promise<unknown>>();
function load<T>(src: string, key: string): Promise<T> {
  let value = loaded.get(key);
  if (value === undefined) {
    const id = nextLoad++;
    value = new Promise<unknown>((ok, fail) => asked.set(id, { ok, fail }));
    loaded.set(key, value);
    scope.postMessage({ kind: 'load', id, src, key });
  }
  return value as Promise<T>;
}

scope.addEventListener('message', (event) => {
  const request = event.data;
  if (request.kind === 'loaded') {
    const p = asked.get(request.id);
    asked.delete(request.id);
    if (request.message === undefined) p?.ok(request.value);
    else p?.fail(new Error(request.message));
    return;
  }
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

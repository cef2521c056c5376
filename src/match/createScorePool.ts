// Splits score kernels across worker threads that share the matrix memory (Node only), synchronously via Atomics.
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { instantiateScoreKernels } from './instantiateScoreKernels.js';
import { jsScoreKernels } from './jsScoreKernels.js';
import { scoreKernelNames } from './scoreKernelNames.js';
import { scorePoolProtocol as P } from './scorePoolProtocol.js';
import type { KernelName, KernelRunner } from './searchTypes.js';

export interface CreateScorePoolOptions {
  /**
   * Worker threads a job is split across; 1 runs everything on the calling thread.
   * @default Math.min(2, os.availableParallelism())
   */
  threads?: number;
  /**
   * The bundled worker script; by default dist/scores-worker.js (found next to the running bundle or from the
   * source tree).
   * @default undefined
   */
  workerUrl?: URL;
  /**
   * Jobs over fewer rows run on the calling thread: waking workers would cost more than it saves.
   * @default 4096
   */
  minRowsToSplit?: number;
  /**
   * How long to wait for a worker to start before running single-threaded, ms.
   * @default 20000
   */
  startTimeoutMs?: number;
}

export interface ScorePool extends KernelRunner {
  /** Stops the workers; the pool then runs on the calling thread. */
  close(): void;
}

interface Slot {
  worker: Worker;
  state: Int32Array;
  args: Float64Array;
}

function defaultWorkerUrl(): URL | undefined {
  const candidates = [
    new URL('./scores-worker.js', import.meta.url),
    new URL('../../dist/scores-worker.js', import.meta.url),
  ];
  return candidates.find((url) => existsSync(fileURLToPath(url)));
}

/**
 * The calling thread blocks in Atomics.wait while the workers run, so a search stays a plain synchronous call.
 * Where the memory is not shared, workers cannot start, or the WebAssembly kernels are missing, the pool runs
 * everything on the calling thread instead (`threads` then reads 1).
 */
export function createScorePool(memory: WebAssembly.Memory, options: CreateScorePoolOptions = {}): ScorePool {
  const wanted = Math.max(1, Math.floor(options.threads ?? Math.min(2, availableParallelism())));
  const minRowsToSplit = options.minRowsToSplit ?? 4096;
  const local = instantiateScoreKernels(memory) ?? jsScoreKernels(memory);
  const runLocal = (kernel: KernelName, count: number, args: readonly number[]) =>
    (local[kernel] as (...a: number[]) => void)(0, count, ...args);
  let slots: Slot[] = [];
  const shared = typeof SharedArrayBuffer === 'function' && memory.buffer instanceof SharedArrayBuffer;
  const url = options.workerUrl ?? defaultWorkerUrl();
  if (wanted > 1 && shared && url !== undefined) {
    for (let t = 0; t < wanted; t++) {
      const control = new SharedArrayBuffer(P.bytes);
      const worker = new Worker(url, { workerData: { memory, control } });
      worker.unref();
      slots.push({
        worker,
        state: new Int32Array(control, 0, 4),
        args: new Float64Array(control, P.argsOffset, P.maxArgs),
      });
    }
    const deadline = performance.now() + (options.startTimeoutMs ?? 20_000);
    for (const slot of slots) {
      while (Atomics.load(slot.state, 0) === P.starting && performance.now() < deadline) {
        Atomics.wait(slot.state, 0, P.starting, Math.max(1, deadline - performance.now()));
      }
    }
    if (slots.some((slot) => Atomics.load(slot.state, 0) !== P.idle)) {
      for (const slot of slots) void slot.worker.terminate();
      slots = [];
    }
  }

  const pool: ScorePool = {
    get threads() {
      return slots.length > 0 ? slots.length : 1;
    },
    run(kernel, count, args) {
      if (slots.length === 0 || count < minRowsToSplit) {
        runLocal(kernel, count, args);
        return;
      }
      if (args.length + 2 > P.maxArgs) throw new Error(`kernel ${kernel} has too many arguments`);
      const index = scoreKernelNames.indexOf(kernel);
      const share = Math.ceil(count / slots.length);
      slots.forEach((slot, t) => {
        const r0 = Math.min(count, t * share);
        const r1 = Math.min(count, r0 + share);
        slot.args[0] = r0;
        slot.args[1] = r1;
        slot.args.set(args, 2);
        slot.state[1] = index;
        slot.state[2] = args.length + 2;
        Atomics.store(slot.state, 0, P.work);
        Atomics.notify(slot.state, 0);
      });
      let failed = false;
      for (const slot of slots) {
        while (Atomics.load(slot.state, 0) === P.work) Atomics.wait(slot.state, 0, P.work);
        if (Atomics.load(slot.state, 0) === P.failed) {
          failed = true;
          Atomics.store(slot.state, 0, P.idle);
        }
      }
      if (failed) throw new Error(`score kernel ${kernel} failed in a worker thread`);
    },
    close() {
      for (const slot of slots) {
        Atomics.store(slot.state, 0, P.quit);
        Atomics.notify(slot.state, 0);
        void slot.worker.terminate();
      }
      slots = [];
    },
  };
  return pool;
}

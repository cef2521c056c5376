// Worker thread of the score pool: runs kernel jobs on the shared WebAssembly memory when signalled via Atomics.
import { workerData } from 'node:worker_threads';
import { instantiateScoreKernels } from './instantiateScoreKernels.js';
import { scoreKernelNames } from './scoreKernelNames.js';
import { scorePoolProtocol as P } from './scorePoolProtocol.js';

const { memory, control } = workerData as { memory: WebAssembly.Memory; control: SharedArrayBuffer };
const state = new Int32Array(control, 0, 4);
const args = new Float64Array(control, P.argsOffset, P.maxArgs);
const kernels = instantiateScoreKernels(memory);

if (kernels === null) {
  Atomics.store(state, 0, P.failed);
  Atomics.notify(state, 0);
} else {
  Atomics.store(state, 0, P.idle);
  Atomics.notify(state, 0);
  // Blocking waits are fine here: this thread does nothing else, and the pool's owner unrefs it.
  for (;;) {
    const now = Atomics.load(state, 0);
    if (now === P.quit) break;
    if (now !== P.work) {
      Atomics.wait(state, 0, now);
      continue;
    }
    try {
      const name = scoreKernelNames[state[1]!]!;
      const fn = kernels[name] as (...a: number[]) => void;
      fn(...Array.from(args.subarray(0, state[2]!)));
      Atomics.store(state, 0, P.idle);
    } catch {
      Atomics.store(state, 0, P.failed);
    }
    Atomics.notify(state, 0);
  }
}

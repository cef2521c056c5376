// Runs score kernels on the calling thread: the browser path and the fallback where workers are unavailable.
import type { KernelRunner, ScoreKernels } from './searchTypes.js';

export function singleThreadRunner(kernels: ScoreKernels): KernelRunner {
  return {
    threads: 1,
    run(kernel, count, args) {
      const fn = kernels[kernel] as (...a: number[]) => void;
      fn(0, count, ...args);
    },
  };
}

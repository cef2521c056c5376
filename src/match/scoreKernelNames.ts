// The kernel names in a fixed order, so a worker thread can be told which one to run by number.
import type { KernelName } from './searchTypes.js';

export const scoreKernelNames: readonly KernelName[] = [
  'dotF32',
  'dotF32Rows',
  'dotF32Batch',
  'dotI8',
  'dotI8Batch',
  'sumF32',
];

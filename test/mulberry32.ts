// The tests' seeded uniform source: the uniform stream of the product's one generator (mulberry32, in
// src/demo/seededRandom.ts), so "random" test data is the same on every run and machine.
import { seededRandom } from '../src/demo/seededRandom.js';

/** Returns a function giving uniform numbers in [0, 1) from a 32-bit seed. */
export function mulberry32(seed: number): () => number {
  return seededRandom(seed).uniform;
}

// A small seeded generator (mulberry32) so the formats tests draw the same "random" data on every run.
import { mulberry32 } from '../mulberry32.js';

export interface SeededRandomOptions {
  /** Shift the stream without changing the seed. @default 0 */
  skip?: number;
}

/** Returns a function giving uniform numbers in [0, 1). */
export function seededRandom(seed: number, options: SeededRandomOptions = {}): () => number {
  const next = mulberry32(seed);
  for (let i = 0; i < (options.skip ?? 0); i++) next();
  return next;
}

// A small seeded generator (mulberry32) so the formats tests draw the same "random" data on every run.

export interface SeededRandomOptions {
  /** Shift the stream without changing the seed. @default 0 */
  skip?: number;
}

/** Returns a function giving uniform numbers in [0, 1). */
export function seededRandom(seed: number, options: SeededRandomOptions = {}): () => number {
  let state = seed >>> 0;
  const next = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  for (let i = 0; i < (options.skip ?? 0); i++) next();
  return next;
}

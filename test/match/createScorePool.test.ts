// The worker-thread pool gives the same scores as one thread (it runs the bundled dist/scores-worker.js).
import { describe, expect, it } from 'vitest';
import { buildSearchMatrix } from '../../src/match/buildSearchMatrix.js';
import { createScorePool } from '../../src/match/createScorePool.js';
import { matrixScores } from '../../src/match/matrixScores.js';
import { searchSpectra } from '../../src/match/searchSpectra.js';
import { seeded, syntheticSet } from './searchFixtures.js';

describe('createScorePool', () => {
  const set = syntheticSet({ rows: 9001, seed: 4, family: 30, grid: { start: 1800, stop: 1000, step: 4 } });
  const matrix = buildSearchMatrix(set, { shared: true });
  const stride = matrix.layout.stride;
  const random = seeded(9);
  const queries = Array.from({ length: 5 }, () => {
    const q = Float32Array.from({ length: stride }, () => random() - 0.5);
    for (let i = matrix.layout.cols; i < stride; i++) q[i] = 0;
    return q;
  });

  it('starts two worker threads on a shared memory', () => {
    const pool = createScorePool(matrix.memory, { threads: 2 });
    try {
      expect(pool.threads).toBe(2);
    } finally {
      pool.close();
    }
  });

  it('workers give bit-identical scores to a single thread: mat-vec, batch and int8', () => {
    const pool = createScorePool(matrix.memory, { threads: 2 });
    try {
      for (const precision of ['exact', 'int8'] as const) {
        const single = matrixScores(matrix, [queries[0]!], { precision, exactTop: 11 })[0]!;
        const split = matrixScores(matrix, [queries[0]!], { precision, exactTop: 11, runner: pool })[0]!;
        expect(split.path).toBe(single.path);
        expect(split.scores).toEqual(single.scores);
      }
      for (const precision of ['exact', 'int8'] as const) {
        const single = matrixScores(matrix, queries, { precision });
        const split = matrixScores(matrix, queries, { precision, runner: pool });
        for (const [q, s] of split.entries()) expect(s.scores).toEqual(single[q]!.scores);
      }
    } finally {
      pool.close();
    }
  });

  it('plugs into searchSpectra as its runner', () => {
    const pool = createScorePool(matrix.memory, { threads: 2 });
    try {
      const query = Float64Array.from(set.processed.subarray(0, matrix.layout.cols));
      const plain = searchSpectra(set, [query], { matrices: () => matrix })[0]!;
      const pooled = searchSpectra(set, [query], { matrices: () => matrix, runner: () => pool })[0]!;
      expect(pooled).toEqual(plain);
      expect(pooled[0]!.id).toBe('ref-0');
    } finally {
      pool.close();
    }
  });

  it('runs on the calling thread when the memory is not shared', () => {
    const plain = new WebAssembly.Memory({ initial: 1, maximum: 1 });
    const pool = createScorePool(plain, { threads: 2 });
    expect(pool.threads).toBe(1);
    pool.close();
  });
});

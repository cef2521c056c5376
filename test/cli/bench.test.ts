// The benchmark script runs end to end on a small synthetic library and prints one JSON document (no timing is
// asserted: a benchmark is not a test).
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const bench = fileURLToPath(new URL('../../dist/bench.js', import.meta.url));

describe('npm run bench', () => {
  it('prints one JSON document with the agreed fields', () => {
    const run = spawnSync(process.execPath, [bench, '--entries', '1500', '--queries', '3', '--json'], {
      encoding: 'utf8',
    });
    expect(run.status, run.stderr).toBe(0);
    const report = JSON.parse(run.stdout) as Record<string, unknown>;
    expect(report).toMatchObject({ entries: 1500, points: 1701, queries: 3 });
    for (const key of [
      'single_query_ms',
      'single_query_exact_ms',
      'batch32_ms_per_query',
      'batch32_exact_ms_per_query',
      'bandwidth_floor_ms',
      'rss_mb',
      'cache_crc32_ms',
      'cache_mb',
    ]) {
      expect(typeof report[key], key).toBe('number');
    }
    for (const key of ['band_search_ms', 'numpy_ms']) {
      expect(report[key] === null || typeof report[key] === 'number', key).toBe(true);
    }
    // The reduced-precision path is on by default only because it agrees with the exact one.
    expect(report['fast_path_top10_agreement']).toBe(1);
    expect(report['fast_batch_top10_agreement']).toBe(1);
  });

  it('refuses a bad option with one line and a non-zero exit', () => {
    const run = spawnSync(process.execPath, [bench, '--entries', 'many'], { encoding: 'utf8' });
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/^bench: --entries must be a whole number/);
  });
});

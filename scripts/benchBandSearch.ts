// Times band-position search on a synthetic peak table, for the benchmark script (not a test).

import { seededRandom } from '../src/demo/seededRandom.js';
import { buildBandIndex } from '../src/match/buildBandIndex.js';
import { searchBands } from '../src/match/searchBands.js';
import type { BandQuery, PeakTable } from '../src/match/types.js';

export interface BenchBandSearchOptions {
  /**
   * Synthetic library size.
   * @default 100000
   */
  entries?: number;
  /**
   * Stored peaks per entry.
   * @default 20
   */
  peaksPerEntry?: number;
  /**
   * Timed queries (after 20 untimed warm-up queries).
   * @default 200
   */
  queries?: number;
  /**
   * Bands per query.
   * @default 3
   */
  bandsPerQuery?: number;
  /**
   * @default 4
   */
  tolerance?: number;
  /**
   * @default 1
   */
  seed?: number;
}

export interface BenchBandSearchResult {
  entries: number;
  peaks: number;
  queries: number;
  bandsPerQuery: number;
  /** Time to sort the synthetic peak table into an index. */
  buildMs: number;
  medianMs: number;
  p95Ms: number;
  maxMs: number;
}

/**
 * Peaks are crowded where biological spectra have them (70 % in 1800–900 cm⁻¹, 20 % in 3100–2800 cm⁻¹, the rest
 * anywhere in 4000–600), so the binary-searched windows hold realistic numbers of peaks. Query bands are drawn
 * from the same distribution.
 */
export function benchBandSearch(options: BenchBandSearchOptions = {}): BenchBandSearchResult {
  const entries = options.entries ?? 100_000;
  const peaksPerEntry = options.peaksPerEntry ?? 20;
  const queries = options.queries ?? 200;
  const bandsPerQuery = options.bandsPerQuery ?? 3;
  const tolerance = options.tolerance ?? 4;
  const { uniform } = seededRandom(options.seed ?? 1);
  const draw = (): number => {
    const u = uniform();
    if (u < 0.7) return 900 + uniform() * 900;
    if (u < 0.9) return 2800 + uniform() * 300;
    return 600 + uniform() * 3400;
  };
  const count = entries * peaksPerEntry;
  const table: PeakTable = {
    entries: Array.from({ length: entries }, (_, i) => ({
      id: `bench-${String(i).padStart(6, '0')}`,
      revision: 1,
      name: `bench ${i}`,
      class: 'other',
    })),
    peaks: {
      entry: new Uint32Array(count),
      position: new Float64Array(count),
      height: new Float64Array(count),
      prominence: new Float64Array(count),
    },
  };
  for (let k = 0; k < count; k++) {
    table.peaks.entry[k] = Math.floor(k / peaksPerEntry);
    table.peaks.position[k] = draw();
    table.peaks.height[k] = uniform();
    table.peaks.prominence[k] = table.peaks.height[k]!;
  }
  const t0 = performance.now();
  const index = buildBandIndex(table);
  const buildMs = performance.now() - t0;
  const strengths = ['s', 'm', 'w'] as const;
  const makeQuery = (): BandQuery[] =>
    Array.from({ length: bandsPerQuery }, () => ({
      position: Math.round(draw()),
      strength: uniform() < 0.5 ? strengths[Math.floor(uniform() * 3)] : undefined,
    })).map((b) => (b.strength === undefined ? { position: b.position } : b) as BandQuery);
  for (let i = 0; i < 20; i++) searchBands(index, makeQuery(), { tolerance });
  const times = new Float64Array(queries);
  for (let i = 0; i < queries; i++) {
    const query = makeQuery();
    const start = performance.now();
    searchBands(index, query, { tolerance });
    times[i] = performance.now() - start;
  }
  times.sort();
  const at = (q: number): number => times[Math.min(queries - 1, Math.floor(q * queries))] ?? Number.NaN;
  return {
    entries,
    peaks: count,
    queries,
    bandsPerQuery,
    buildMs,
    medianMs: at(0.5),
    p95Ms: at(0.95),
    maxMs: times[queries - 1] ?? Number.NaN,
  };
}

// `npm run bench`: times the full-spectrum search on a seeded synthetic library (not a test; prints one report).
import { spawn } from 'node:child_process';
import { closeSync, mkdtempSync, openSync, rmSync, writeSync } from 'node:fs';
import { availableParallelism, cpus, tmpdir } from 'node:os';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import { parseArgs } from 'node:util';
import { crc32 } from 'node:zlib';
import { seededRandom } from '../src/demo/seededRandom.js';
import { buildSearchMatrix } from '../src/match/buildSearchMatrix.js';
import { createScorePool } from '../src/match/createScorePool.js';
import { instantiateScoreKernels } from '../src/match/instantiateScoreKernels.js';
import { jsScoreKernels } from '../src/match/jsScoreKernels.js';
import { readCachedSearchMatrix } from '../src/match/readCachedSearchMatrix.js';
import { searchSpectra } from '../src/match/searchSpectra.js';
import type { Hit, KernelRunner, QuerySummary, ScoringSet, SearchMatrix } from '../src/match/searchTypes.js';
import { singleThreadRunner } from '../src/match/singleThreadRunner.js';
import { writeCachedSearchMatrix } from '../src/match/writeCachedSearchMatrix.js';
import type { Grid } from '../src/schema/recipe.js';
import { gridAxis } from '../src/spectrum/gridAxis.js';
import { gridLength } from '../src/spectrum/gridLength.js';
import { benchBandSearch } from './benchBandSearch.js';

const usage = `usage: npm run bench -- [--entries N] [--queries Q] [--family F] [--threads T] [--seed S] [--json]
  --entries   synthetic library size (default 100000), each on the default 4000:600:2 grid (1701 points)
  --queries   unknowns timed one by one (default 50); the batch uses 3 blocks of 32 more
  --family    members per family of similar spectra (default 50)
  --threads   worker threads for the kernels (default min(2, cores))
  --json      print one JSON document instead of a table`;

const GRID: Grid = { start: 4000, stop: 600, step: 2 };
const EXCLUDE = [{ min: 2280, max: 2400 }];

interface Band {
  centre: number;
  width: number;
  height: number;
}

/** Band centres where biological mid-IR spectra crowd them: fingerprint, CH stretch, broad NH/OH. */
function familyBands(random: () => number): Band[] {
  const count = 8 + Math.floor(random() * 7);
  return Array.from({ length: count }, () => {
    const u = random();
    if (u < 0.7) return { centre: 900 + random() * 900, width: 5 + random() * 25, height: 0.1 + random() };
    if (u < 0.9)
      return { centre: 2800 + random() * 300, width: 6 + random() * 14, height: 0.1 + random() * 0.6 };
    return { centre: 3100 + random() * 400, width: 60 + random() * 120, height: 0.2 + random() * 0.8 };
  });
}

/**
 * One member of a family: band positions jittered by ±3 cm⁻¹, widths ±10 %, heights ±15 %, a small sloped baseline
 * and noise; NaN inside the CO₂ exclusion (as the recipe leaves it); unit norm like the default recipe.
 */
function member(
  axis: Float64Array,
  bands: Band[],
  random: () => number,
  out: Float64Array,
  extra?: Float64Array,
) {
  out.fill(0);
  for (const band of bands) {
    const centre = band.centre + (random() - 0.5) * 6;
    const width = band.width * (1 + (random() - 0.5) * 0.2);
    const height = band.height * (1 + (random() - 0.5) * 0.3);
    const lo = Math.max(0, Math.floor((centre - 5 * width - axis[0]!) / GRID.step));
    const hi = Math.min(axis.length - 1, Math.ceil((centre + 5 * width - axis[0]!) / GRID.step));
    for (let i = lo; i <= hi; i++)
      out[i] = out[i]! + height * Math.exp(-0.5 * ((axis[i]! - centre) / width) ** 2);
  }
  const offset = 0.02 * random();
  const slope = (random() - 0.5) * 2e-5;
  let ss = 0;
  for (let i = 0; i < axis.length; i++) {
    const w = axis[i]!;
    let v = out[i]! + offset + slope * (w - 2300) + 0.004 * (random() - 0.5) + (extra ? extra[i]! : 0);
    if (w >= EXCLUDE[0]!.min && w <= EXCLUDE[0]!.max) v = Number.NaN;
    else ss += v * v;
    out[i] = v;
  }
  const inv = 1 / Math.sqrt(ss);
  for (let i = 0; i < axis.length; i++) out[i] = out[i]! * inv;
}

function syntheticLibrary(entries: number, family: number, seed: number) {
  const random = seededRandom(seed).uniform;
  const axis = gridAxis(GRID);
  const cols = gridLength(GRID);
  const processed = new Float32Array(entries * cols);
  const families: Band[][] = [];
  const row = new Float64Array(cols);
  for (let r = 0; r < entries; r++) {
    if (r % family === 0) families.push(familyBands(random));
    member(axis, families[families.length - 1]!, random, row);
    processed.set(row, r * cols);
  }
  const set: ScoringSet = {
    grid: GRID,
    recipe: { exclude: EXCLUDE },
    stateKey: `bench-${entries}-${family}-${seed}`,
    entries: Array.from({ length: entries }, (_, r) => ({
      id: `bench-${String(r).padStart(6, '0')}`,
      revision: 1,
      name: `synthetic ${r}`,
      class: `family ${Math.floor(r / family)}`,
    })),
    processed,
  };
  /** An unknown: a fresh member of a random family with a 10 % admixture of another family (a biofluid mixes). */
  const unknown = (): Float64Array => {
    const other = new Float64Array(cols);
    member(axis, families[Math.floor(random() * families.length)]!, random, other);
    for (let i = 0; i < cols; i++) other[i] = Number.isFinite(other[i]!) ? 0.1 * other[i]! : 0;
    const out = new Float64Array(cols);
    member(axis, families[Math.floor(random() * families.length)]!, random, out, other);
    return out;
  };
  return { set, unknown, families: families.length };
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

function timed<T>(fn: () => T): [T, number] {
  const start = performance.now();
  const value = fn();
  return [value, performance.now() - start];
}

/** A python3 + numpy process holding the same prepared matrix, timing its float32 m @ v on request. */
interface NumpyService {
  version: string;
  /** Runs five products and returns their times, ms. */
  time(): Promise<number[]>;
  close(): void;
}

async function startNumpy(matrix: SearchMatrix, folder: string): Promise<NumpyService | string> {
  const { rows, stride, f32 } = matrix.layout;
  const file = join(folder, 'matrix.f32');
  const fd = openSync(file, 'w');
  const chunk = 64 * 1024 * 1024;
  const bytes = rows * stride * 4;
  for (let o = 0; o < bytes; o += chunk) {
    writeSync(fd, new Uint8Array(matrix.memory.buffer, f32 + o, Math.min(chunk, bytes - o)));
  }
  closeSync(fd);
  const script = [
    'import sys, json, time',
    'import numpy as np',
    'm = np.fromfile(sys.argv[1], dtype=np.float32).reshape(int(sys.argv[2]), int(sys.argv[3]))',
    'v = np.random.default_rng(1).standard_normal(m.shape[1]).astype(np.float32)',
    'm @ v',
    'print(json.dumps({"ready": np.__version__}), flush=True)',
    'for line in sys.stdin:',
    '    t = []',
    '    for _ in range(5):',
    '        a = time.perf_counter(); m @ v; t.append((time.perf_counter() - a) * 1000)',
    '    print(json.dumps({"ms": t}), flush=True)',
  ].join('\n');
  const child = spawn('python3', ['-c', script, file, String(rows), String(stride)], {
    stdio: ['pipe', 'pipe', 'pipe'],
  });
  const lines = createInterface({ input: child.stdout });
  const waiting: ((line: string | null) => void)[] = [];
  lines.on('line', (line) => waiting.shift()?.(line));
  lines.on('close', () => {
    for (const w of waiting.splice(0)) w(null);
  });
  let stderr = '';
  child.stderr.on('data', (d: Buffer) => {
    stderr += d.toString();
  });
  const next = () => new Promise<string | null>((resolve) => waiting.push(resolve));
  const failed = new Promise<null>((resolve) => child.on('error', () => resolve(null)));
  const first = await Promise.race([next(), failed]);
  rmSync(file, { force: true });
  if (first === null) {
    child.kill();
    return stderr.trim().split('\n').pop() || 'python3 with numpy not found';
  }
  const version = (JSON.parse(first) as { ready: string }).ready;
  return {
    version,
    async time() {
      child.stdin.write('go\n');
      const line = await next();
      if (line === null) throw new Error(`numpy stopped: ${stderr.trim()}`);
      return (JSON.parse(line) as { ms: number[] }).ms;
    },
    close() {
      child.stdin.end();
      child.kill();
    },
  };
}

async function main(): Promise<void> {
  const { values } = parseArgs({
    options: {
      entries: { type: 'string', default: '100000' },
      queries: { type: 'string', default: '50' },
      family: { type: 'string', default: '50' },
      threads: { type: 'string' },
      seed: { type: 'string', default: '1' },
      json: { type: 'boolean', default: false },
      help: { type: 'boolean', default: false },
    },
    strict: true,
  });
  if (values.help) {
    process.stdout.write(`${usage}\n`);
    return;
  }
  const int = (name: string, text: string | undefined, min: number): number => {
    const n = Number(text);
    if (!Number.isInteger(n) || n < min)
      throw new Error(`--${name} must be a whole number ≥ ${min}, not ${text}`);
    return n;
  };
  const entries = int('entries', values.entries, 100);
  const queryCount = int('queries', values.queries, 1);
  const family = int('family', values.family, 1);
  const seed = int('seed', values.seed, 0);
  const threads =
    values.threads === undefined ? Math.min(2, availableParallelism()) : int('threads', values.threads, 1);
  const log = (text: string) => {
    if (!values.json) process.stderr.write(`${text}\n`);
  };

  log(`generating ${entries} synthetic spectra …`);
  const [library, generateMs] = timed(() => syntheticLibrary(entries, family, seed));
  const { set } = library;
  const cols = gridLength(GRID);
  log('building the search matrix …');
  const [matrix, buildMs] = timed(() => buildSearchMatrix(set, { shared: true, int8: true }));
  const pool = createScorePool(matrix.memory, { threads });
  const oneThread = singleThreadRunner(instantiateScoreKernels(matrix.memory)!);
  const { layout } = matrix;
  const source = () => matrix;
  const search = (
    queries: Float64Array[],
    precision: 'exact' | 'int8',
    runner: KernelRunner,
    summaries?: QuerySummary[],
  ): Hit[][] =>
    searchSpectra(set, queries, {
      k: 10,
      precision,
      matrices: source,
      runner: () => runner,
      ...(summaries ? { onQuery: (_: number, s: QuerySummary) => summaries.push(s) } : {}),
    });

  const queries = Array.from({ length: queryCount }, () => library.unknown());
  // Warm-up: compile the kernels' hot paths and touch every page once.
  search([queries[0]!], 'exact', pool);
  search([queries[0]!], 'int8', pool);

  log('timing band search (band index of the match layer) …');
  let bandSearchMs: number | null = null;
  let bandNote = '';
  try {
    const band = benchBandSearch({ entries, seed });
    bandSearchMs = band.medianMs;
    bandNote = `${band.peaks} peaks, ${band.bandsPerQuery} bands per query, median of ${band.queries} (p95 ${band.p95Ms.toFixed(4)} ms)`;
  } catch (error) {
    bandNote = `band search failed: ${(error as Error).message}`;
  }

  const folder = mkdtempSync(join(tmpdir(), 'bandshelf-bench-'));
  let cacheReadMs: number | null = null;
  let crcMs: number | null = null;
  let crcMb: number | null = null;
  let numpy: NumpyService | string = 'not run';
  const t = {
    exact: [] as number[],
    fast: [] as number[],
    oneThread: [] as number[],
    kernelExact: [] as number[],
    kernelInt8: [] as number[],
    floor: [] as number[],
    js: [] as number[],
    batchExact: [] as number[],
    batchFast: [] as number[],
    numpy: [] as number[],
  };
  let agree = 0;
  let batchAgree = 0;
  let batchQueries = 0;
  const rescored: number[] = [];
  const js = jsScoreKernels(matrix.memory);
  let rssMb = 0;
  try {
    log('starting numpy on the same matrix …');
    numpy = await startNumpy(matrix, folder);
    // Rounds interleave every measurement, numpy's included, so a neighbour's load on a shared machine falls on
    // all of them alike instead of on whichever ran last.
    const rounds = Math.min(5, queryCount);
    for (let round = 0; round < rounds; round++) {
      log(`round ${round + 1} of ${rounds} …`);
      if (typeof numpy !== 'string') t.numpy.push(...(await numpy.time()));
      for (let q = round; q < queryCount; q += rounds) {
        const query = queries[q]!;
        const [exact, tExact] = timed(() => search([query], 'exact', pool)[0]!);
        const summaries: QuerySummary[] = [];
        const [fast, tFast] = timed(() => search([query], 'int8', pool, summaries)[0]!);
        t.exact.push(tExact);
        t.fast.push(tFast);
        rescored.push(summaries[0]?.rescored ?? Number.NaN);
        const same =
          exact.length === fast.length &&
          exact.every((h, j) => h.id === fast[j]!.id && h.rawScore === fast[j]!.rawScore);
        if (same) agree++;
      }
      t.oneThread.push(timed(() => search([queries[round]!], 'exact', oneThread))[1]);
      for (let i = 0; i < 3; i++) {
        t.floor.push(
          timed(() => pool.run('sumF32', layout.rows, [layout.f32, layout.stride, layout.scores]))[1],
        );
        t.kernelExact.push(
          timed(() =>
            pool.run('dotF32', layout.rows, [layout.f32, layout.stride, layout.queries, layout.scores]),
          )[1],
        );
        t.kernelInt8.push(
          timed(() =>
            pool.run('dotI8', layout.rows, [
              layout.i8,
              layout.stride,
              layout.query16,
              layout.int8Scale,
              1,
              layout.scores,
            ]),
          )[1],
        );
      }
      t.js.push(
        timed(() => js.dotF32(0, layout.rows, layout.f32, layout.stride, layout.queries, layout.scores))[1],
      );
      const block = Array.from({ length: 32 }, () => library.unknown());
      const [exactBlock, tBatchExact] = timed(() => search(block, 'exact', pool));
      const [fastBlock, tBatchFast] = timed(() => search(block, 'int8', pool));
      t.batchExact.push(tBatchExact / 32);
      t.batchFast.push(tBatchFast / 32);
      for (let q = 0; q < 32; q++) {
        batchQueries++;
        if (exactBlock[q]!.map((h) => h.id).join() === fastBlock[q]!.map((h) => h.id).join()) batchAgree++;
      }
    }
    // Steady state of a search process: the search set plus one matrix (before the cache copy below).
    rssMb = process.memoryUsage().rss / 2 ** 20;
    if (typeof numpy !== 'string') numpy.close();
    log('timing the matrix cache …');
    // The cache's CRC-32 (node:zlib) over the bytes the cache file holds, as writeCachedSearchMatrix and check
    // compute it; median of 3.
    const cachedBytes = layout.end - layout.cached;
    const crcRuns = [0, 1, 2].map(
      () => timed(() => crc32(new Uint8Array(matrix.memory.buffer, layout.cached, cachedBytes)))[1],
    );
    crcMs = median(crcRuns);
    crcMb = cachedBytes / 2 ** 20;
    const cacheFile = join(folder, 'search.bin');
    if (writeCachedSearchMatrix(cacheFile, matrix, { keep: 1 })) {
      const [back, ms] = timed(() =>
        readCachedSearchMatrix(cacheFile, { key: matrix.key, rows: layout.rows, cols }, { shared: true }),
      );
      if (back !== null) cacheReadMs = ms;
      rmSync(cacheFile, { force: true });
    }
  } finally {
    if (typeof numpy !== 'string') numpy.close();
    rmSync(folder, { recursive: true, force: true });
  }
  const threadsUsed = pool.threads;
  pool.close();

  const numpyMs = t.numpy.length > 0 ? median(t.numpy) : null;
  const single = median(t.fast);
  const singleExact = median(t.exact);
  const batch = median(t.batchFast);
  const batchExact = median(t.batchExact);
  const floorMs = median(t.floor);
  const ratio = (a: number, b: number | null) => (b === null || b === 0 ? null : Number((a / b).toFixed(3)));
  const round = (x: number, digits = 3) => Number(x.toFixed(digits));
  const report = {
    entries,
    points: cols,
    stride: layout.stride,
    families: library.families,
    threads: threadsUsed,
    queries: queryCount,
    batch_queries: batchQueries,
    cpu: cpus()[0]?.model ?? 'unknown',
    node: process.version,
    generate_ms: round(generateMs, 1),
    matrix_build_ms: round(buildMs, 1),
    matrix_from_cache_ms: cacheReadMs === null ? null : round(cacheReadMs, 1),
    cache_crc32_ms: crcMs === null ? null : round(crcMs, 1),
    cache_mb: crcMb === null ? null : round(crcMb, 1),
    single_query_ms: round(single),
    single_query_path: 'int8 scan + exact float32 rescoring (default)',
    single_query_exact_ms: round(singleExact),
    single_query_exact_1thread_ms: round(median(t.oneThread)),
    kernel_exact_ms: round(median(t.kernelExact)),
    kernel_int8_ms: round(median(t.kernelInt8)),
    plain_js_kernel_ms: round(median(t.js)),
    batch32_ms_per_query: round(batch),
    batch32_exact_ms_per_query: round(batchExact),
    batch_speedup_vs_single: ratio(single, batch),
    batch_exact_speedup_vs_single_exact: ratio(singleExact, batchExact),
    band_search_ms: bandSearchMs === null ? null : round(bandSearchMs, 5),
    band_search_note: bandNote,
    numpy_ms: numpyMs === null ? null : round(numpyMs),
    numpy_note:
      typeof numpy === 'string'
        ? numpy
        : `numpy ${numpy.version}, float32 m @ v on the same matrix, median of ${t.numpy.length} interleaved runs`,
    bandwidth_floor_ms: round(floorMs),
    ratio_single_to_numpy: ratio(single, numpyMs),
    ratio_single_exact_to_numpy: ratio(singleExact, numpyMs),
    ratio_single_to_floor: ratio(single, floorMs),
    ratio_single_exact_to_floor: ratio(singleExact, floorMs),
    ratio_plain_js_to_numpy: ratio(median(t.js), numpyMs),
    fast_path_top10_agreement: round(agree / queryCount, 4),
    fast_batch_top10_agreement: round(batchAgree / Math.max(1, batchQueries), 4),
    fast_path_rescored_rows_median: median(rescored),
    rss_mb: round(rssMb, 1),
    max_rss_mb: round(process.resourceUsage().maxRSS / 1024, 1),
  };
  if (values.json) {
    process.stdout.write(`${JSON.stringify(report, null, 2)}\n`);
    return;
  }
  const ms = (x: number | null) => (x === null ? 'n/a' : `${x} ms`);
  const x = (v: number | null) => (v === null ? 'n/a' : `${v}×`);
  const lines: [string, string][] = [
    [
      'library',
      `${entries} synthetic spectra × ${cols} points (${library.families} families), ${threadsUsed} threads`,
    ],
    ['machine', `${report.cpu}, Node ${process.version}`],
    ['matrix build / from cache', `${ms(report.matrix_build_ms)} / ${ms(report.matrix_from_cache_ms)}`],
    ['cache CRC-32 (node:zlib)', `${ms(report.cache_crc32_ms)} over ${report.cache_mb} MB`],
    ['one query (default: int8 + exact rescore)', ms(report.single_query_ms)],
    ['one query, exact float32 SIMD', ms(report.single_query_exact_ms)],
    ['one query, exact, 1 thread', ms(report.single_query_exact_1thread_ms)],
    ['kernel only: float32 / int8', `${ms(report.kernel_exact_ms)} / ${ms(report.kernel_int8_ms)}`],
    ['kernel only: plain JavaScript', ms(report.plain_js_kernel_ms)],
    [
      '32-query batch per query (default)',
      `${ms(report.batch32_ms_per_query)} (${x(report.batch_speedup_vs_single)} cheaper than one)`,
    ],
    [
      '32-query batch per query, exact',
      `${ms(report.batch32_exact_ms_per_query)} (${x(report.batch_exact_speedup_vs_single_exact)} cheaper than one exact)`,
    ],
    ['band search', `${ms(report.band_search_ms)} ${bandNote ? `(${bandNote})` : ''}`],
    ['numpy float32 mat-vec', `${ms(report.numpy_ms)} (${report.numpy_note})`],
    ['memory-bandwidth floor (one read)', ms(report.bandwidth_floor_ms)],
    [
      'default / numpy, exact / numpy',
      `${x(report.ratio_single_to_numpy)} / ${x(report.ratio_single_exact_to_numpy)}`,
    ],
    [
      'default / floor, exact / floor',
      `${x(report.ratio_single_to_floor)} / ${x(report.ratio_single_exact_to_floor)}`,
    ],
    [
      'fast path top-10 = exact top-10',
      `${(report.fast_path_top10_agreement * 100).toFixed(1)} % of ${queryCount} queries, ${(report.fast_batch_top10_agreement * 100).toFixed(1)} % of ${batchQueries} batched`,
    ],
    ['rows rescored exactly (median)', String(report.fast_path_rescored_rows_median)],
    ['memory', `rss ${report.rss_mb} MB searching, peak ${report.max_rss_mb} MB (with the cache copy)`],
  ];
  const width = Math.max(...lines.map(([k]) => k.length));
  process.stdout.write(`${lines.map(([k, v]) => `${k.padEnd(width)}  ${v}`).join('\n')}\n`);
}

try {
  await main();
} catch (error) {
  process.stderr.write(`bench: ${(error as Error).message}\n${usage}\n`);
  process.exitCode = 1;
}

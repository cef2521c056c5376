// `npm run fuzz -- --count N --seed S`: the readers' property generators at volume, each input also mutated, plus
// scaled-up worst cases; a watchdog thread reports any input running over 5 s; prints one JSON summary.
import { performance } from 'node:perf_hooks';
import { fileURLToPath } from 'node:url';
import { isMainThread, parentPort, Worker, workerData } from 'node:worker_threads';
import fc from 'fast-check';
import { BandshelfError } from '../src/error.js';
import { readSpectrumFile } from '../src/formats/readSpectrumFile.js';
import { readTimeTrace } from '../src/formats/readTimeTrace.js';
import { readerFuzzCases } from './readerFuzzCases.js';

const WATCHDOG_MS = 5000;

interface Slowest {
  reader: string;
  property: string;
  bytes: number;
  ms: number;
  msPerMB: number;
}

interface FuzzSummary {
  seed: number;
  inputs: number;
  mutatedInputs: number;
  largeInputs: number;
  failures: number;
  failuresByCode: Record<string, number>;
  firstFailures: { reader: string; property: string; code: string; message: string }[];
  refusalsOfMutatedByCode: Record<string, number>;
  over5s: { reader: string; property: string; ms: number }[];
  /** The input with the longest wall time (which on a shared machine may be mostly waiting) … */
  slowest: Slowest | null;
  /** … and the one with the most CPU time. */
  slowestCpu: (Slowest & { cpuMs: number; cpuMsPerMB: number }) | null;
  worstLargePerMB: Slowest | null;
  /** Each scaled-up worst case: its size, wall and CPU time, and each per MB of input. */
  large: { name: string; bytes: number; ms: number; msPerMB: number; cpuMs: number; cpuMsPerMB: number }[];
  seconds: number;
}

function argument(argv: readonly string[], name: string, fallback: number): number {
  const at = argv.indexOf(`--${name}`);
  if (at < 0) return fallback;
  const value = Number(argv[at + 1]);
  if (!Number.isInteger(value) || value < 0) {
    process.stderr.write(`fuzz: --${name} must be a whole number ≥ 0\n`);
    process.exit(2);
  }
  return value;
}

/** The code a failure is counted under: the BandshelfError's code, or what went wrong otherwise. */
function failureCode(error: unknown): string {
  if (error instanceof BandshelfError) return error.code;
  const message = error instanceof Error ? error.message : String(error);
  if (/^not a BandshelfError/.test(message)) return 'STACK_TRACE';
  if (/^unexpected code|does not name the file|more than one line/.test(message)) return 'BAD_ERROR';
  return 'WRONG_RESULT';
}

/** Flips, deletes or inserts a few bytes, from a seeded generator. */
function mutate(bytes: Uint8Array, random: () => number): Uint8Array {
  const out = Array.from(bytes);
  const edits = 1 + Math.floor(random() * 4);
  for (let k = 0; k < edits; k++) {
    const at = Math.floor(random() * (out.length + 1));
    const kind = random();
    if (kind < 0.4 && out.length > 0) out[at % out.length] = Math.floor(random() * 256);
    else if (kind < 0.7) out.splice(at, 1);
    else out.splice(at, 0, '0-.E?,;\t\n#$@AjS%'.charCodeAt(Math.floor(random() * 17)));
  }
  return Uint8Array.from(out);
}

/** Scaled-up worst cases for time per MB: a 1 MB number cell, nested titles, pseudo-digit and DUP runs. */
function largeInputs(): { name: string; bytes: Uint8Array; read: (b: Uint8Array) => unknown }[] {
  const enc = new TextEncoder();
  const spectrum = (b: Uint8Array) => readSpectrumFile(b, { file: 'large.dat' });
  const head = '##TITLE=t\n##JCAMP-DX=4.24\n##XUNITS=1/CM\n##YUNITS=ABSORBANCE\n##XYDATA=(X++(Y..Y))\n';
  const digits = '1'.repeat(1_000_000);
  const csvRows = Array.from({ length: 50_000 }, (_, i) => `${1000 + i * 0.01},${(i % 97) / 97}`).join('\n');
  return [
    { name: 'csv 1 MB number cell', bytes: enc.encode(`x,y\n1000,${digits}\n1002,0.5\n`), read: spectrum },
    {
      name: 'csv 50,000 rows',
      bytes: enc.encode(`wavenumber_cm-1,absorbance\n${csvRows}\n`),
      read: spectrum,
    },
    {
      name: 'jcamp-dx 100,000 block titles',
      bytes: enc.encode(`${'##TITLE=a\n'.repeat(100_000)}##END=\n`),
      read: spectrum,
    },
    {
      name: 'jcamp-dx 1 MB AFFN number',
      bytes: enc.encode(`${head}1000 ${digits}\n##END=\n`),
      read: spectrum,
    },
    {
      name: 'jcamp-dx 1 MB SQZ run',
      bytes: enc.encode(`${head}1000 ${'A1'.repeat(500_000)}\n##END=\n`),
      read: spectrum,
    },
    {
      name: 'jcamp-dx DUP runs',
      bytes: enc.encode(`${head}${'1000 A1S9999\n'.repeat(50)}##END=\n`),
      read: spectrum,
    },
    {
      name: 'trace 1 MB number cell',
      bytes: enc.encode(
        `delay (fs),field\n${Array.from({ length: 20 }, (_, i) => `${i},${i ? i : digits}`).join('\n')}\n`,
      ),
      read: (b) => readTimeTrace(b, { file: 'large.dat' }),
    },
  ];
}

function runWorker(count: number, seed: number, progress: Float64Array): FuzzSummary {
  const started = performance.now();
  const cases = readerFuzzCases();
  const perCase = Math.ceil(count / cases.length);
  const failuresByCode: Record<string, number> = {};
  const refusals: Record<string, number> = {};
  const firstFailures: FuzzSummary['firstFailures'] = [];
  const over5s: FuzzSummary['over5s'] = [];
  let slowest: Slowest | null = null;
  let slowestCpu: FuzzSummary['slowestCpu'] = null;
  let inputs = 0;
  let mutated = 0;
  let failures = 0;
  let state = seed >>> 0 || 1;
  const random = () => {
    // xorshift32: the mutations' own seeded stream, independent of fast-check's.
    state ^= state << 13;
    state ^= state >>> 17;
    state ^= state << 5;
    return (state >>> 0) / 4294967296;
  };
  const timed = (reader: string, property: string, bytes: number, run: () => void): void => {
    progress[0] = Date.now();
    const t = performance.now();
    const cpu = process.cpuUsage();
    try {
      run();
    } finally {
      const ms = performance.now() - t;
      const used = process.cpuUsage(cpu);
      const cpuMs = (used.user + used.system) / 1000;
      progress[0] = 0;
      if (ms > WATCHDOG_MS) over5s.push({ reader, property, ms });
      if (slowest === null || ms > slowest.ms) {
        slowest = { reader, property, bytes, ms, msPerMB: ms / Math.max(bytes / 1e6, 1e-9) };
      }
      if (slowestCpu === null || cpuMs > slowestCpu.cpuMs) {
        const mb = Math.max(bytes / 1e6, 1e-9);
        slowestCpu = { reader, property, bytes, ms, msPerMB: ms / mb, cpuMs, cpuMsPerMB: cpuMs / mb };
      }
    }
  };
  cases.forEach((c, k) => {
    const batch = fc.sample(c.inputs, { seed: seed + k, numRuns: Math.min(perCase, count - inputs) });
    for (const input of batch) {
      if (inputs >= count) break;
      inputs++;
      try {
        timed(c.reader, c.property, input.bytes.length, input.check);
      } catch (error) {
        failures++;
        const code = failureCode(error);
        failuresByCode[code] = (failuresByCode[code] ?? 0) + 1;
        if (firstFailures.length < 5) {
          firstFailures.push({
            reader: c.reader,
            property: c.property,
            code,
            message: (error instanceof Error ? error.message : String(error)).slice(0, 300),
          });
        }
      }
      const bad = mutate(input.bytes, random);
      mutated++;
      try {
        timed(c.reader, 'mutated', bad.length, () => c.read(bad));
      } catch (error) {
        if (error instanceof BandshelfError) refusals[error.code] = (refusals[error.code] ?? 0) + 1;
        else {
          failures++;
          failuresByCode.STACK_TRACE = (failuresByCode.STACK_TRACE ?? 0) + 1;
          if (firstFailures.length < 5) {
            firstFailures.push({
              reader: c.reader,
              property: 'mutated',
              code: 'STACK_TRACE',
              message: String(error),
            });
          }
        }
      }
    }
  });
  let worstLarge: Slowest | null = null;
  const large = largeInputs();
  const largeTimes: FuzzSummary['large'] = [];
  for (const item of large) {
    const t = performance.now();
    const cpu = process.cpuUsage();
    progress[0] = Date.now();
    try {
      item.read(item.bytes);
    } catch (error) {
      if (!(error instanceof BandshelfError)) {
        failures++;
        failuresByCode.STACK_TRACE = (failuresByCode.STACK_TRACE ?? 0) + 1;
      }
    }
    progress[0] = 0;
    const ms = performance.now() - t;
    const used = process.cpuUsage(cpu);
    // CPU time of the process (the watchdog thread only sleeps): on a shared machine wall time also counts waiting.
    const cpuMs = (used.user + used.system) / 1000;
    const perMB = ms / (item.bytes.length / 1e6);
    if (ms > WATCHDOG_MS) over5s.push({ reader: item.name, property: 'large', ms });
    largeTimes.push({
      name: item.name,
      bytes: item.bytes.length,
      ms,
      msPerMB: perMB,
      cpuMs,
      cpuMsPerMB: cpuMs / (item.bytes.length / 1e6),
    });
    if (worstLarge === null || perMB > worstLarge.msPerMB) {
      worstLarge = { reader: item.name, property: 'large', bytes: item.bytes.length, ms, msPerMB: perMB };
    }
  }
  return {
    seed,
    inputs,
    mutatedInputs: mutated,
    largeInputs: large.length,
    failures,
    failuresByCode,
    firstFailures,
    refusalsOfMutatedByCode: refusals,
    over5s,
    slowest,
    slowestCpu,
    worstLargePerMB: worstLarge,
    large: largeTimes,
    seconds: (performance.now() - started) / 1000,
  };
}

if (isMainThread) {
  const argv = process.argv.slice(2);
  const count = argument(argv, 'count', 1000);
  const seed = argument(argv, 'seed', 1);
  const shared = new SharedArrayBuffer(8);
  const progress = new Float64Array(shared);
  const worker = new Worker(fileURLToPath(import.meta.url), { workerData: { count, seed, shared } });
  let reported = false;
  // The watchdog: the worker stamps the start of each input; an input still running after 5 s is reported here,
  // from another thread, because a reader stuck in a loop never yields to a timer of its own.
  const watchdog = setInterval(() => {
    const start = progress[0]!;
    // Date.now(), not performance.now(): each thread's performance clock has its own origin.
    if (start > 0 && Date.now() - start > WATCHDOG_MS && !reported) {
      reported = true;
      process.stderr.write(`fuzz: an input has run for over ${WATCHDOG_MS / 1000} s\n`);
    }
    if (start === 0) reported = false;
  }, 250);
  worker.on('message', (summary: FuzzSummary) => {
    clearInterval(watchdog);
    process.stdout.write(`${JSON.stringify(summary, null, 2)}\n`);
    process.exitCode = summary.failures > 0 || summary.over5s.length > 0 ? 1 : 0;
  });
  worker.on('error', (error) => {
    clearInterval(watchdog);
    process.stderr.write(`fuzz: the worker failed: ${error.stack ?? String(error)}\n`);
    process.exitCode = 1;
  });
} else {
  const { count, seed, shared } = workerData as { count: number; seed: number; shared: SharedArrayBuffer };
  parentPort!.postMessage(runWorker(count, seed, new Float64Array(shared)));
}

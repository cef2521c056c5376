// `npm run bench:cli -- --entries N`: whole-process times and peak memory of the real CLI against a synthetic
// N-entry library (invented, labelled synthetic; built through the ingest API and cached in the system's temp
// folder): `match` of one unknown with and without the search cache, `add` of one file, `list`, `show`, `check`
// and `site`. Prints one JSON line; list, show and check also per 1,000 entries.
import { spawnSync } from 'node:child_process';
import { copyFileSync, cpSync, existsSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
import { join } from 'node:path';
import { findPackageRoot } from '../src/site/findPackageRoot.js';
import { benchArgs } from './benchArgs.js';
import { benchLibrary } from './benchLibrary.js';
import { syntheticReferenceCsv } from './syntheticReferenceCsv.js';

const cli = join(findPackageRoot(import.meta.url), 'dist', 'bandshelf.js');
const runner = `import(${JSON.stringify(`file://${cli}`)}).then(async (m) => { process.exitCode = await m.main(process.argv.slice(1)); })`;

interface Run {
  s: number;
  /** User + system CPU seconds (from /usr/bin/time): comparable when other work shares the cores. */
  cpu_s: number | null;
  peak_rss_mb: number | null;
}

/** One whole process (node start-up included), peak resident memory from /usr/bin/time when present. */
function run(args: string[], what: string): Run {
  const timeBin = existsSync('/usr/bin/time') ? '/usr/bin/time' : null;
  const node = [process.execPath, '--input-type=module', '-e', runner, ...args];
  const argv = timeBin ? ['-f', 'BENCH_RSS_KB=%M BENCH_CPU_S=%U+%S', ...node] : node.slice(1);
  const start = performance.now();
  const result = spawnSync(timeBin ?? process.execPath, argv, { encoding: 'utf8', maxBuffer: 256 * 2 ** 20 });
  const s = (performance.now() - start) / 1000;
  if (result.status !== 0) {
    process.stderr.write(
      `bench:cli: ${what} failed (exit ${result.status}):\n${result.stderr.slice(-2000)}\n`,
    );
    process.exit(1);
  }
  const rss = /BENCH_RSS_KB=(\d+)/.exec(result.stderr ?? '');
  const cpu = /BENCH_CPU_S=([\d.]+)\+([\d.]+)/.exec(result.stderr ?? '');
  return {
    s: Math.round(s * 1000) / 1000,
    cpu_s: cpu ? Math.round((Number(cpu[1]) + Number(cpu[2])) * 100) / 100 : null,
    peak_rss_mb: rss ? Math.round(Number(rss[1]) / 1024) : null,
  };
}

function perThousand(r: Run, entries: number) {
  return { ...r, s_per_1000_entries: Math.round((r.s / (entries / 1000)) * 1e4) / 1e4 };
}

function main(): void {
  const args = benchArgs(process.argv.slice(2), { entries: 100_000, batch: 500 });
  const { path, dir } = benchLibrary(args.entries, { batch: args.batch });
  const work = join(dir, `cli-run-${process.pid}`);
  mkdirSync(work, { recursive: true });
  try {
    // The unknown: a spectrum the library does not hold (a k past its end).
    const unknown = join(work, 'unknown.csv');
    writeFileSync(unknown, syntheticReferenceCsv(args.entries + 17).csv);
    const extra = syntheticReferenceCsv(args.entries + 18);
    const added = join(work, `${extra.id}.csv`);
    writeFileSync(added, extra.csv);
    const lib = ['--library', path];
    rmSync(`${path}.cache`, { recursive: true, force: true });
    const matchNoCache = run(['match', unknown, ...lib, '--json'], 'match (no cache)');
    const matchCache = run(['match', unknown, ...lib, '--json'], 'match (cache)');
    const mixture = run(['match', unknown, ...lib, '--json', '--mixture'], 'match --mixture (cache)');
    const list = run(['list', ...lib, '--json'], 'list');
    const show = run(['show', 'synthetic-0000000', ...lib], 'show');
    const check = run(['check', ...lib, '--json'], 'check');
    const site = run(['site', ...lib, '--out', join(work, 'site'), '--clean', '--json'], 'site');
    // `add` writes: into a copy, so the cached library stays as built. The search cache the matches left is copied
    // with it (it is keyed by library state, not path), as an add normally finds it.
    const copy = join(work, 'copy.sqlite');
    copyFileSync(path, copy);
    if (existsSync(`${path}.cache`)) cpSync(`${path}.cache`, `${copy}.cache`, { recursive: true });
    const add = run(['add', added, '--library', copy, '--force', '--json'], 'add');
    const result = {
      bench: 'cli',
      entries: args.entries,
      cores: availableParallelism(),
      load_average_1m: Math.round(loadavg()[0]! * 100) / 100,
      match_no_cache: matchNoCache,
      match_cache: matchCache,
      match_mixture_cache: mixture,
      add_one_file: add,
      list: perThousand(list, args.entries),
      show: perThousand(show, args.entries),
      check: perThousand(check, args.entries),
      site,
      targets_at_100000: {
        match_cache_s: 1.0,
        match_cache_rss_mb: 1536,
        match_no_cache_s: 15,
        add_one_file_s: 0.5,
        site_rss_mb: 4096,
      },
    };
    process.stdout.write(`${JSON.stringify(result)}\n`);
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

main();

// `npm run bench:site`: build time and output size of the static site for the demo library and for a synthetic
// library of many entries (default 10,000), each built by the real CLI in a fresh process; then, after one `add`,
// the time of `site` again into the same folder (reusing what did not change) and how many files it changed.
import { spawnSync } from 'node:child_process';
import { cpSync, existsSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { findPackageRoot } from '../src/site/findPackageRoot.js';
import { syntheticSiteLibrary } from './syntheticSiteLibrary.js';

interface SiteFigures {
  library: string;
  entries: number;
  build_s: number;
  files: number;
  bytes: number;
  mb: number;
  /** Bytes per entry page folder (the page and its JSON download), averaged. */
  entry_bytes: number;
  /** Peak resident memory of the build process, MB (from /usr/bin/time when present, else null). */
  rss_mb: number | null;
  /** `site` again into the same folder after one `add`: seconds, entries whose files were reused, files changed. */
  rebuild_after_add_s: number;
  rebuild_reused: number;
  rebuild_files_changed: number;
}

const root = findPackageRoot(import.meta.url);
const cli = join(root, 'src', 'cli', 'bandshelf.mjs');

function parseArgs(argv: string[]): { entries: number; json: boolean; keep: boolean } {
  let entries = 10_000;
  let json = false;
  let keep = false;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--json') json = true;
    else if (a === '--keep') keep = true;
    else if (a === '--entries') entries = Number(argv[++i]);
    else if (a?.startsWith('--entries=')) entries = Number(a.slice('--entries='.length));
  }
  if (!Number.isInteger(entries) || entries < 1) {
    process.stderr.write('bench:site: --entries must be a whole number ≥ 1\n');
    process.exit(2);
  }
  return { entries, json, keep };
}

function run(args: string[], what: string): { ms: number; rssMb: number | null; stdout: string } {
  const timeBin = existsSync('/usr/bin/time') ? '/usr/bin/time' : null;
  const command = timeBin ?? process.execPath;
  const argv = timeBin ? ['-f', 'BENCH_RSS_KB=%M', process.execPath, cli, ...args] : [cli, ...args];
  const start = performance.now();
  const result = spawnSync(command, argv, { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  const ms = performance.now() - start;
  if (result.status !== 0) {
    process.stderr.write(
      `bench:site: ${what} failed (exit ${result.status}):\n${result.stderr.slice(-2000)}\n`,
    );
    process.exit(1);
  }
  const rss = /BENCH_RSS_KB=(\d+)/.exec(result.stderr ?? '');
  return { ms, rssMb: rss ? Number(rss[1]) / 1024 : null, stdout: result.stdout };
}

function sizeOf(dir: string): { files: number; bytes: number } {
  let files = 0;
  let bytes = 0;
  const walk = (d: string): void => {
    for (const name of readdirSync(d)) {
      const full = join(d, name);
      const st = statSync(full);
      if (st.isDirectory()) walk(full);
      else {
        files++;
        bytes += st.size;
      }
    }
  };
  walk(dir);
  return { files, bytes };
}

function demoLibrary(work: string): string {
  const library = join(work, 'demo.sqlite');
  run(['init', '--library', library], 'init (demo)');
  run(['add', join(root, 'library'), '--library', library, '--message', 'demo', '--json'], 'add (demo)');
  return library;
}

/** Files whose bytes differ between two build manifests (added and removed files count too). */
function filesChanged(before: Record<string, string>, after: Record<string, string>): number {
  const paths = new Set([...Object.keys(before), ...Object.keys(after)]);
  return [...paths].filter((p) => before[p] !== after[p]).length;
}

const manifestFiles = (out: string): Record<string, string> =>
  (JSON.parse(readFileSync(join(out, '.bandshelf-site.json'), 'utf8')) as { files: Record<string, string> })
    .files;

function measure(label: string, library: string, out: string): SiteFigures {
  const { ms, rssMb, stdout } = run(
    ['site', '--library', library, '--out', out, '--clean', '--json'],
    `site (${label})`,
  );
  const first = manifestFiles(out);
  // One add (a demo compound under a new id), then the same `site` again: only what the add changed is made.
  run(
    [
      'add',
      join(root, 'library', '31-caffeine.jdx'),
      '--id',
      'bench-added-entry',
      '--force',
      '--library',
      library,
    ],
    `add (${label})`,
  );
  const again = run(['site', '--library', library, '--out', out, '--json'], `site again (${label})`);
  const rebuilt = JSON.parse(again.stdout) as { reused: number };
  const built = JSON.parse(stdout) as { entries: number };
  const { files, bytes } = sizeOf(out);
  const entriesDir = join(out, 'entries');
  const entryBytes = existsSync(entriesDir) ? sizeOf(entriesDir).bytes : 0;
  return {
    library: label,
    entries: built.entries,
    build_s: Math.round(ms / 100) / 10,
    files,
    bytes,
    mb: Math.round(bytes / 1e5) / 10,
    entry_bytes: built.entries > 0 ? Math.round(entryBytes / built.entries) : 0,
    rss_mb: rssMb === null ? null : Math.round(rssMb),
    rebuild_after_add_s: Math.round(again.ms / 100) / 10,
    rebuild_reused: rebuilt.reused,
    rebuild_files_changed: filesChanged(first, manifestFiles(out)),
  };
}

function main(): void {
  const args = parseArgs(process.argv.slice(2));
  const work = join(tmpdir(), `bandshelf-bench-site-run-${process.pid}`);
  mkdirSync(work, { recursive: true });
  try {
    const demo = measure('demo', demoLibrary(work), join(work, 'demo-site'));
    // A copy of the cached synthetic library (the add below must not change the cache other runs share).
    const cached = syntheticSiteLibrary(args.entries, { run: (a, what) => run(a, what) }).library;
    const copy = join(work, 'synthetic.sqlite');
    run(['backup', copy, '--library', cached], 'backup (synthetic)');
    if (existsSync(`${cached}.cache`)) cpSync(`${cached}.cache`, `${copy}.cache`, { recursive: true });
    const synthetic = measure(`synthetic-${args.entries}`, copy, join(work, 'synthetic-site'));
    const targets = { build_s: 60, mb: 500 };
    const result = { demo, synthetic, targets, cores: availableParallelism() };
    if (args.json) {
      process.stdout.write(`${JSON.stringify(result)}\n`);
      return;
    }
    const row = (f: SiteFigures) =>
      `${f.library.padEnd(18)} ${String(f.entries).padStart(7)} ${f.build_s.toFixed(1).padStart(8)} ${String(f.files).padStart(7)} ${f.mb.toFixed(1).padStart(9)} ${String(f.entry_bytes).padStart(10)} ${String(f.rss_mb ?? '–').padStart(7)} ${f.rebuild_after_add_s.toFixed(1).padStart(10)} ${`${f.rebuild_reused} reused, ${f.rebuild_files_changed} files changed`.padStart(30)}`;
    process.stdout.write(
      [
        `${'library'.padEnd(18)} ${'entries'.padStart(7)} ${'build s'.padStart(8)} ${'files'.padStart(7)} ${'output MB'.padStart(9)} ${'B / entry'.padStart(10)} ${'RSS MB'.padStart(7)} ${'1 add: s'.padStart(10)} ${'what the rebuild made'.padStart(30)}`,
        row(demo),
        row(synthetic),
        `targets for 10,000 entries: build under ${targets.build_s} s, output under ${targets.mb} MB`,
        '',
      ].join('\n'),
    );
  } finally {
    if (!args.keep) rmSync(work, { recursive: true, force: true });
  }
}

main();

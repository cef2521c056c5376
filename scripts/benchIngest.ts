// `npm run bench:ingest -- --entries N`: adds N synthetic 3,350-point CSV references (invented, labelled synthetic)
// in batches into one fresh library through the real ingest API, and prints one JSON line: files/s and peak
// memory per tenth of the run, and bytes on disk per entry and per original byte. The finished library is kept in
// the system's temp folder for `bench:cli`.
import { statSync } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
import { benchArgs } from './benchArgs.js';
import { type BatchFigures, benchLibrary } from './benchLibrary.js';

function main(): void {
  const args = benchArgs(process.argv.slice(2), { entries: 100_000, batch: 500 });
  const batches: BatchFigures[] = [];
  const t0 = performance.now();
  const { path, originalBytes } = benchLibrary(args.entries, {
    batch: args.batch,
    fresh: true,
    onBatch: (b) => {
      batches.push(b);
      if (!args.quiet) process.stderr.write(`bench:ingest: ${b.entries}/${args.entries}\r`);
    },
  });
  if (!args.quiet) process.stderr.write('\n');
  const totalS = (performance.now() - t0) / 1000;
  const tenths = [];
  for (let t = 0; t < 10; t++) {
    const lo = (args.entries * t) / 10;
    const hi = (args.entries * (t + 1)) / 10;
    const inTenth = batches.filter((b) => b.entries > lo && b.entries <= hi);
    if (inTenth.length === 0) continue;
    const files = inTenth.reduce((s, b) => s + b.files, 0);
    const ms = inTenth.reduce((s, b) => s + b.ms, 0);
    const cpuMs = inTenth.reduce((s, b) => s + b.cpuMs, 0);
    tenths.push({
      tenth: t + 1,
      library_entries_after: inTenth[inTenth.length - 1]!.entries,
      files,
      files_per_s: Math.round((files / ms) * 1000 * 10) / 10,
      files_per_cpu_s: Math.round((files / cpuMs) * 1000 * 10) / 10,
      peak_rss_mb: Math.round(Math.max(...inTenth.map((b) => b.rss)) / 2 ** 20),
    });
  }
  const bytes = ['', '-wal'].reduce((s, suffix) => {
    try {
      return s + statSync(path + suffix).size;
    } catch {
      return s;
    }
  }, 0);
  const first = tenths[0]?.files_per_s ?? 0;
  const last = tenths[tenths.length - 1]?.files_per_s ?? 0;
  const result = {
    bench: 'ingest',
    entries: args.entries,
    batch: args.batch,
    cores: availableParallelism(),
    load_average_1m: Math.round(loadavg()[0]! * 100) / 100,
    total_s: Math.round(totalS * 10) / 10,
    tenths,
    last_over_first: first > 0 ? Math.round((last / first) * 100) / 100 : null,
    peak_rss_mb: Math.round(process.resourceUsage().maxRSS / 1024),
    library_bytes: bytes,
    bytes_per_entry: Math.round(bytes / args.entries),
    original_bytes: originalBytes,
    bytes_per_original_byte: Math.round((bytes / originalBytes) * 1000) / 1000,
    targets: { files_per_s_every_tenth: 150, last_over_first: 0.7, bytes_per_original_byte: 0.7 },
  };
  process.stdout.write(`${JSON.stringify(result)}\n`);
}

main();

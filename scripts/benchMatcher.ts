// `npm run bench:matcher`: the in-browser matcher in Chromium against a published site of many synthetic entries
// (default 10,000): page ready, then per dropped unknown (two demo unknowns and a three-entry synthetic mixture) the
// time to ranked hits and to the full report (mixture and bands), served over http (matching in the worker) and
// opened from disk (on the page's thread).
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, rmSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { findPackageRoot } from '../src/site/findPackageRoot.js';
import { launchChromium, serveFolder } from '../test/site/browserHarness.js';
import { benchArgs } from './benchArgs.js';
import { syntheticSiteLibrary } from './syntheticSiteLibrary.js';

const root = findPackageRoot(import.meta.url);
const cli = join(root, 'src', 'cli', 'bandshelf.mjs');
const DEMO_UNKNOWNS = ['u01-single-compound.csv', 'u02-spiked-mixture.jdx'].map((n) =>
  join(root, 'library', 'unknowns', n),
);
const REPEATS = 3;

function run(args: string[], what: string): string {
  const result = spawnSync(process.execPath, [cli, ...args], {
    encoding: 'utf8',
    maxBuffer: 64 * 1024 * 1024,
  });
  if (result.status !== 0) {
    process.stderr.write(
      `bench:matcher: ${what} failed (exit ${result.status}):\n${result.stderr.slice(-2000)}\n`,
    );
    process.exit(1);
  }
  return result.stdout;
}

interface DropFigures {
  unknown: string;
  /** Median over the repeats, ms: inside the matching (read, process, score) and to the whole report. */
  hits_ms: number;
  report_ms: number;
  /** Median, ms: from the drop event to the report shown on the page (rendering and plots' data included). */
  shown_ms: number;
}

const median = (values: number[]): number => {
  const s = [...values].sort((a, b) => a - b);
  return Math.round(s[Math.floor(s.length / 2)]!);
};

async function measure(
  url: string,
  unknowns: string[],
): Promise<{ ready_ms: number; engine: string; drops: DropFigures[] }> {
  const browser = await launchChromium();
  try {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    const start = Date.now();
    await page.goto(url, { waitUntil: 'load', timeout: 600_000 });
    await page.waitForSelector('#match-drop[data-ready="true"][data-engine]', { timeout: 600_000 });
    const ready = Date.now() - start;
    const engine = (await page.getAttribute('#match-drop', 'data-engine')) ?? '?';
    const drops: DropFigures[] = [];
    for (const path of unknowns) {
      const name = basename(path);
      const text = readFileSync(path, 'utf8');
      const hits: number[] = [];
      const report: number[] = [];
      const shown: number[] = [];
      for (let i = 0; i < REPEATS; i++) {
        const figures = await page.evaluate(
          ({ name, text }) =>
            new Promise<{ hits: number; report: number; shown: number }>((resolve, reject) => {
              const zone = document.getElementById('match-drop')!;
              delete zone.dataset.matched;
              const t0 = performance.now();
              const watch = new MutationObserver(() => {
                if (zone.dataset.matched !== name) return;
                watch.disconnect();
                if (zone.dataset.failed)
                  reject(new Error(document.getElementById('match-status')?.textContent ?? ''));
                resolve({
                  hits: Number(zone.dataset.hitsMs),
                  report: Number(zone.dataset.reportMs),
                  shown: performance.now() - t0,
                });
              });
              watch.observe(zone, { attributes: true });
              const dt = new DataTransfer();
              dt.items.add(new File([text], name, { type: 'text/plain' }));
              zone.dispatchEvent(
                new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }),
              );
            }),
          { name, text },
        );
        hits.push(figures.hits);
        report.push(figures.report);
        shown.push(figures.shown);
      }
      drops.push({
        unknown: name,
        hits_ms: median(hits),
        report_ms: median(report),
        shown_ms: median(shown),
      });
    }
    return { ready_ms: ready, engine, drops };
  } finally {
    await browser.close();
  }
}

async function main(): Promise<void> {
  const args = benchArgs(process.argv.slice(2), { entries: 10_000, batch: 1 });
  const { library, mixtureUnknown } = syntheticSiteLibrary(args.entries, { run });
  const unknowns = [...DEMO_UNKNOWNS, mixtureUnknown];
  const work = join(tmpdir(), `bandshelf-bench-matcher-${process.pid}`);
  mkdirSync(work, { recursive: true });
  try {
    const out = join(work, 'site');
    run(['site', '--library', library, '--out', out, '--json'], 'site');
    const server = await serveFolder(out);
    let served: Awaited<ReturnType<typeof measure>>;
    try {
      served = await measure(`${server.url}match/`, unknowns);
    } finally {
      await server.close();
    }
    const disk = await measure(pathToFileURL(join(out, 'match', 'index.html')).href, unknowns);
    const targets = { hits_ms: 500, report_ms: 2000 };
    const result = { entries: args.entries, served, disk, targets, cores: availableParallelism() };
    if (args.quiet) {
      process.stdout.write(`${JSON.stringify(result)}\n`);
      return;
    }
    const lines = [`in-browser matcher, Chromium, ${args.entries} published entries, ${result.cores} cores`];
    for (const [label, m] of [
      ['served over http', served],
      ['opened from disk', disk],
    ] as const) {
      lines.push(
        `${label}: page ready in ${m.ready_ms} ms, matching on the ${m.engine === 'worker' ? 'worker' : 'page thread'}`,
      );
      for (const d of m.drops) {
        lines.push(
          `  ${d.unknown.padEnd(26)} hits ${String(d.hits_ms).padStart(6)} ms   full report ${String(d.report_ms).padStart(6)} ms   shown ${String(d.shown_ms).padStart(6)} ms`,
        );
      }
    }
    lines.push(
      `targets: hits ≤ ${targets.hits_ms} ms, full report ≤ ${targets.report_ms} ms (medians of ${REPEATS} drops)`,
      '',
    );
    process.stdout.write(lines.join('\n'));
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

await main();

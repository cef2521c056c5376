// Crash safety and concurrency with real processes: `add` of 100 files killed with SIGKILL at seeded random
// moments leaves a library that passes `check` with every entry whole; two `add` processes at once lose nothing.
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { beforeAll, describe, expect, it } from 'vitest';
import { seededRandom } from '../../src/demo/seededRandom.js';
import { bandsFor, bandshelf, bandshelfAsync, parseJson, tempDir, writeSpectrumCsv } from './bandshelfCli.js';

interface AddJson {
  added: { id: string; revision: number }[];
  unchanged: { id: string; revision: number }[];
  failed: unknown[];
}

const FILES = 100;

/** Entries that are not whole: an entry row without a revision, or a revision without its file. */
function partialEntries(path: string): { orphans: number; fileless: number; entries: number } {
  const db = new Database(path, { readonly: true });
  const orphans = db
    .prepare('SELECT count(*) FROM entries WHERE id NOT IN (SELECT entry_id FROM revisions)')
    .pluck()
    .get() as number;
  const fileless = db
    .prepare('SELECT count(*) FROM revisions WHERE key NOT IN (SELECT revision_key FROM revision_files)')
    .pluck()
    .get() as number;
  const entries = db.prepare('SELECT count(*) FROM entries').pluck().get() as number;
  db.close();
  return { orphans, fileless, entries };
}

describe('crash safety', () => {
  const dir = tempDir();
  const data = join(dir, 'many');
  let fullRunMs = 0;

  beforeAll(() => {
    mkdirSync(data);
    // Small spectra (400 points) keep the run short; each is distinct so no QC flag interferes.
    for (let k = 0; k < FILES; k++) {
      writeSpectrumCsv(join(data, `s${String(k).padStart(3, '0')}.csv`), bandsFor(k), {
        start: 3998,
        stop: 800,
        step: 8,
        seed: k,
      });
    }
    const lib = join(dir, 'timing.sqlite');
    expect(bandshelf(['init', '--library', lib]).code).toBe(0);
    const t0 = performance.now();
    const r = bandshelf(['add', data, '--library', lib, '--json']);
    fullRunMs = performance.now() - t0;
    expect(r.code, r.stderr).toBe(0);
    expect(parseJson<AddJson>(r.stdout).added).toHaveLength(FILES);
  });

  it('SIGKILL at random moments during add leaves a library that passes check, each entry all-or-nothing', async () => {
    const rng = seededRandom(20261201);
    const survivors: number[] = [];
    for (let attempt = 0; attempt < 5; attempt++) {
      const lib = join(dir, `kill-${attempt}.sqlite`);
      expect(bandshelf(['init', '--library', lib]).code).toBe(0);
      // Between 15 % and 95 % of an uninterrupted run: past start-up, before the end.
      const delay = fullRunMs * (0.15 + 0.8 * rng.uniform());
      const { child, done } = bandshelfAsync(['add', data, '--library', lib]);
      const timer = setTimeout(() => child.kill('SIGKILL'), delay);
      await done;
      clearTimeout(timer);
      const check = bandshelf(['check', '--library', lib, '--json']);
      expect(check.code, check.stdout).toBe(0);
      const partial = partialEntries(lib);
      expect(partial.orphans).toBe(0);
      expect(partial.fileless).toBe(0);
      survivors.push(partial.entries);
      // Finishing the job afterwards stores the rest and reports the committed ones as unchanged.
      const rest = bandshelf(['add', data, '--library', lib, '--json']);
      expect(rest.code, rest.stderr).toBe(0);
      const out = parseJson<AddJson>(rest.stdout);
      expect(out.unchanged).toHaveLength(partial.entries);
      expect(out.added.length + out.unchanged.length).toBe(FILES);
      expect(out.added.every((a) => a.revision === 1)).toBe(true);
    }
    // The kills really landed mid-run: some but not all files were in before the kill, at least once.
    expect(survivors.some((n) => n > 0 && n < FILES)).toBe(true);
  });

  it('two add processes at once, on disjoint and on the same files, lose nothing and duplicate nothing', async () => {
    const a = join(dir, 'half-a');
    const b = join(dir, 'half-b');
    mkdirSync(a);
    mkdirSync(b);
    for (let k = 0; k < 30; k++) {
      writeSpectrumCsv(join(a, `a${k}.csv`), bandsFor(200 + k), { start: 3998, stop: 800, step: 8 });
      writeSpectrumCsv(join(b, `b${k}.csv`), bandsFor(300 + k), { start: 3998, stop: 800, step: 8 });
    }
    const lib = join(dir, 'together.sqlite');
    expect(bandshelf(['init', '--library', lib]).code).toBe(0);
    const runs = [
      bandshelfAsync(['add', a, '--library', lib, '--json']),
      bandshelfAsync(['add', b, '--library', lib, '--json']),
    ];
    const results = await Promise.all(runs.map((r) => r.done));
    for (const r of results) {
      expect(r.code, r.stderr).toBe(0);
      expect(parseJson<AddJson>(r.stdout).added).toHaveLength(30);
    }
    const list = parseJson<{ id: string }[]>(bandshelf(['list', '--library', lib, '--json']).stdout);
    expect(list).toHaveLength(60);

    const same = join(dir, 'same.sqlite');
    expect(bandshelf(['init', '--library', same]).code).toBe(0);
    const both = await Promise.all(
      [
        bandshelfAsync(['add', a, '--library', same, '--json']),
        bandshelfAsync(['add', a, '--library', same, '--json']),
      ].map((r) => r.done),
    );
    const outs = both.map((r) => {
      expect(r.code, r.stderr).toBe(0);
      return parseJson<AddJson>(r.stdout);
    });
    // Each file was stored exactly once: one process added it, the other found it unchanged.
    expect(outs[0]!.added.length + outs[1]!.added.length).toBe(30);
    expect(outs[0]!.unchanged.length + outs[1]!.unchanged.length).toBe(30);
    const db = new Database(same, { readonly: true });
    expect(db.prepare('SELECT count(*), max(revision) FROM revisions').raw().get()).toEqual([30, 1]);
    db.close();
    expect(bandshelf(['check', '--library', lib]).code).toBe(0);
    expect(bandshelf(['check', '--library', same]).code).toBe(0);
  });
});

// `site` killed at a random moment, or failing, leaves the site already in --out as it was (the new one is built in
// a sibling folder and swapped in), and the next `site` without --clean completes: through the real CLI.
import { createHash } from 'node:crypto';
import { mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { seededRandom } from '../../src/demo/seededRandom.js';
import { bandsFor, bandshelf, bandshelfAsync, tempDir, writeSpectrumCsv } from './bandshelfCli.js';

/** Every file under `dir` with the SHA-256 of its bytes, by relative path. */
function snapshot(dir: string): Record<string, string> {
  const out: Record<string, string> = {};
  const walk = (d: string) => {
    for (const name of readdirSync(d)) {
      const p = join(d, name);
      if (statSync(p).isDirectory()) walk(p);
      else out[relative(dir, p)] = createHash('sha256').update(readFileSync(p)).digest('hex');
    }
  };
  walk(dir);
  return out;
}

describe('an interrupted or failed site build', () => {
  const dir = tempDir('bandshelf-site-crash-');
  const lib = ['--library', join(dir, 'lib.sqlite')];
  const out = join(dir, 'site');
  let fullRunMs = 0;
  let first: Record<string, string> = {};

  beforeAll(() => {
    expect(bandshelf(['init', ...lib]).code).toBe(0);
    const data = join(dir, 'data');
    mkdirSync(data);
    for (let k = 0; k < 4; k++) writeSpectrumCsv(join(data, `s${k}.csv`), bandsFor(40 + k));
    expect(bandshelf(['add', data, ...lib]).code).toBe(0);
    const t0 = performance.now();
    const r = bandshelf(['site', '--out', out, ...lib]);
    fullRunMs = performance.now() - t0;
    expect(r.code, r.stderr).toBe(0);
    first = snapshot(out);
    // A second entry changes the next build, so a swapped-in half site would show.
    writeSpectrumCsv(join(data, 's9.csv'), bandsFor(49));
    expect(bandshelf(['add', join(data, 's9.csv'), ...lib]).code).toBe(0);
  });

  it('SIGKILL at random moments leaves the old site whole; the next build completes without --clean', async () => {
    const rng = seededRandom(20_261_204);
    let killed = 0;
    for (let attempt = 0; attempt < 3; attempt++) {
      // Between 20 % and 80 % of an uninterrupted run: inside the build, before the swap.
      const delay = fullRunMs * (0.2 + 0.6 * rng.uniform());
      const { child, done } = bandshelfAsync(['site', '--out', out, ...lib]);
      const timer = setTimeout(() => child.kill('SIGKILL'), delay);
      const r = await done;
      clearTimeout(timer);
      // Killed, the old site is exactly as it was; the build that was fast enough to finish swapped in whole.
      if (r.code === -1) {
        killed++;
        expect(snapshot(out)).toEqual(first);
      } else expect(r.code, r.stderr).toBe(0);
    }
    // The kills really landed mid-build at least once.
    expect(killed).toBeGreaterThan(0);
    const again = bandshelf(['site', '--out', out, ...lib]);
    expect(again.code, again.stderr).toBe(0);
    expect(Object.keys(snapshot(out)).some((f) => f.includes('s9'))).toBe(true);
    // No leftover of a killed build (`.site.bandshelf-building`, `.site.bandshelf-old`) stays beside the site.
    expect(readdirSync(dir).filter((f) => f.startsWith('.site.'))).toEqual([]);
  });

  it('a build that fails (a report that breaks its schema) leaves the old site untouched', () => {
    const before = snapshot(out);
    const reports = join(dir, 'reports');
    mkdirSync(reports, { recursive: true });
    writeFileSync(join(reports, 'broken.json'), JSON.stringify({ kind: 'match', query: { hash: 'x' } }));
    const r = bandshelf(['site', '--out', out, '--reports', reports, ...lib]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/broken\.json.*\[BAD_REPORT\]/);
    expect(snapshot(out)).toEqual(before);
  });
});

// A search cache damaged in place (bytes flipped, same size) never gives wrong answers: through the real CLI, `check`
// names the file by its CRC-32, `match` warns, rebuilds it and ranks exactly as on the intact cache.
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { type MatchReport, matchReportSchema } from '../../src/schema/matchReport.js';
import { bandshelf, parseJson, tempDir } from './bandshelfCli.js';
import { buildMatchFixture, type MatchFixture } from './matchFixture.js';

let fx: MatchFixture;

beforeAll(() => {
  fx = buildMatchFixture(tempDir('bandshelf-cache-damage-'));
});

function match(): { report: MatchReport; stderr: string } {
  const r = bandshelf(['match', fx.unknowns.urea, '--library', fx.library, '--json'], { cwd: fx.dir });
  expect(r.code, r.stderr).toBe(0);
  return { report: matchReportSchema.parse(parseJson(r.stdout)), stderr: r.stderr };
}

const ranking = (report: MatchReport) => report.hits.map((h) => [h.id, h.revision, h.score]);

describe('a damaged search cache', () => {
  it('is named by check, rebuilt by match with a warning, and never changes the hits', () => {
    const intact = match();
    const folder = `${resolve(fx.dir, fx.library)}.cache`;
    const caches = readdirSync(folder).filter((f) => /^search-.*\.bin$/.test(f));
    expect(caches.length).toBeGreaterThan(0);
    expect(bandshelf(['check', '--library', fx.library], { cwd: fx.dir }).code).toBe(0);

    // Flip 64 bytes in the middle of each cache file: the matrix values, not its header; the size stays the same.
    for (const name of caches) {
      const path = join(folder, name);
      const bytes = readFileSync(path);
      const at = Math.floor(bytes.length / 2);
      for (let k = 0; k < 64; k++) bytes[at + k] = bytes[at + k]! ^ 0x5a;
      writeFileSync(path, bytes);
    }

    const check = bandshelf(['check', '--library', fx.library, '--json'], { cwd: fx.dir });
    expect(check.code).toBe(1);
    const problems = parseJson<{ problems: { where: string; problem: string }[] }>(check.stdout).problems;
    for (const name of caches) {
      expect(problems.some((p) => p.where.includes(name) && /CRC-32/.test(p.problem))).toBe(true);
    }

    const again = match();
    expect(again.stderr).toMatch(/checksum/);
    expect(ranking(again.report)).toEqual(ranking(intact.report));
    // The rebuilt cache is whole again.
    expect(bandshelf(['check', '--library', fx.library], { cwd: fx.dir }).code).toBe(0);
  });
});

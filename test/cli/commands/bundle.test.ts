// `bandshelf export --bundle` and `bandshelf import` end to end through the real CLI: a history with reviews and a
// release travels whole, `check` passes after each import, a repeat says it changed nothing, conflicts are named.
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { gunzipSync, gzipSync } from 'node:zlib';
import { beforeAll, describe, expect, it } from 'vitest';
import { bandsFor, bandshelf, parseJson, tempDir, writeSpectrumCsv } from '../bandshelfCli.js';

let dir: string;
const run = (args: string[], author = 'ann') => bandshelf(args, { cwd: dir, author });

beforeAll(() => {
  dir = tempDir('bandshelf-bundle-cli-');
  for (let k = 0; k < 3; k++) writeSpectrumCsv(join(dir, `s${k}.csv`), bandsFor(k + 3), { seed: k + 1 });
  expect(run(['init', '--library', 'a.sqlite', '--name', 'Alder Row']).code).toBe(0);
  for (let k = 0; k < 3; k++) expect(run(['add', `s${k}.csv`, '--library', 'a.sqlite']).code).toBe(0);
  expect(run(['review', 's0', '--approve', '--reviewer', 'bob', '--library', 'a.sqlite']).code).toBe(0);
  expect(run(['review', 's1', '--reject', '--reviewer', 'bob', '--library', 'a.sqlite']).code).toBe(0);
  expect(run(['release', '2026.12', '--message', 'first', '--library', 'a.sqlite']).code).toBe(0);
  expect(run(['edit', 's2', '--set', 'tags=later', '--library', 'a.sqlite']).code).toBe(0);
});

function history(library: string, id: string) {
  const r = run(['history', id, '--json', '--library', library]);
  expect(r.code, r.stderr).toBe(0);
  return parseJson<{
    revisions: { revision: number; hash: string; reviewState: string; releases: string[] }[];
  }>(r.stdout).revisions;
}

describe('bandshelf export --bundle / import', () => {
  it('brings every revision, review and release into a new library; check passes; a repeat is a no-op', () => {
    const e = run(['export', '--bundle', 'a.bundle', '--library', 'a.sqlite', '--json']);
    expect(e.code, e.stderr).toBe(0);
    expect(parseJson<{ entries: number; revisions: number; releases: number }>(e.stdout)).toMatchObject({
      entries: 3,
      revisions: 4,
      releases: 1,
    });
    const i = run(['import', 'a.bundle', '--library', 'b.sqlite']);
    expect(i.code, i.stderr).toBe(0);
    expect(i.stdout).toMatch(/created .*b\.sqlite from 'Alder Row': 4 revisions, 2 reviews, 1 releases/);
    expect(run(['check', '--library', 'b.sqlite']).code).toBe(0);
    for (const id of ['s0', 's1', 's2']) expect(history('b.sqlite', id)).toEqual(history('a.sqlite', id));
    // A rejected revision stays rejected (export --all + add would have made it a draft again).
    expect(history('b.sqlite', 's1')[0]!.reviewState).toBe('rejected');
    const again = run(['import', 'a.bundle', '--library', 'b.sqlite', '--json']);
    expect(again.code).toBe(0);
    expect(parseJson<{ changed: boolean }>(again.stdout).changed).toBe(false);
    expect(run(['import', 'a.bundle', '--library', 'b.sqlite']).stdout).toMatch(/^nothing new/);
  });

  it('into a library of another name: releases get TAG+SOURCE; a diverged entry comes in as ID--SOURCE', () => {
    expect(run(['init', '--library', 'c.sqlite', '--name', 'Birch Lane']).code).toBe(0);
    expect(run(['add', 's2.csv', '--library', 'c.sqlite'], 'cy').code).toBe(0);
    expect(run(['edit', 's2', '--set', 'tags=ours', '--library', 'c.sqlite'], 'cy').code).toBe(0);
    expect(run(['export', '--bundle', 'a2.bundle', '--library', 'a.sqlite']).code).toBe(0);
    const i = run(['import', 'a2.bundle', '--library', 'c.sqlite', '--json']);
    expect(i.code, i.stderr).toBe(0);
    const outcome = parseJson<{
      entries: { id: string; importedAs: string; status: string }[];
      releases: { importedAs: string; status: string }[];
    }>(i.stdout);
    // c added s2 itself (another author and time), so the two histories differ from revision 1 on.
    expect(outcome.entries.find((e) => e.id === 's2')).toMatchObject({
      importedAs: 's2--alder-row',
      status: 'conflict',
    });
    expect(outcome.releases).toEqual([{ tag: '2026.12', importedAs: '2026.12+alder-row', status: 'added' }]);
    expect(history('c.sqlite', 's2').map((h) => h.revision)).toEqual([1, 2]);
    expect(history('c.sqlite', 's2--alder-row')).toHaveLength(2);
    expect(run(['check', '--library', 'c.sqlite']).code).toBe(0);
    const text = run(['import', 'a2.bundle', '--library', 'c.sqlite']);
    expect(text.stdout).toMatch(/^nothing new/);
  });

  it('--at TAG bundles the release members with their histories up to the frozen revision', () => {
    expect(run(['export', '--bundle', 'rel.bundle', '--at', '2026.12', '--library', 'a.sqlite']).code).toBe(
      0,
    );
    const bundle = JSON.parse(gunzipSync(readFileSync(join(dir, 'rel.bundle'))).toString('utf8'));
    expect(bundle.format).toBe('bandshelf-library-bundle');
    expect(bundle.entries.map((e: { revisions: unknown[] }) => e.revisions.length)).toEqual([1, 1, 1]);
    expect(bundle.releases.map((r: { tag: string }) => r.tag)).toEqual(['2026.12']);
  });

  it('refuses a damaged bundle in one line and leaves no library behind', () => {
    const bundle = JSON.parse(gunzipSync(readFileSync(join(dir, 'a.bundle'))).toString('utf8'));
    bundle.entries[0].revisions[0].message = 'edited';
    writeFileSync(join(dir, 'bad.bundle'), gzipSync(JSON.stringify(bundle)));
    const r = run(['import', 'bad.bundle', '--library', 'd.sqlite']);
    expect(r.code).toBe(1);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/bad\.bundle: digest: .*\[BAD_FORMAT\]/);
    expect(run(['list', '--library', 'd.sqlite']).stderr).toMatch(/NO_LIBRARY/);
  });
});

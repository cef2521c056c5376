// Curation through the real CLI: edit, retire, review, release, diff, history, and reading at a release tag.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { bandsFor, bandshelf, parseJson, tempDir, writeSpectrumCsv } from '../bandshelfCli.js';

interface ListRow {
  id: string;
  revision: number;
  name: string;
  class: string;
  reviewState: string;
}

interface HistoryJson {
  revisions: {
    revision: number;
    kind: string;
    hash: string;
    changed: string[];
    reviewState: string;
    releases: string[];
  }[];
}

describe('curation and releases', () => {
  const dir = tempDir();
  const lib = ['--library', join(dir, 'lib.sqlite')];
  const list = (...extra: string[]) =>
    parseJson<ListRow[]>(bandshelf(['list', ...lib, '--json', ...extra]).stdout);

  beforeAll(() => {
    expect(bandshelf(['init', ...lib]).code).toBe(0);
    const data = join(dir, 'data');
    mkdirSync(data);
    for (const [k, id] of ['alpha', 'beta', 'gamma'].entries())
      writeSpectrumCsv(join(data, `${id}.csv`), bandsFor(k));
    const r = bandshelf(['add', data, ...lib], { author: 'ann' });
    expect(r.code, r.stderr).toBe(0);
    expect(bandshelf(['release', 'v1', ...lib, '--message', 'first']).code).toBe(0);
  });

  it('edit --set makes a metadata-only revision with a new hash and the same data', () => {
    const before = parseJson<{ hash: string; dataHash: string; processed: (number | null)[] }>(
      bandshelf(['show', 'alpha', ...lib, '--json']).stdout,
    );
    const r = bandshelf(
      [
        'edit',
        'alpha',
        ...lib,
        '--set',
        'class=protein',
        '--set',
        'tags=a;b',
        '--set',
        'temperature=25 °C',
        '--json',
      ],
      { author: 'ann' },
    );
    expect(r.code, r.stderr).toBe(0);
    expect(parseJson<{ revision: number; status: string }>(r.stdout)).toMatchObject({
      revision: 2,
      status: 'added',
    });
    const after = parseJson<{
      hash: string;
      dataHash: string;
      kind: string;
      meta: Record<string, unknown>;
      processed: (number | null)[];
    }>(bandshelf(['show', 'alpha', ...lib, '--json']).stdout);
    expect(after.kind).toBe('metadata');
    expect(after.meta).toMatchObject({ class: 'protein', tags: ['a', 'b'], temperature: 25 });
    expect(after.hash).not.toBe(before.hash);
    expect(after.dataHash).toBe(before.dataHash);
    expect(after.processed).toEqual(before.processed);
    // The same edit again changes nothing.
    const same = bandshelf(['edit', 'alpha', ...lib, '--set', 'class=protein', '--json']);
    expect(parseJson<{ status: string }>(same.stdout).status).toBe('unchanged');
    const bad = bandshelf(['edit', 'alpha', ...lib, '--set', 'class=mineral']);
    expect(bad.code).toBe(1);
    expect(bad.stderr).toMatch(/^bandshelf: .*class.*must be one of/);
    expect(bad.stderr.trim().split('\n')).toHaveLength(1);
  });

  it('retire takes an entry out of the current state but keeps its history and releases', () => {
    expect(bandshelf(['retire', 'beta', ...lib]).code).toBe(2); // --reason is required
    const r = bandshelf(['retire', 'beta', ...lib, '--reason', 'film cracked'], { author: 'ann' });
    expect(r.code, r.stderr).toBe(0);
    expect(list().map((e) => e.id)).toEqual(['alpha', 'gamma']);
    expect(list('--at', 'v1').map((e) => e.id)).toEqual(['alpha', 'beta', 'gamma']);
    const history = parseJson<HistoryJson>(bandshelf(['history', 'beta', ...lib, '--json']).stdout);
    expect(history.revisions.map((h) => [h.revision, h.kind])).toEqual([
      [1, 'data'],
      [2, 'retire'],
    ]);
    expect(history.revisions[0]!.releases).toEqual(['v1']);
    expect(bandshelf(['retire', 'beta', ...lib, '--reason', 'again']).code).toBe(1);
    const edit = bandshelf(['edit', 'beta', ...lib, '--set', 'name=x']);
    expect(edit.code).toBe(1);
    expect(edit.stderr).toContain('retired');
  });

  it('review needs a second person unless forced, and release --reviewed-only publishes reviewed revisions only', () => {
    const self = bandshelf(['review', 'gamma', ...lib, '--approve', '--reviewer', 'ann']);
    expect(self.code).toBe(2);
    expect(self.stderr).toContain('second person');
    expect(bandshelf(['review', 'gamma', ...lib, '--approve', '--reviewer', 'bob']).code).toBe(0);
    // alpha revision 2 (the edit) is reviewed too, then edited again: the release keeps the reviewed revision 2.
    expect(bandshelf(['review', 'alpha', ...lib, '--approve', '--reviewer', 'bob']).code).toBe(0);
    expect(bandshelf(['edit', 'alpha', ...lib, '--set', 'notes=later draft'], { author: 'ann' }).code).toBe(
      0,
    );
    const rel = bandshelf(['release', 'v2', ...lib, '--reviewed-only', '--json']);
    expect(rel.code, rel.stderr).toBe(0);
    const release = parseJson<{ members: { id: string; revision: number }[]; reviewedOnly: boolean }>(
      rel.stdout,
    );
    expect(release.reviewedOnly).toBe(true);
    expect(release.members.map((m) => [m.id, m.revision])).toEqual([
      ['alpha', 2],
      ['gamma', 1],
    ]);
    expect(list().find((e) => e.id === 'alpha')).toMatchObject({ revision: 3, reviewState: 'draft' });
    expect(list('--at', 'v2').find((e) => e.id === 'alpha')).toMatchObject({
      revision: 2,
      reviewState: 'reviewed',
    });
    const rejected = bandshelf([
      'review',
      'alpha',
      ...lib,
      '--reject',
      '--reviewer',
      'bob',
      '--note',
      'typo',
    ]);
    expect(rejected.code).toBe(0);
    expect(list().find((e) => e.id === 'alpha')!.reviewState).toBe('rejected');
  });

  it('diff lists added, changed (with what) and removed entries between releases and the working state', () => {
    const d = parseJson<{
      added: { id: string }[];
      changed: { id: string; what: string[] }[];
      removed: { id: string }[];
    }>(bandshelf(['diff', 'v1', 'current', ...lib, '--json']).stdout);
    expect(d.added).toEqual([]);
    expect(d.changed.map((c) => [c.id, c.what])).toEqual([['alpha', ['metadata']]]);
    expect(d.removed.map((r) => r.id)).toEqual(['beta']);
    const text = bandshelf(['diff', 'v1', 'v2', ...lib]);
    expect(text.stdout).toContain('~ alpha r1 → r2: metadata');
    expect(text.stdout).toContain('- beta');
    const unknown = bandshelf(['diff', 'v1', 'v9', ...lib]);
    expect(unknown.code).toBe(1);
    expect(unknown.stderr.trim()).toMatch(/^bandshelf: .*no release is tagged 'v9' \[UNKNOWN_RELEASE\]$/);
  });

  it('releases are immutable, tags are checked, and reading commands take --at', () => {
    const again = bandshelf(['release', 'v1', ...lib]);
    expect(again.code).toBe(1);
    expect(again.stderr).toContain('ALREADY_EXISTS');
    expect(bandshelf(['release', '../x', ...lib]).code).toBe(2);
    const releases = parseJson<{ tag: string; entries: number }[]>(
      bandshelf(['release', ...lib, '--json']).stdout,
    );
    expect(releases.map((r) => [r.tag, r.entries])).toEqual([
      ['v1', 3],
      ['v2', 2],
    ]);
    const atV1 = parseJson<{ revision: number; meta: { class?: string } }>(
      bandshelf(['show', 'alpha', ...lib, '--at', 'v1', '--json']).stdout,
    );
    expect(atV1.revision).toBe(1);
    expect(atV1.meta.class).toBeUndefined();
    const missing = bandshelf(['show', 'beta', ...lib, '--at', 'v2']);
    expect(missing.code).toBe(1);
    expect(missing.stderr).toContain("not in release 'v2'");
    expect(bandshelf(['history', 'alpha', ...lib]).stdout).toMatch(/3\s+metadata\s+metadata/);
    // edit --meta replaces the whole metadata (the id stays).
    const metaFile = join(dir, 'alpha.meta.json');
    writeFileSync(metaFile, JSON.stringify({ name: 'Alpha (renamed)', class: 'lipid' }));
    expect(bandshelf(['edit', 'alpha', ...lib, '--meta', metaFile]).code).toBe(0);
    const replaced = parseJson<{ revision: number; meta: Record<string, unknown> }>(
      bandshelf(['show', 'alpha', ...lib, '--json']).stdout,
    );
    expect(replaced.revision).toBe(4);
    expect(replaced.meta).toEqual({ id: 'alpha', name: 'Alpha (renamed)', class: 'lipid' });
    expect(bandshelf(['check', ...lib]).code).toBe(0);
  });
});

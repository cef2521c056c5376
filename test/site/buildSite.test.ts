// `site` again into the folder of an earlier build, after an add and an edit: the entries whose inputs did not change
// keep their files (the same inodes: linked, not written again), the added and the edited entry are made anew, and
// the folder is byte for byte what a build into an empty folder writes (compared with node's own file bytes).
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bandshelf, parseJson } from '../cli/bandshelfCli.js';
import { buildTestLibrary, DEMO_LIBRARY } from './siteFixture.js';

function filesOf(dir: string): string[] {
  const out: string[] = [];
  const walk = (d: string): void => {
    for (const name of readdirSync(d).sort()) {
      const full = join(d, name);
      if (statSync(full).isDirectory()) walk(full);
      else out.push(relative(dir, full).split(sep).join('/'));
    }
  };
  walk(dir);
  return out;
}

const inode = (path: string): number => statSync(path).ino;

describe('site rebuilt after an add', () => {
  it('reuses the unchanged entries, remakes the changed ones, and equals a clean build', () => {
    const fx = buildTestLibrary({ withReports: true });
    const site = join(fx.dir, 'site');
    const run = (args: string[]) => {
      const r = bandshelf(args);
      expect(r.code, r.stderr).toBe(0);
      return r.stdout;
    };
    const first = parseJson<{ entries: number; reused: number }>(
      run(['site', '--library', fx.library, '--reports', fx.reports, '--out', site, '--json']),
    );
    expect(first.reused).toBe(0);
    const ids = readdirSync(join(site, 'entries')).sort();
    expect(ids.length).toBe(first.entries);
    const [edited, ...unchanged] = ids;
    const before = new Map(
      unchanged.flatMap((id) =>
        filesOf(join(site, 'entries', id)).map((f) => [`${id}/${f}`, inode(join(site, 'entries', id, f))]),
      ),
    );
    const editedPage = inode(join(site, 'entries', edited!, 'index.html'));

    run([
      'add',
      join(DEMO_LIBRARY, '31-caffeine.jdx'),
      '--id',
      'added-entry',
      '--force',
      '--library',
      fx.library,
    ]);
    run(['edit', edited!, '--set', 'tags=edited', '--library', fx.library]);
    const again = parseJson<{ entries: number; reused: number }>(
      run(['site', '--library', fx.library, '--reports', fx.reports, '--out', site, '--json']),
    );
    expect(again.entries).toBe(first.entries + 1);
    // Every entry but the edited one and the added one was taken over.
    expect(again.reused).toBe(first.entries - 1);
    for (const [file, ino] of before) expect(inode(join(site, 'entries', file)), file).toBe(ino);
    expect(inode(join(site, 'entries', edited!, 'index.html'))).not.toBe(editedPage);
    expect(readFileSync(join(site, 'entries', edited!, `${edited}.json`), 'utf8')).toContain('edited');

    // The same folder as a build from nothing: the same files with the same bytes, the build record included.
    const clean = join(fx.dir, 'site-clean');
    const fresh = parseJson<{ reused: number }>(
      run(['site', '--library', fx.library, '--reports', fx.reports, '--out', clean, '--json']),
    );
    expect(fresh.reused).toBe(0);
    const files = filesOf(site);
    expect(files).toEqual(filesOf(clean));
    for (const f of files)
      expect(readFileSync(join(site, f)).equals(readFileSync(join(clean, f))), f).toBe(true);
  }, 240_000);
});

// The output folder rule: create or reuse what an earlier build made; refuse anything else unless --clean, and
// never empty the root, the home or the working folder.
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, symlinkSync, writeFileSync } from 'node:fs';
import { homedir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { buildManifestPath } from '../../src/site/buildManifestPath.js';
import { prepareOutDir } from '../../src/site/prepareOutDir.js';
import { tempDir } from '../cli/bandshelfCli.js';

function built(dir: string, files: Record<string, string>): void {
  const hashes: Record<string, string> = {};
  for (const [name, text] of Object.entries(files)) {
    mkdirSync(join(dir, name, '..'), { recursive: true });
    writeFileSync(join(dir, name), text);
    hashes[name] = createHash('sha256').update(text).digest('hex');
  }
  writeFileSync(buildManifestPath(dir), JSON.stringify({ generator: 'bandshelf site', files: hashes }));
}

function code(f: () => void): string | undefined {
  try {
    f();
    return undefined;
  } catch (error) {
    return error instanceof BandshelfError ? error.code : 'raw';
  }
}

describe('prepareOutDir', () => {
  it('creates a missing folder and accepts an empty one', () => {
    const dir = join(tempDir(), 'new', 'site');
    prepareOutDir(dir);
    expect(existsSync(dir)).toBe(true);
    prepareOutDir(dir);
  });

  it('removes the files of an earlier build, which its manifest lists with their hashes', () => {
    const dir = tempDir();
    built(dir, { 'index.html': 'a', 'entries/x/index.html': 'b' });
    prepareOutDir(dir);
    expect(existsSync(join(dir, 'index.html'))).toBe(false);
    expect(existsSync(join(dir, 'entries/x/index.html'))).toBe(false);
  });

  it('refuses a file the build did not make, or a built file changed since, and keeps it', () => {
    const dir = tempDir();
    built(dir, { 'index.html': 'a' });
    writeFileSync(join(dir, 'mine.txt'), 'x');
    expect(code(() => prepareOutDir(dir))).toBe('OUT_NOT_EMPTY');
    expect(existsSync(join(dir, 'mine.txt'))).toBe(true);
    const other = tempDir();
    built(other, { 'index.html': 'a' });
    writeFileSync(join(other, 'index.html'), 'changed');
    expect(code(() => prepareOutDir(other))).toBe('OUT_NOT_EMPTY');
    const bare = tempDir();
    writeFileSync(join(bare, 'notes.md'), 'x');
    expect(code(() => prepareOutDir(bare))).toBe('OUT_NOT_EMPTY');
  });

  it('empties with clean only a folder an earlier build marked as its own', () => {
    const bare = tempDir();
    writeFileSync(join(bare, 'mine.txt'), 'x');
    expect(code(() => prepareOutDir(bare, { clean: true, cwd: tempDir() }))).toBe('OUT_NOT_EMPTY');
    expect(existsSync(join(bare, 'mine.txt'))).toBe(true);
    const dir = tempDir();
    built(dir, { 'index.html': 'a' });
    writeFileSync(join(dir, 'mine.txt'), 'x');
    mkdirSync(join(dir, 'sub'));
    writeFileSync(join(dir, 'sub', 'deep.txt'), 'y');
    prepareOutDir(dir, { clean: true, cwd: tempDir() });
    expect(readdirSync(dir)).toEqual([]);
  });

  it('never cleans the working folder, the home folder or one holding a protected path', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'mine.txt'), 'x');
    expect(code(() => prepareOutDir(dir, { clean: true, cwd: dir }))).toBe('OUT_NOT_EMPTY');
    expect(code(() => prepareOutDir(join(dir, '..'), { clean: true, cwd: dir }))).toBe('OUT_NOT_EMPTY');
    expect(existsSync(join(dir, 'mine.txt'))).toBe(true);
    const library = join(dir, 'lib.sqlite');
    expect(code(() => prepareOutDir(dir, { clean: true, protect: [library], cwd: tempDir() }))).toBe(
      'OUT_NOT_EMPTY',
    );
    if (existsSync(homedir())) {
      expect(code(() => prepareOutDir(homedir(), { clean: true, cwd: dir }))).toBe('OUT_NOT_EMPTY');
    }
    // A link to the library's folder is the folder itself once resolved: never emptied, marker or not.
    const libDir = tempDir();
    built(libDir, { 'index.html': 'a' });
    writeFileSync(join(libDir, 'lib.sqlite'), 'x');
    const link = join(tempDir(), 'out');
    symlinkSync(libDir, link);
    expect(
      code(() => prepareOutDir(link, { clean: true, protect: [join(libDir, 'lib.sqlite')], cwd: tempDir() })),
    ).toBe('OUT_NOT_EMPTY');
    expect(code(() => prepareOutDir(join(link, '..'), { clean: true, cwd: libDir }))).toBe('OUT_NOT_EMPTY');
    expect(existsSync(join(libDir, 'lib.sqlite'))).toBe(true);
    const file = join(dir, 'mine.txt');
    expect(code(() => prepareOutDir(file))).toBe('OUT_NOT_EMPTY');
  });
});

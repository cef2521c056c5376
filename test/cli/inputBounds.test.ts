// No input can hang or exhaust `add` or `match`: only regular files are read (a named pipe or /dev/zero is refused at
// once) and files over the size limit are refused; `--max-file-size` moves the limit.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bandsFor, bandshelf, tempDir, writeSpectrumCsv } from './bandshelfCli.js';

function fresh() {
  const dir = tempDir();
  const lib = ['--library', join(dir, 'lib.sqlite')];
  expect(bandshelf(['init', ...lib]).code).toBe(0);
  return { dir, lib };
}

describe('bounded inputs', () => {
  it.runIf(existsSync('/dev/zero'))('refuses /dev/zero at add and match instead of reading forever', () => {
    const { dir, lib } = fresh();
    const add = bandshelf(['add', '/dev/zero', ...lib]);
    expect(add.code).toBe(1);
    expect(add.stderr).toMatch(/\/dev\/zero: this is a device; only regular files are read \[NOT_A_FILE\]/);
    expect(bandshelf(['add', writeSpectrumCsv(join(dir, 'ref.csv'), bandsFor(5)), ...lib]).code).toBe(0);
    const match = bandshelf(['match', '/dev/zero', ...lib]);
    expect(match.code).not.toBe(0);
    expect(match.stderr).toMatch(/\[NOT_A_FILE\]/);
  });

  it('refuses a named pipe (nobody writing to it) instead of blocking', () => {
    const { dir, lib } = fresh();
    const fifo = join(dir, 'pipe.csv');
    const made = spawnSync('mkfifo', [fifo]);
    if (made.status !== 0) return; // no mkfifo on this system (common practice: POSIX tool, absent on Windows)
    const add = bandshelf(['add', fifo, ...lib]);
    expect(add.code).toBe(1);
    expect(add.stderr).toMatch(/pipe\.csv: this is a named pipe; only regular files are read \[NOT_A_FILE\]/);
  });

  it('refuses a file over --max-file-size, naming the flag, and reads it when the limit is raised', () => {
    const { dir, lib } = fresh();
    const file = writeSpectrumCsv(join(dir, 'big.csv'), bandsFor(4));
    const small = bandshelf(['add', file, ...lib, '--max-file-size', '0.001']);
    expect(small.code).toBe(1);
    expect(small.stderr).toMatch(
      /big\.csv: the file has \d+ bytes, more than the limit of 1000; raise it with --max-file-size/,
    );
    expect(small.stderr).toMatch(/\[FILE_TOO_LARGE\]/);
    const bad = bandshelf(['add', file, ...lib, '--max-file-size', 'lots']);
    expect(bad.code).toBe(2);
    const ok = bandshelf(['add', file, ...lib, '--max-file-size', '1']);
    expect(ok.code, ok.stderr).toBe(0);
    const check = bandshelf(['check', ...lib]);
    expect(check.code, check.stdout).toBe(0);
  });
});

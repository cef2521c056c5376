// readRegularFile: regular files within the limit are read whole; folders, devices and pipes are refused at once.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readRegularFile } from '../../../src/library/store/readRegularFile.js';
import { bandshelfErrorOf } from '../../bandshelfErrorOf.js';

describe('readRegularFile', () => {
  const dir = mkdtempSync(join(tmpdir(), 'bandshelf-regular-'));

  it('reads a regular file byte for byte, and refuses one over the limit naming the option', () => {
    const file = join(dir, 'a.csv');
    writeFileSync(file, 'x,y\n1,2\n');
    expect(Buffer.from(readRegularFile(file)).toString('utf8')).toBe('x,y\n1,2\n');
    const e = bandshelfErrorOf(() => readRegularFile(file, { label: 'a.csv', maxFileBytes: 4 }));
    expect(e.code).toBe('FILE_TOO_LARGE');
    expect(e.file).toBe('a.csv');
    expect(e.message).toMatch(/8 bytes, more than the limit of 4; raise it with `maxFileBytes`/);
  });

  it('refuses a folder (IO_ERROR), a device and a named pipe (NOT_A_FILE) without reading', () => {
    expect(bandshelfErrorOf(() => readRegularFile(dir)).code).toBe('IO_ERROR');
    if (existsSync('/dev/null')) {
      const e = bandshelfErrorOf(() => readRegularFile('/dev/null'));
      expect([e.code, e.message]).toEqual(['NOT_A_FILE', 'this is a device; only regular files are read']);
    }
    const fifo = join(dir, 'pipe');
    if (spawnSync('mkfifo', [fifo]).status === 0) {
      expect(bandshelfErrorOf(() => readRegularFile(fifo)).message).toMatch(/a named pipe/);
    }
    expect(bandshelfErrorOf(() => readRegularFile(join(dir, 'missing'))).code).toBe('IO_ERROR');
  });
});

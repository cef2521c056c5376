// File-system failures in words: the Node error codes a user meets most, a real folder read, unknown codes kept.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { describeIoError } from '../../../src/library/store/describeIoError.js';
import { tempDir } from '../../cli/bandshelfCli.js';

const withCode = (code: string) => Object.assign(new Error(`${code}: raw text`), { code });

/** The failure a real call gives, so the codes checked are the ones Node actually raises on this system. */
function failureOf(run: () => unknown): unknown {
  try {
    run();
  } catch (error) {
    return error;
  }
  throw new Error('expected the call to fail');
}

describe('describeIoError', () => {
  it('words the everyday codes for people', () => {
    // The codes and their meanings are the POSIX errno names Node reports (common practice).
    expect(describeIoError(withCode('ENOENT'))).toBe('the file does not exist');
    expect(describeIoError(withCode('ENOENT'), { writing: true })).toBe(
      'the folder it goes in does not exist',
    );
    expect(describeIoError(withCode('EACCES'))).toBe('permission denied');
    expect(describeIoError(withCode('EPERM'))).toBe('permission denied');
    expect(describeIoError(withCode('EISDIR'))).toBe('it is a folder, not a file');
    expect(describeIoError(withCode('ENOSPC'))).toBe('no space left on the device');
  });

  it('describes what reading a missing file and a folder really raise', () => {
    const dir = tempDir('bandshelf-io-');
    expect(describeIoError(failureOf(() => readFileSync(join(dir, 'absent.json'), 'utf8')))).toBe(
      'the file does not exist',
    );
    expect(describeIoError(failureOf(() => readFileSync(dir, 'utf8')))).toBe('it is a folder, not a file');
  });

  it('keeps an unknown code and falls back to the first message line without one', () => {
    expect(describeIoError(withCode('EXDEV'))).toBe('the system refused (EXDEV)');
    expect(describeIoError(new Error('first line\nsecond line'))).toBe('first line');
    expect(describeIoError('plain text')).toBe('plain text');
    expect(describeIoError(null)).toBe('null');
  });
});

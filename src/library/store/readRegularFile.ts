// Reads a file the user named, refusing anything but a regular file (a pipe, a device such as /dev/zero, a socket)
// and anything over the size limit, so no input can block `add` or exhaust its memory.
import { closeSync, constants, fstatSync, openSync, readSync } from 'node:fs';
import { BandshelfError } from '../../error.js';
import { MAX_INPUT_BYTES } from '../../formats/types.js';
import { describeIoError } from './describeIoError.js';

export interface ReadRegularFileOptions {
  /** The file as the user named it, for errors. @default the path */
  label?: string;
  /** Largest file accepted, bytes. @default MAX_INPUT_BYTES (200 MB) */
  maxFileBytes?: number;
}

/** Opens without blocking (a FIFO would otherwise wait for a writer), checks the open file's own type and size,
 * then reads at most that size. */
export function readRegularFile(path: string, options: ReadRegularFileOptions = {}): Uint8Array {
  const file = options.label ?? path;
  const max = options.maxFileBytes ?? MAX_INPUT_BYTES;
  let fd: number;
  try {
    fd = openSync(path, constants.O_RDONLY | (constants.O_NONBLOCK ?? 0));
  } catch (error) {
    throw new BandshelfError('IO_ERROR', `cannot read: ${describeIoError(error)}`, { file, cause: error });
  }
  try {
    const stat = fstatSync(fd);
    if (stat.isDirectory()) {
      throw new BandshelfError('IO_ERROR', 'cannot read: it is a folder, not a file', { file });
    }
    if (!stat.isFile()) {
      const kind = stat.isFIFO()
        ? 'a named pipe'
        : stat.isCharacterDevice() || stat.isBlockDevice()
          ? 'a device'
          : stat.isSocket()
            ? 'a socket'
            : 'not a regular file';
      throw new BandshelfError('NOT_A_FILE', `this is ${kind}; only regular files are read`, { file });
    }
    if (stat.size > max) {
      throw new BandshelfError(
        'FILE_TOO_LARGE',
        `the file has ${stat.size} bytes, more than the limit of ${max}; raise it with \`maxFileBytes\``,
        { file },
      );
    }
    const out = new Uint8Array(stat.size);
    let done = 0;
    while (done < out.length) {
      const n = readSync(fd, out, done, out.length - done, done);
      if (n === 0) break;
      done += n;
    }
    return done === out.length ? out : out.slice(0, done);
  } catch (error) {
    if (error instanceof BandshelfError) throw error;
    throw new BandshelfError('IO_ERROR', `cannot read: ${describeIoError(error)}`, { file, cause: error });
  } finally {
    closeSync(fd);
  }
}

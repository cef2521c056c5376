// Words a failed file-system call for people ("the file does not exist") instead of a raw Node code (ENOENT).

export interface DescribeIoErrorOptions {
  /** Whether the call was writing: a missing path then means its folder is missing, not the file.
   * @default false */
  writing?: boolean;
}

const REASONS: Readonly<Record<string, string>> = {
  EACCES: 'permission denied',
  EPERM: 'permission denied',
  EISDIR: 'it is a folder, not a file',
  ENOTDIR: 'a part of the path is a file, not a folder',
  ENOSPC: 'no space left on the device',
  EDQUOT: 'the disk quota is used up',
  EEXIST: 'the file already exists',
  EROFS: 'the file system is read-only',
  ENOTEMPTY: 'the folder is not empty',
  EBUSY: 'the file is in use',
  EMFILE: 'too many files are open',
  ENFILE: 'too many files are open',
  ENAMETOOLONG: 'the name is too long',
  ELOOP: 'the path loops through symbolic links',
  EIO: 'the device reported a read or write failure',
};

/**
 * The reason part of an IO_ERROR message. An unknown code is kept (a person can still search for it); an error
 * without a code gives its first message line.
 */
export function describeIoError(error: unknown, options: DescribeIoErrorOptions = {}): string {
  const code = (error as NodeJS.ErrnoException | null)?.code;
  if (code === 'ENOENT')
    return options.writing ? 'the folder it goes in does not exist' : 'the file does not exist';
  if (typeof code === 'string') return REASONS[code] ?? `the system refused (${code})`;
  if (error instanceof Error) return error.message.split('\n')[0] ?? String(error);
  return String(error);
}

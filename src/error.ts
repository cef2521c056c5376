// The one error type bandshelf throws for bad input or a bad state; the CLI turns it into one line.

/** Stable machine-readable error codes. Scripts may rely on them; never rename one. */
export type ErrorCode =
  | 'EMPTY_FILE'
  | 'TOO_FEW_POINTS'
  | 'NOT_NUMERIC'
  | 'NOT_FINITE'
  | 'DUPLICATE_X'
  | 'NOT_MONOTONIC'
  | 'UNKNOWN_UNIT'
  | 'BINARY_DATA'
  | 'FILE_TOO_LARGE'
  | 'NOT_A_FILE'
  | 'BAD_FORMAT'
  | 'NOT_A_SPECTRUM'
  | 'BAD_TRANSMITTANCE'
  | 'BAD_METADATA'
  | 'BAD_RECIPE'
  | 'BAD_OPTION'
  | 'BAD_REPORT'
  | 'NOT_FOUND'
  | 'ALREADY_EXISTS'
  | 'NO_LIBRARY'
  | 'EMPTY_LIBRARY'
  | 'UNKNOWN_RELEASE'
  | 'QC_FAILED'
  | 'SMALL_OVERLAP'
  | 'NO_BANDS'
  | 'CHECK_FAILED'
  | 'IO_ERROR'
  | 'OUT_NOT_EMPTY'
  | 'DAMAGED_LIBRARY';

export interface BandshelfErrorDetails {
  /** The file the problem is in, as the user named it. */
  file?: string;
  /** 1-based line number inside that file, where there is one. */
  line?: number;
  /** The metadata field, option or label at fault. */
  field?: string;
  cause?: unknown;
}

export class BandshelfError extends Error {
  readonly code: ErrorCode;
  readonly file: string | undefined;
  readonly line: number | undefined;
  readonly field: string | undefined;

  constructor(code: ErrorCode, message: string, details: BandshelfErrorDetails = {}) {
    super(message, details.cause === undefined ? undefined : { cause: details.cause });
    this.name = 'BandshelfError';
    this.code = code;
    this.file = details.file;
    this.line = details.line;
    this.field = details.field;
  }

  /** One line for a terminal: `file:line: field: message [CODE]`. */
  oneLine(): string {
    const where = [this.file, this.line === undefined ? undefined : String(this.line)]
      .filter((part) => part !== undefined)
      .join(':');
    const prefix = [where || undefined, this.field].filter((part) => part !== undefined).join(': ');
    const text = prefix ? `${prefix}: ${this.message}` : this.message;
    return `${text.replace(/\s*\n\s*/g, ' ')} [${this.code}]`;
  }
}

export interface ErrorLineOptions {
  /**
   * Mark a value that is not a BandshelfError as an internal error (a fault of bandshelf's own); `false` where such
   * errors are expected, as SQLite's or JSON's words about damaged stored data.
   * @default true
   */
  internal?: boolean;
}

/** Any thrown value as one terminal line: a BandshelfError as its `oneLine()`, anything else its first line. */
export function errorLine(error: unknown, options: ErrorLineOptions = {}): string {
  if (error instanceof BandshelfError) return error.oneLine();
  const first = error instanceof Error ? (error.message.split('\n')[0] ?? '') : String(error);
  return options.internal === false ? first : `internal error: ${first}`;
}

// The reading options of a command that reads spectrum files one by one (compare, subtract): no time-domain pair.
import { BandshelfError } from '../error.js';
import type { SpectrumReadOptions } from '../formats/types.js';

export interface FileReadingOptionsOptions {
  /** The command, named in the refusal. @default 'this command' */
  command?: string;
}

/**
 * Units, block and column as given; `--time-domain` is refused with one line (a trace pair makes one spectrum, so
 * it is added as an entry first and the entry named instead).
 */
export function fileReadingOptions(
  read: SpectrumReadOptions,
  options: FileReadingOptionsOptions = {},
): Pick<SpectrumReadOptions, 'xUnit' | 'yUnit' | 'block' | 'column'> {
  if (read.timeDomain === true) {
    throw new BandshelfError(
      'BAD_OPTION',
      `${options.command ?? 'this command'} reads spectrum files and entries, not trace pairs: add the traces as an entry (add --time-domain) and name the entry`,
      { field: 'time-domain' },
    );
  }
  return {
    ...(read.xUnit === undefined ? {} : { xUnit: read.xUnit }),
    ...(read.yUnit === undefined ? {} : { yUnit: read.yUnit }),
    ...(read.block === undefined ? {} : { block: read.block }),
    ...(read.column === undefined ? {} : { column: read.column }),
  };
}

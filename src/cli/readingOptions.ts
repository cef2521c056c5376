// The reading options every command that reads a spectrum takes, declared once: flags in, SpectrumReadOptions out.
import type { Command } from 'commander';
import { BandshelfError } from '../error.js';
import { type SpectrumReadOptions, X_UNITS, type XUnit, Y_UNITS, type YUnit } from '../formats/types.js';
import { unitFromText } from '../formats/unitFromText.js';
import { collectRepeated } from './collectRepeated.js';

export interface ReadingOptionsOptions {
  /** Parse the flags commander gathered instead of declaring them. @default undefined (declare on `command`) */
  flags?: Record<string, unknown>;
}

/**
 * With a commander Command, declares `--x-unit`, `--y-unit`, `--block`, `--column`, `--time-domain`,
 * `--reference` (repeatable) and `--time-unit` on it and returns it; with `{ flags }`, parses what commander
 * gathered into one SpectrumReadOptions (units as people write them: `1/cm`, `µm`, `%T`, `abs` …), refusing
 * bad values with BAD_OPTION and --reference without --time-domain.
 */
export function readingOptions(
  command: Command | undefined,
  options: ReadingOptionsOptions = {},
): SpectrumReadOptions {
  if (options.flags === undefined) {
    command
      ?.option(
        '--x-unit <unit>',
        `abscissa unit of the files: ${X_UNITS.join('|')} (also 1/cm, µm, micron, THz)`,
      )
      .option('--y-unit <unit>', `ordinate unit: ${Y_UNITS.join('|')} (also A, T, %T)`)
      .option('--block <n>', 'take only this 1-based block of a multi-block JCAMP-DX file')
      .option(
        '--column <name|n>',
        'take only this y column (header name or 1-based number) of a delimited file',
      )
      .option('--time-domain', 'the files are field-resolved sample traces; see --reference')
      .option(
        '--reference <file>',
        'reference trace for --time-domain (repeat for several)',
        collectRepeated,
        [],
      )
      .option('--time-unit <unit>', 'delay unit of the traces, overriding their headers: fs|ps');
    return {};
  }
  const flags = options.flags;
  const read: SpectrumReadOptions = {};
  if (typeof flags.xUnit === 'string') read.xUnit = unitFromText(flags.xUnit, { axis: 'x' }) as XUnit;
  if (typeof flags.yUnit === 'string') read.yUnit = unitFromText(flags.yUnit, { axis: 'y' }) as YUnit;
  if (flags.block !== undefined) read.block = wholeFrom1(flags.block, 'block');
  if (typeof flags.column === 'string' && flags.column.trim() !== '') {
    const c = flags.column.trim();
    read.column = /^\d+$/.test(c) ? wholeFrom1(c, 'column') : c;
  }
  if (flags.timeUnit !== undefined) {
    if (flags.timeUnit !== 'fs' && flags.timeUnit !== 'ps') {
      throw new BandshelfError(
        'BAD_OPTION',
        `--time-unit must be fs or ps (not '${String(flags.timeUnit)}')`,
        {
          field: 'time-unit',
        },
      );
    }
    read.timeUnit = flags.timeUnit;
  }
  const references = Array.isArray(flags.reference) ? flags.reference.map(String) : [];
  if (flags.timeDomain === true) {
    if (references.length === 0) {
      throw new BandshelfError('BAD_OPTION', '--time-domain needs --reference FILE (the reference trace)', {
        field: 'reference',
      });
    }
    read.timeDomain = true;
    read.references = references;
  } else if (references.length > 0) {
    throw new BandshelfError('BAD_OPTION', '--reference is for --time-domain traces; add --time-domain', {
      field: 'reference',
    });
  }
  return read;
}

function wholeFrom1(value: unknown, field: string): number {
  const n = Number(value);
  if (!Number.isInteger(n) || n < 1) {
    throw new BandshelfError(
      'BAD_OPTION',
      `--${field} wants a number from 1 (not '${String(value).slice(0, 20)}')`,
      {
        field,
      },
    );
  }
  return n;
}

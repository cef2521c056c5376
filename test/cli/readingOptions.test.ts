// The one declaration of the reading options: flags parse into SpectrumReadOptions, bad values are BAD_OPTION.
import { Command } from 'commander';
import { describe, expect, it } from 'vitest';
import { readingOptions } from '../../src/cli/readingOptions.js';
import { bandshelfErrorOf } from '../bandshelfErrorOf.js';

describe('readingOptions', () => {
  it('declares the flags on a command and parses what commander gathers', () => {
    const command = new Command().exitOverride();
    readingOptions(command);
    command.parse(['--x-unit', 'µm', '--y-unit', '%T', '--block', '2', '--column', 'serum_b'], {
      from: 'user',
    });
    expect(readingOptions(undefined, { flags: command.opts() })).toEqual({
      xUnit: 'um',
      yUnit: 'percent-transmittance',
      block: 2,
      column: 'serum_b',
    });
  });
  it('reads a column number as a number and THz in any case', () => {
    expect(readingOptions(undefined, { flags: { xUnit: 'THz', yUnit: 'abs', column: ' 3 ' } })).toEqual({
      xUnit: 'thz',
      yUnit: 'absorbance',
      column: 3,
    });
    expect(bandshelfErrorOf(() => readingOptions(undefined, { flags: { column: '0' } })).code).toBe(
      'BAD_OPTION',
    );
  });
  it('takes a time-domain pair and refuses a reference without --time-domain', () => {
    expect(
      readingOptions(undefined, { flags: { timeDomain: true, reference: ['r.csv'], timeUnit: 'fs' } }),
    ).toEqual({
      timeDomain: true,
      references: ['r.csv'],
      timeUnit: 'fs',
    });
    expect(bandshelfErrorOf(() => readingOptions(undefined, { flags: { reference: ['r.csv'] } })).code).toBe(
      'BAD_OPTION',
    );
    expect(bandshelfErrorOf(() => readingOptions(undefined, { flags: { block: '0' } })).code).toBe(
      'BAD_OPTION',
    );
  });
});

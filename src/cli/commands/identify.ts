// `bandshelf identify`: every band of an unknown with its table assignments, library candidates and fit status.
import { BandshelfError } from '../../error.js';
import { MIN_OVERLAP_DEFAULT } from '../../match/searchTypes.js';
import type { CommandSpec } from '../command.js';
import { configureMixtureOptions } from '../configureMixtureOptions.js';
import { formatBandTable } from '../formatBandTable.js';
import { matchUnknowns } from '../matchUnknowns.js';
import { parseMatchOptions } from '../parseMatchOptions.js';
import { readingOptions } from '../readingOptions.js';
import { writeMatchReports } from '../writeMatchReports.js';

export const identifyCommand: CommandSpec = {
  name: 'identify',
  summary: 'list the bands of an unknown with assignments, library candidates and what the mixture explains',
  example: [
    'bandshelf identify unknown-serum.csv',
    'bandshelf identify unknown-serum.csv --with albumin,water --json',
    'bandshelf identify unknown-serum.csv --no-mixture --tolerance 6',
    'bandshelf identify old-bench.txt --y-unit percent-transmittance',
    'bandshelf identify s1.csv --time-domain --reference r1.csv   # field-resolved sample and reference traces',
    '',
    'Bands are peaks plus shoulders (minima of the negative second derivative). Each table assignment names its',
    'published source. A band is "explained" when the mixture fit leaves no residual peak above 3 × noise on it.',
  ].join('\n'),
  configure(command) {
    command
      .argument(
        '<files...>',
        'the unknown spectrum file (with --time-domain: the sample traces of one unknown)',
      )
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--keep-path', 'keep the unknown’s folder in the report (default: file name and SHA-256 only)')
      .option('--at <tag>', 'use a release instead of the working state')
      .option('--recipe <file>', 'process the unknown with this recipe instead of the library’s')
      .option(
        '--technique <name>',
        'how the unknown was measured (atr: corrected for penetration depth, as ATR entries are)',
      )
      .option('--tolerance <cm-1>', 'a library peak this close is the same band', '4')
      .option('--no-mixture', 'skip the mixture fit (explained is then unknown)');
    configureMixtureOptions(command);
    command
      .option(
        '--min-overlap <cm-1>',
        'least wavenumber range unknown and reference must share',
        String(MIN_OVERLAP_DEFAULT),
      )
      .option('--report <dir>', 'write the JSON report into this folder')
      .option('--json', 'print the report as JSON');
    readingOptions(command);
  },
  async run(args, options, context) {
    const files = (args[0] as string[] | undefined) ?? [];
    const file = files[0];
    if (file === undefined) throw new BandshelfError('BAD_OPTION', 'name the unknown spectrum file');
    const parsed = parseMatchOptions({ ...options, metric: 'pearson', top: '5' }, { mixtureByDefault: true });
    if (files.length > 1 && parsed.read?.timeDomain !== true) {
      throw new BandshelfError(
        'BAD_OPTION',
        'identify takes one spectrum file (several only as the sample traces of --time-domain); use match for several',
        { field: 'files' },
      );
    }
    const run = await matchUnknowns(files, parsed, context);
    const notes = [...run.warnings];
    if (run.batch) {
      notes.push(
        `${file} holds ${run.outcomes.length} spectra; identify lists the first (pick one with --column or --block, or use match for all)`,
      );
    }
    const first = run.outcomes[0]!;
    if (first.report === undefined)
      throw new BandshelfError('BAD_FORMAT', first.error ?? 'cannot be matched', { file });
    if (typeof options.report === 'string') {
      const written = writeMatchReports([first], options.report, { cwd: context.cwd });
      notes.push(`report written to ${written[0]}`);
    }
    const stderr = notes.join('\n');
    if (options.json) return { stdout: JSON.stringify(first.report), stderr, exitCode: 0 };
    return { stdout: formatBandTable(first.report), stderr, exitCode: 0 };
  },
};

// `bandshelf contrast`: which wavenumbers differ between two groups of spectra (Welch's t per point, FDR-controlled).
import { mkdirSync, writeFileSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';
import { BandshelfError } from '../../error.js';
import { describeIoError } from '../../library/store/describeIoError.js';
import { collectRepeated } from '../collectRepeated.js';
import type { CommandSpec } from '../command.js';
import { contrastCohort } from '../contrastCohort.js';
import { formatContrastTable } from '../formatContrastTable.js';
import { parseWindow } from '../parseWindow.js';
import { readingOptions } from '../readingOptions.js';

function number(value: unknown, field: string): number | undefined {
  if (value === undefined) return undefined;
  const n = Number(value);
  if (!Number.isFinite(n)) {
    throw new BandshelfError(
      'BAD_OPTION',
      `--${field} wants a number (not '${String(value).slice(0, 20)}')`,
      {
        field,
      },
    );
  }
  return n;
}

function labelOf(target: string): string {
  return basename(target.replace(/[/\\]+$/, '')).replace(/\.csv$/i, '') || target;
}

export const contrastCommand: CommandSpec = {
  name: 'contrast',
  summary:
    'compare two groups of spectra point by point: difference bands, their assignments and library hits',
  example: [
    'bandshelf contrast --group-a cases/ --group-b controls/              # folders of spectrum files',
    'bandshelf contrast --group-a cases.csv --group-b controls.csv --q 0.01 --report reports/',
    '',
    'A CSV group names its files in a "file" column (relative to the CSV). Every spectrum is read and processed like a',
    "`match` unknown (the library's recipe and grid). At each grid point Welch's t-test compares the group means;",
    'Benjamini–Hochberg q-values control the false-discovery rate; adjacent passing points of one sign form a',
    'difference band. Assumes independent spectra (one per sample), unequal variances, approximately normal means.',
    'A difference is an association, not a diagnosis.',
  ].join('\n'),
  configure(command) {
    command
      .requiredOption(
        '--group-a <dir|csv>',
        'the first group: a folder of spectra, a spectrum file or a CSV list',
      )
      .requiredOption('--group-b <dir|csv>', 'the second group')
      .option('--label-a <name>', 'name of the first group (default: its folder or file name)')
      .option('--label-b <name>', 'name of the second group')
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--at <tag>', "use a release's recipe, grid and entries")
      .option(
        '--range <high:low>',
        'test only inside this window, chosen in advance (repeatable)',
        collectRepeated,
        [],
      )
      .option(
        '--band-window <high:low>',
        'a band-level test window named in advance (repeatable; default: the bands of the mean of all spectra)',
        collectRepeated,
        [],
      )
      .option('--q <rate>', 'false-discovery rate of the Benjamini–Hochberg procedure', '0.05')
      .option('--drop-outliers', 'leave the flagged outlier spectra out of the statistics')
      .option('--tolerance <cm-1>', 'band tolerance for library peaks on a difference band', '4')
      .option('--top <n>', 'library hits per part of the difference', '5')
      .option('--report <dir>', 'write the JSON report into this folder')
      .option('--json', 'print the report as JSON');
    readingOptions(command);
  },
  async run(_args, options, context) {
    const targetA = String(options.groupA);
    const targetB = String(options.groupB);
    const labelA = typeof options.labelA === 'string' ? options.labelA : labelOf(targetA);
    let labelB = typeof options.labelB === 'string' ? options.labelB : labelOf(targetB);
    if (labelB === labelA) labelB = `${labelB} (b)`;
    const top = number(options.top, 'top')!;
    if (!(Number.isInteger(top) && top > 0)) {
      throw new BandshelfError('BAD_OPTION', `--top wants a positive whole number (not ${top})`, {
        field: 'top',
      });
    }
    const { report, warnings } = await contrastCohort(
      { a: { target: targetA, label: labelA }, b: { target: targetB, label: labelB } },
      {
        library: options.library,
        ...(typeof options.at === 'string' ? { at: options.at } : {}),
        read: readingOptions(undefined, { flags: options }),
        q: number(options.q, 'q')!,
        tolerance: number(options.tolerance, 'tolerance')!,
        top,
        dropOutliers: options.dropOutliers === true,
        ranges: (Array.isArray(options.range) ? options.range : []).map((t) => parseWindow(String(t))),
        bandWindows: (Array.isArray(options.bandWindow) ? options.bandWindow : []).map((t) =>
          parseWindow(String(t)),
        ),
      },
      context,
    );
    const notes = [...warnings];
    if (typeof options.report === 'string') {
      const dir = resolve(context.cwd, options.report);
      const name = `contrast-${`${labelA}-vs-${labelB}`.replace(/[^A-Za-z0-9._-]+/g, '_')}.json`;
      try {
        mkdirSync(dir, { recursive: true });
        writeFileSync(join(dir, name), `${JSON.stringify(report, null, 2)}\n`);
      } catch (error) {
        throw new BandshelfError('IO_ERROR', `cannot write: ${describeIoError(error, { writing: true })}`, {
          file: options.report,
          cause: error,
        });
      }
      notes.push(`report written to ${join(options.report, name)}`);
    }
    const stdout = options.json ? JSON.stringify(report) : formatContrastTable(report);
    return { stdout, stderr: notes.join('\n'), exitCode: 0 };
  },
};

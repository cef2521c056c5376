// `bandshelf match`: ranks library entries against unknown spectra, optionally fits a mixture, writes reports.
import { writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { BandshelfError } from '../../error.js';
import { describeIoError } from '../../library/store/describeIoError.js';
import { MIN_OVERLAP_DEFAULT } from '../../match/searchTypes.js';
import { MATCH_CAUTION } from '../../schema/matchReport.js';
import { collectRepeated } from '../collectRepeated.js';
import type { CommandSpec } from '../command.js';
import { configureMixtureOptions } from '../configureMixtureOptions.js';
import { formatMatchTable } from '../formatMatchTable.js';
import { matchCsv } from '../matchCsv.js';
import { matchUnknowns } from '../matchUnknowns.js';
import { parseMatchOptions } from '../parseMatchOptions.js';
import { readingOptions } from '../readingOptions.js';
import { textTable } from '../textTable.js';
import { writeMatchReports } from '../writeMatchReports.js';

export const matchCommand: CommandSpec = {
  name: 'match',
  summary: 'rank library entries against unknown spectra; fit a mixture and find unexplained bands',
  example: [
    'bandshelf match unknown-serum.csv                         # top 10 by Pearson correlation',
    'bandshelf match unknown-serum.csv --range 1800:900 --metric all --at v1',
    'bandshelf match unknown-serum.csv --mixture --with albumin,water --report reports/',
    'bandshelf match unknowns/ --csv results.csv              # batch: one CSV row per unknown',
    'bandshelf match old-bench.txt --x-unit um --y-unit %T     # a file without unit headers',
    'bandshelf match s1.csv --time-domain --reference r1.csv   # field-resolved sample and reference traces',
    '',
    'The unknown is read and processed exactly like the library (its recipe, or --recipe). Scores are 0–1 for',
    'pearson, derivative and cosine (a negative correlation shows as 0) and a distance for euclidean. The mixture',
    'fit keeps a component only if it lowers the residual sum of squares by ≥ 1 % and gets a positive weight;',
    'residual peaks above 3 × noise (band-free window 2000–1900 cm⁻¹) are the unexplained bands.',
  ].join('\n'),
  configure(command) {
    command
      .argument(
        '<files...>',
        'unknown spectrum files or folders (with --time-domain: the sample traces of one unknown)',
      )
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--keep-path', 'keep the unknown’s folder in the report (default: file name and SHA-256 only)')
      .option('--at <tag>', 'match against a release instead of the working state')
      .option('--recipe <file>', 'process the unknown with this recipe instead of the library’s')
      .option(
        '--technique <name>',
        'how the unknown was measured (atr: corrected for penetration depth, as ATR entries are)',
      )
      .option('--range <high:low>', 'score only inside this window (repeatable)', collectRepeated, [])
      .option('--metric <name>', 'pearson, derivative, cosine, euclidean or all', 'pearson')
      .option('--top <n>', 'hits per metric', '10')
      .option(
        '--min-overlap <cm-1>',
        'least wavenumber range unknown and reference must share',
        String(MIN_OVERLAP_DEFAULT),
      )
      .option('--mixture', 'fit the unknown as a non-negative mixture of library spectra');
    configureMixtureOptions(command);
    command
      .option('--tolerance <cm-1>', 'band tolerance for the band identification', '4')
      .option('--report <dir>', 'write one JSON report per unknown into this folder')
      .option('--csv <file>', 'write one CSV row per unknown into this file')
      .option('--json', 'print the report (batch: {reports, failed}) as JSON')
      .option('--explain', 'under each pearson hit, print the share of its score each spectral region gives')
      .option(
        '--explain-region <label=high:low>',
        'a region of --explain and the report\'s contributions, e.g. "C=O=1800:1700" (repeatable; replaces the default regions)',
        collectRepeated,
        [],
      );
    readingOptions(command);
  },
  async run(args, options, context) {
    const targets = (args[0] as string[] | undefined) ?? [];
    const parsed = parseMatchOptions(options);
    const run = await matchUnknowns(targets, parsed, context);
    const notes: string[] = [...run.warnings];
    if (typeof options.report === 'string') {
      const written = writeMatchReports(run.outcomes, options.report, { cwd: context.cwd });
      notes.push(`${written.length} report${written.length === 1 ? '' : 's'} written to ${options.report}`);
    }
    if (typeof options.csv === 'string') {
      try {
        writeFileSync(resolve(context.cwd, options.csv), matchCsv(run.outcomes));
      } catch (error) {
        throw new BandshelfError('IO_ERROR', `cannot write: ${describeIoError(error, { writing: true })}`, {
          file: options.csv,
          cause: error,
        });
      }
    }
    const failed = run.outcomes.filter((o) => o.report === undefined);
    for (const f of failed) {
      const part = `${f.block === undefined ? '' : ` block ${f.block}`}${f.column === undefined ? '' : ` column ${f.column}`}`;
      notes.push(`${f.file}${part}: ${f.error}`);
    }
    const exitCode = failed.length > 0 ? 1 : 0;
    const stderr = notes.join('\n');
    if (options.json) {
      const stdout = run.batch
        ? JSON.stringify({
            reports: run.outcomes.flatMap((o) => (o.report ? [o.report] : [])),
            failed: failed.map((f) => ({
              file: f.file,
              ...(f.block === undefined ? {} : { block: f.block }),
              ...(f.column === undefined ? {} : { column: f.column }),
              error: f.error,
            })),
          })
        : JSON.stringify(run.outcomes[0]!.report);
      return { stdout, stderr, exitCode };
    }
    if (!run.batch) {
      const stdout = formatMatchTable(run.outcomes[0]!.report!, { explain: options.explain === true });
      return { stdout, stderr, exitCode };
    }
    if (typeof options.csv !== 'string') {
      // Batch without a CSV file: the CSV is the output.
      return {
        stdout: matchCsv(run.outcomes),
        stderr: [stderr, MATCH_CAUTION].filter(Boolean).join('\n'),
        exitCode,
      };
    }
    const summary = textTable([
      ['FILE', 'TOP HIT', 'SCORE', 'STANDING', 'MIXTURE', 'UNEXPLAINED'],
      ...run.outcomes.map((o) => {
        const r = o.report;
        const name = `${o.file}${o.block === undefined ? '' : ` #${o.block}`}${o.column === undefined ? '' : ` ${o.column}`}`;
        if (r === undefined) return [name, 'failed', '', '', '', ''];
        return [
          name,
          r.hits[0]?.id ?? '–',
          r.hits[0]?.score.toFixed(4) ?? '',
          r.standing.verdict,
          r.mixture === null ? '' : r.mixture.components.map((c) => c.id).join('+'),
          r.mixture === null ? '' : r.mixture.residualBands.map((b) => b.position.toFixed(0)).join(' '),
        ];
      }),
    ]);
    return {
      stdout: `${summary}\n\nCSV written to ${options.csv}\n${MATCH_CAUTION}`,
      stderr,
      exitCode,
    };
  },
};

// Declares the mixture-fit options `match` and `identify` share, so both offer the same flags and defaults that
// parseMatchOptions reads.
import type { Command } from 'commander';
import { collectRepeated } from './collectRepeated.js';

/** Adds --with, --max-components, --candidates, the class/id filters and --baseline-degree to `command`. */
export function configureMixtureOptions(command: Command): Command {
  return command
    .option(
      '--with <ids>',
      'entries forced into the mixture (comma-separated, repeatable)',
      collectRepeated,
      [],
    )
    .option('--max-components <n>', 'most components in the mixture', '6')
    .option('--candidates <n>', 'top Pearson hits offered to the mixture fit', '30')
    .option(
      '--exclude-class <classes>',
      'leave these classes out of the hits and the fit (comma-separated)',
      collectRepeated,
      [],
    )
    .option(
      '--exclude <ids>',
      'leave these entries out of the hits and the fit (comma-separated)',
      collectRepeated,
      [],
    )
    .option(
      '--only-class <classes>',
      'only these classes in the hits and the fit (comma-separated)',
      collectRepeated,
      [],
    )
    .option(
      '--baseline-degree <n>',
      'mixture baseline polynomial: none or 0–6 (default 2, a smooth residue of any baseline correction)',
    );
}

// Declares the mixture-fit options `match` and `identify` share, so both offer the same flags and defaults that
// parseMatchOptions reads.
import type { Command } from 'commander';
import { collectRepeated } from './collectRepeated.js';

/** Adds --with, --max-components, --candidates and --baseline-degree to `command`, and returns it. */
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
    .option('--baseline-degree <n>', 'mixture baseline polynomial: none or 0–6 (default: from the recipe)');
}

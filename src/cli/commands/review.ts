// `bandshelf review ID`: approves or rejects the newest revision of an entry (a second person's review).
import { BandshelfError } from '../../error.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { defaultAuthor } from '../../library/store/defaultAuthor.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import { reviewRevision } from '../../library/store/reviewRevision.js';
import type { CommandSpec } from '../command.js';

export const reviewCommand: CommandSpec = {
  name: 'review',
  summary: "approve or reject an entry's newest revision",
  example: [
    'bandshelf review serum-07 --approve --reviewer "A. Second"',
    'bandshelf review serum-07 --reject --reviewer "A. Second" --note "baseline wrong below 900 cm-1"',
    '',
    'The reviewer must not be the revision\'s author ("reviewed by a second person"); --force allows it for a',
    'one-person lab. release --reviewed-only publishes reviewed revisions only.',
  ].join('\n'),
  configure(command) {
    command
      .argument('<id>', 'entry id')
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--approve', 'mark the revision reviewed')
      .option('--reject', 'mark the revision rejected')
      .option('--reviewer <name>', 'who reviews (default $BANDSHELF_AUTHOR or the OS user)')
      .option('--note <text>', 'a remark stored with the review', '')
      .option('--force', "allow the revision's author to review it")
      .option('--json', 'print the review as JSON');
  },
  async run(args, options, context) {
    const id = String(args[0]);
    if (Boolean(options.approve) === Boolean(options.reject)) {
      throw new BandshelfError('BAD_OPTION', 'give exactly one of --approve or --reject', {
        field: 'approve',
      });
    }
    const library = openLibrary(libraryPath(options.library, context.cwd));
    try {
      const outcome = reviewRevision(library, id, {
        state: options.approve ? 'reviewed' : 'rejected',
        reviewer: typeof options.reviewer === 'string' ? options.reviewer : defaultAuthor(),
        note: String(options.note ?? ''),
        force: Boolean(options.force),
      });
      if (options.json) return { stdout: JSON.stringify(outcome), exitCode: 0 };
      return {
        stdout: `${id} revision ${outcome.revision}: ${outcome.state} by ${outcome.reviewer}`,
        exitCode: 0,
      };
    } finally {
      closeLibrary(library);
    }
  },
};

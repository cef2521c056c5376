// `bandshelf retire ID`: takes an entry out of the current state; its history and releases stay.
import { BandshelfError } from '../../error.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { defaultAuthor } from '../../library/store/defaultAuthor.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import { retireEntry } from '../../library/store/retireEntry.js';
import type { CommandSpec } from '../command.js';

export const retireCommand: CommandSpec = {
  name: 'retire',
  summary: 'take an entry out of the current state (history is kept)',
  example: [
    'bandshelf retire lysozyme --reason "contaminated film; remeasure"',
    'bandshelf add lysozyme.jdx      # adding data again brings it back as a new revision',
  ].join('\n'),
  configure(command) {
    command
      .argument('<id>', 'entry id')
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--reason <text>', 'why the entry leaves the library (required)')
      .option('--author <name>', 'who (default $BANDSHELF_AUTHOR or the OS user)')
      .option('--json', 'print {id, revision, hash} as JSON');
  },
  async run(args, options, context) {
    const id = String(args[0]);
    const reason = typeof options.reason === 'string' ? options.reason.trim() : '';
    if (reason === '') throw new BandshelfError('BAD_OPTION', 'retire needs --reason', { field: 'reason' });
    const library = openLibrary(libraryPath(options.library, context.cwd));
    try {
      const outcome = retireEntry(library, id, {
        reason,
        author: typeof options.author === 'string' ? options.author : defaultAuthor(),
      });
      const result = { id: outcome.id, revision: outcome.revision, hash: outcome.hash };
      if (options.json) return { stdout: JSON.stringify(result), exitCode: 0 };
      return { stdout: `${id}: retired (revision ${outcome.revision})`, exitCode: 0 };
    } finally {
      closeLibrary(library);
    }
  },
};

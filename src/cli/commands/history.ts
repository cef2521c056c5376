// `bandshelf history ID`: every revision of an entry, with what changed, its review state and releases.
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { entryHistory } from '../../library/store/entryHistory.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import type { CommandSpec } from '../command.js';
import { textTable } from '../textTable.js';

export const historyCommand: CommandSpec = {
  name: 'history',
  summary: "list an entry's revisions and what each changed",
  example: ['bandshelf history serum-07', 'bandshelf history serum-07 --json'].join('\n'),
  configure(command) {
    command
      .argument('<id>', 'entry id')
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--json', 'print the revisions as JSON');
  },
  async run(args, options, context) {
    const id = String(args[0]);
    const library = openLibrary(libraryPath(options.library, context.cwd), { readonly: true });
    try {
      const history = entryHistory(library, id);
      if (options.json) return { stdout: JSON.stringify({ id, revisions: history }), exitCode: 0 };
      const rows = [
        ['REV', 'KIND', 'CHANGED', 'REVIEW', 'WHEN', 'BY', 'HASH', 'RELEASES', 'MESSAGE'],
        ...history.map((h) => [
          String(h.revision),
          h.kind,
          h.changed.length > 0 ? h.changed.join('+') : h.revision === 1 ? 'new' : '—',
          h.reviewer ? `${h.reviewState} (${h.reviewer})` : h.reviewState,
          h.createdAt.replace('T', ' ').slice(0, 19),
          h.author,
          h.hash.slice(0, 12),
          h.releases.join(',') || '—',
          h.message,
        ]),
      ];
      return { stdout: textTable(rows, { right: [0] }), exitCode: 0 };
    } finally {
      closeLibrary(library);
    }
  },
};

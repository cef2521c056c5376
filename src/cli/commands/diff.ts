// `bandshelf diff A B`: entries added, changed (data, recipe, metadata) and removed between two states.
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { diffStates } from '../../library/store/diffStates.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import type { CommandSpec } from '../command.js';

export const diffCommand: CommandSpec = {
  name: 'diff',
  summary: 'compare two releases (or a release and "current")',
  example: ['bandshelf diff 2026.1 2026.2', 'bandshelf diff 2026.2 current --json'].join('\n'),
  configure(command) {
    command
      .argument('<a>', 'release tag (or "current")')
      .argument('<b>', 'release tag (or "current" for the working state)')
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--json', 'print {added:[{id}], changed:[{id, what}], removed:[{id}]} as JSON');
  },
  async run(args, options, context) {
    const [a, b] = [String(args[0]), String(args[1])];
    const library = openLibrary(libraryPath(options.library, context.cwd), { readonly: true });
    try {
      const d = diffStates(library, a, b);
      if (options.json) {
        return {
          stdout: JSON.stringify({
            from: d.from,
            to: d.to,
            added: d.added.map((x) => ({ id: x.id, revision: x.revision })),
            changed: d.changed.map((x) => ({ id: x.id, what: x.what, from: x.from, to: x.to })),
            removed: d.removed.map((x) => ({ id: x.id, revision: x.revision })),
          }),
          exitCode: 0,
        };
      }
      const lines = [
        ...d.added.map((x) => `+ ${x.id} (r${x.revision})`),
        ...d.changed.map((x) => `~ ${x.id} r${x.from} → r${x.to}: ${x.what.join(', ')}`),
        ...d.removed.map((x) => `- ${x.id} (was r${x.revision})`),
      ];
      const summary = `${a} → ${b}: ${d.added.length} added, ${d.changed.length} changed, ${d.removed.length} removed`;
      return { stdout: [...lines, summary].join('\n'), exitCode: 0 };
    } finally {
      closeLibrary(library);
    }
  },
};

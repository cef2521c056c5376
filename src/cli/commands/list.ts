// `bandshelf list`: the entries of the current state or of a release.
import { BandshelfError } from '../../error.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { listEntries } from '../../library/store/listEntries.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import { entryClasses } from '../../schema/meta.js';
import type { CommandSpec } from '../command.js';
import { textTable } from '../textTable.js';

export const listCommand: CommandSpec = {
  name: 'list',
  summary: 'list the entries (current state, or a release with --at)',
  example: [
    'bandshelf list',
    'bandshelf list --at 2026.1 --class protein',
    'bandshelf list --json | jq length',
  ].join('\n'),
  configure(command) {
    command
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--at <tag>', 'read the state a release froze')
      .option('--class <class>', 'only entries of this class')
      .option('--json', 'print [{id, revision, name, class}] as JSON');
  },
  async run(_args, options, context) {
    const wanted = options.class;
    if (typeof wanted === 'string' && !(entryClasses as readonly string[]).includes(wanted)) {
      // A misspelt class would otherwise list nothing and look like an empty library.
      throw new BandshelfError(
        'BAD_OPTION',
        `--class must be one of ${entryClasses.join(', ')} (not '${wanted}')`,
        {
          field: 'class',
        },
      );
    }
    const library = openLibrary(libraryPath(options.library, context.cwd), { readonly: true });
    try {
      let entries = listEntries(library, { at: options.at as string | undefined });
      if (typeof options.class === 'string') entries = entries.filter((e) => e.class === options.class);
      if (options.json) {
        return {
          stdout: JSON.stringify(
            entries.map((e) => ({
              id: e.id,
              revision: e.revision,
              name: e.name,
              class: e.class,
              hash: e.hash,
              reviewState: e.reviewState,
            })),
          ),
          exitCode: 0,
        };
      }
      if (entries.length === 0) {
        return {
          stdout: `${options.at ? `release ${options.at}` : 'the library'} holds no entries${
            typeof wanted === 'string' ? ` of class ${wanted}` : ''
          }`,
          exitCode: 0,
        };
      }
      const rows = [
        ['ID', 'REV', 'CLASS', 'REVIEW', 'COVERAGE cm⁻¹', 'PEAKS', 'NAME'],
        ...entries.map((e) => [
          e.id,
          String(e.revision),
          e.class,
          e.reviewState,
          e.coverage ? `${Math.round(e.coverage.max)}–${Math.round(e.coverage.min)}` : '—',
          String(e.peakCount),
          e.name,
        ]),
      ];
      return {
        stdout: `${textTable(rows, { right: [1, 5] })}\n${entries.length} entr${entries.length === 1 ? 'y' : 'ies'}${options.at ? ` in release ${options.at}` : ''}`,
        exitCode: 0,
      };
    } finally {
      closeLibrary(library);
    }
  },
};

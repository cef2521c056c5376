// `bandshelf backup FILE`: a consistent copy of the library, safe to take while others use it.
import { resolve } from 'node:path';
import { backupLibrary } from '../../library/store/backupLibrary.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import type { CommandSpec } from '../command.js';

export const backupCommand: CommandSpec = {
  name: 'backup',
  summary: 'write a consistent copy of the library (safe while others read it)',
  example: [
    'bandshelf backup serum-refs-2026-12-04.sqlite --library serum-refs.sqlite',
    'bandshelf check --library serum-refs-2026-12-04.sqlite   # verify the copy',
    '',
    'To restore, copy a backup that passes `check` over the damaged library file (with no bandshelf running).',
  ].join('\n'),
  configure(command) {
    command
      .argument('<file>', 'where to write the copy')
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--overwrite', 'replace an existing file at <file>')
      .option('--json', 'print {backup, pages} as JSON');
  },
  async run(args, options, context) {
    const destination = resolve(context.cwd, String(args[0]));
    const library = openLibrary(libraryPath(options.library, context.cwd), { readonly: true });
    try {
      const { totalPages } = await backupLibrary(library, destination, {
        overwrite: options.overwrite === true,
      });
      if (options.json)
        return { stdout: JSON.stringify({ backup: destination, pages: totalPages }), exitCode: 0 };
      return {
        stdout: `backup written to ${destination} (${totalPages} pages); verify it with bandshelf check`,
        exitCode: 0,
      };
    } finally {
      closeLibrary(library);
    }
  },
};

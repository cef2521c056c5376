// `bandshelf assignments`: lists the lab's own band-assignment rows, or adds rows from a JSON file.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { BandshelfError } from '../../error.js';
import { addAssignments } from '../../library/store/addAssignments.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { defaultAuthor } from '../../library/store/defaultAuthor.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { listAssignments } from '../../library/store/listAssignments.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import type { CommandSpec } from '../command.js';
import { textTable } from '../textTable.js';

export const assignmentsCommand: CommandSpec = {
  name: 'assignments',
  summary: "list or add the lab's own band-assignment rows",
  example: [
    'bandshelf assignments                         # the rows this library added',
    'bandshelf assignments --add our-bands.json     # [{min, max, label, vibration, group, class:[…], source}]',
    '',
    'Every row needs its published source; rows are stored with origin "lab" and basis "lab" unless given.',
    'The table bandshelf ships is used by identify and the site beside these rows.',
  ].join('\n'),
  configure(command) {
    command
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--add <file>', 'a JSON array of band-assignment rows to store')
      .option('--author <name>', 'who (default $BANDSHELF_AUTHOR or the OS user)')
      .option('--json', 'print the rows as JSON');
  },
  async run(_args, options, context) {
    const path = libraryPath(options.library, context.cwd);
    if (typeof options.add === 'string') {
      let rows: unknown;
      try {
        rows = JSON.parse(readFileSync(resolve(context.cwd, options.add), 'utf8'));
      } catch (error) {
        throw new BandshelfError(
          error instanceof SyntaxError ? 'BAD_FORMAT' : 'IO_ERROR',
          error instanceof SyntaxError ? `not valid JSON (${error.message})` : 'cannot read the file',
          { file: options.add },
        );
      }
      if (!Array.isArray(rows)) {
        throw new BandshelfError('BAD_FORMAT', 'expected a JSON array of rows', { file: options.add });
      }
      const library = openLibrary(path);
      try {
        const stored = addAssignments(library, rows, {
          file: options.add,
          author: typeof options.author === 'string' ? options.author : defaultAuthor(),
        });
        if (options.json) return { stdout: JSON.stringify({ added: stored }), exitCode: 0 };
        return {
          stdout: `${stored.length} band-assignment row${stored.length === 1 ? '' : 's'} added`,
          exitCode: 0,
        };
      } finally {
        closeLibrary(library);
      }
    }
    const library = openLibrary(path, { readonly: true });
    try {
      const rows = listAssignments(library);
      if (options.json) return { stdout: JSON.stringify(rows), exitCode: 0 };
      if (rows.length === 0)
        return { stdout: 'the library holds no band-assignment rows of its own', exitCode: 0 };
      return {
        stdout: textTable([
          ['cm⁻¹', 'LABEL', 'CLASS', 'SOURCE'],
          ...rows.map((r) => [`${r.min}–${r.max}`, r.label, r.class.join(', '), r.source]),
        ]),
        exitCode: 0,
      };
    } finally {
      closeLibrary(library);
    }
  },
};

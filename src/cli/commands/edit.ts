// `bandshelf edit ID`: a metadata revision (same data and recipe, new metadata; a changed resolution re-pins it).
import { resolve } from 'node:path';
import { BandshelfError } from '../../error.js';
import { metaValueFromText } from '../../formats/metaValueFromText.js';
import { loadSidecar } from '../../library/ingest/loadSidecar.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { defaultAuthor } from '../../library/store/defaultAuthor.js';
import { editEntry } from '../../library/store/editEntry.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import { readTextFile } from '../../library/store/readTextFile.js';
import { collectRepeated } from '../collectRepeated.js';
import type { CommandSpec } from '../command.js';

/** `field=value` pairs into typed metadata values; an empty value removes the field. */
function parseAssignments(pairs: readonly string[]): Record<string, unknown> {
  const set: Record<string, unknown> = {};
  const concentration: Record<string, unknown> = {};
  for (const pair of pairs) {
    const eq = pair.indexOf('=');
    if (eq <= 0) {
      throw new BandshelfError('BAD_OPTION', `--set wants field=value (not '${pair}')`, { field: 'set' });
    }
    const field = pair.slice(0, eq).trim();
    const text = pair.slice(eq + 1);
    if (text.trim() === '') {
      set[field] = undefined;
      continue;
    }
    const value = metaValueFromText({ field, text }, {});
    if (field.startsWith('concentration.')) concentration[field.slice('concentration.'.length)] = value;
    else set[field] = value;
  }
  if (Object.keys(concentration).length > 0) set.concentration = concentration;
  return set;
}

export const editCommand: CommandSpec = {
  name: 'edit',
  summary: 'change metadata (a metadata-only revision)',
  example: [
    'bandshelf edit serum-07 --set class=biofluid --set "tags=serum;dried film" --message "tags from the log book"',
    'bandshelf edit serum-07 --set notes=            # an empty value removes a field',
    'bandshelf edit serum-07 --meta serum-07.meta.json',
  ].join('\n'),
  configure(command) {
    command
      .argument('<id>', 'entry id')
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option(
        '--set <field=value>',
        'set one field (repeatable; lists are ";"-separated)',
        collectRepeated,
        [],
      )
      .option('--meta <file>', 'replace the metadata by this JSON (sidecar format)')
      .option('--message <text>', 'why', 'metadata edit')
      .option('--author <name>', 'who (default $BANDSHELF_AUTHOR or the OS user)')
      .option('--json', 'print {id, revision, hash, status, kind} as JSON');
  },
  async run(args, options, context) {
    const id = String(args[0]);
    const pairs = (options.set as string[] | undefined) ?? [];
    if (pairs.length === 0 && typeof options.meta !== 'string') {
      throw new BandshelfError('BAD_OPTION', 'give --set field=value or --meta FILE', { field: 'set' });
    }
    const set = parseAssignments(pairs);
    let replace: Record<string, unknown> | undefined;
    if (typeof options.meta === 'string') {
      const text = readTextFile(resolve(context.cwd, options.meta), { label: options.meta });
      const sections = loadSidecar(text, { file: options.meta });
      if (sections.recipe || sections.timeDomain || sections.read) {
        throw new BandshelfError(
          'BAD_METADATA',
          'edit changes metadata only; re-add the data to change its recipe',
          {
            file: options.meta,
          },
        );
      }
      replace = { id, ...sections.meta };
    }
    const library = openLibrary(libraryPath(options.library, context.cwd));
    try {
      const outcome = editEntry(library, id, {
        set,
        ...(replace ? { replace, file: String(options.meta) } : {}),
        author: typeof options.author === 'string' ? options.author : defaultAuthor(),
        message: String(options.message ?? 'metadata edit'),
      });
      const result = {
        id: outcome.id,
        revision: outcome.revision,
        hash: outcome.hash,
        status: outcome.status,
        kind: outcome.kind,
      };
      if (options.json) return { stdout: JSON.stringify(result), exitCode: 0 };
      return {
        stdout:
          outcome.status === 'added'
            ? outcome.kind === 'data'
              ? `${id}: revision ${outcome.revision} (resolution re-pinned in its recipe; processed again) ${outcome.hash.slice(0, 12)}`
              : `${id}: revision ${outcome.revision} (metadata) ${outcome.hash.slice(0, 12)}`
            : `${id}: unchanged (the metadata is already so; revision ${outcome.revision})`,
        exitCode: 0,
      };
    } finally {
      closeLibrary(library);
    }
  },
};

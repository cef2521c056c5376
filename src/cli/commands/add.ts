// `bandshelf add`: parses the flags, calls the ingest pipeline and prints its outcome (table or --json).
import { resolve } from 'node:path';
import { BandshelfError } from '../../error.js';
import { type IngestOutcome, ingest } from '../../library/ingest/ingest.js';
import type { CommitOutcome } from '../../library/ingest/ingestTypes.js';
import { type LoadedSidecar, loadSidecar } from '../../library/ingest/loadSidecar.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { defaultAuthor } from '../../library/store/defaultAuthor.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import { readRecipeFile } from '../../library/store/readRecipeFile.js';
import { readTextFile } from '../../library/store/readTextFile.js';
import { libraryNearDuplicateIndex } from '../../match/libraryNearDuplicateIndex.js';
import { entryMetaPatchSchema } from '../../schema/meta.js';
import { metaErrorFromIssues } from '../../schema/metaErrorFromIssues.js';
import type { CommandSpec } from '../command.js';
import { flagWording } from '../flagWording.js';
import { readingOptions } from '../readingOptions.js';
import { textTable } from '../textTable.js';

/** The same error, its message speaking of flags instead of API option names. */
function inFlagWords(error: BandshelfError): BandshelfError {
  return new BandshelfError(error.code, flagWording(error.message), {
    file: error.file,
    line: error.line,
    field: error.field,
    cause: error,
  });
}

export const addCommand: CommandSpec = {
  name: 'add',
  summary: 'ingest spectrum files, folders or time-domain traces',
  example: [
    'bandshelf add library/                      # every spectrum file with its sidecar (*.meta.json)',
    'bandshelf add serum-07.csv --class biofluid --name "Pooled serum film 07"',
    'bandshelf add old-bench/ --manifest old-bench/manifest.csv --y-unit percent-transmittance --atomic',
    'bandshelf add s1.csv s2.csv --time-domain --reference r1.csv --reference r2.csv --id lactate-eos',
    '',
    'A folder is walked with its sub-folders (hidden ones and folders named "unknowns" are skipped); its own',
    'manifest.csv is used unless --manifest names one. Metadata precedence: flags > --meta > sidecar > manifest >',
    "the file's labels (JCAMP-DX TITLE, CAS …). Re-adding identical content is reported as unchanged.",
  ].join('\n'),
  configure(command) {
    command
      .argument(
        '<paths...>',
        'spectrum files or folders (with --time-domain: the repeated sample traces of one entry)',
      )
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--meta <file>', 'metadata JSON (sidecar format, may hold a recipe) for every file of this add')
      .option('--manifest <csv>', 'metadata table with a "file" column naming each data file')
      .option('--id <id>', 'entry id (one file only; default from the file name or JCAMP-DX TITLE)')
      .option('--name <name>', 'entry name')
      .option('--class <class>', 'entry class (protein, lipid, …, biofluid, other)')
      .option('--recipe <file>', 'processing recipe JSON for these entries instead of the library default')
      .option('--message <text>', 'why (stored with each revision)', '')
      .option('--author <name>', 'who (default $BANDSHELF_AUTHOR or the OS user)')
      .option('--force', 'store entries even when QC raises an error-level flag')
      .option('--atomic', 'all files in one transaction: any failure stores nothing')
      .option('--max-file-size <MB>', 'largest input file read, in MB (default 200)')
      .option(
        '--near-duplicate <r>',
        'Pearson r above which a new entry is noted as a near-duplicate of another (default 0.999)',
      )
      .option('--json', 'print {added, unchanged, failed} as JSON');
    readingOptions(command);
  },
  async run(args, options, context) {
    const paths = (args[0] as string[] | undefined) ?? [];
    const flags: Record<string, unknown> = {};
    for (const key of ['id', 'name', 'class'] as const) {
      if (typeof options[key] === 'string') flags[key] = options[key];
    }
    const checkedFlags = entryMetaPatchSchema.safeParse(flags);
    if (!checkedFlags.success) {
      const error = metaErrorFromIssues(checkedFlags.error.issues, {});
      throw new BandshelfError('BAD_OPTION', `--${error.field}: ${error.message}`, { field: error.field });
    }
    const { timeDomain, references, ...read } = readingOptions(undefined, { flags: options });
    let maxFileBytes: number | undefined;
    if (options.maxFileSize !== undefined) {
      const mb = Number(options.maxFileSize);
      if (!(mb > 0) || !Number.isFinite(mb)) {
        throw new BandshelfError(
          'BAD_OPTION',
          `--max-file-size wants a size in MB above 0 (not '${options.maxFileSize}')`,
          { field: 'max-file-size' },
        );
      }
      maxFileBytes = Math.round(mb * 1e6);
    }
    let nearDuplicateThreshold: number | undefined;
    if (options.nearDuplicate !== undefined) {
      const r = Number(options.nearDuplicate);
      if (!(r > 0 && r < 1) || String(options.nearDuplicate).trim() === '') {
        throw new BandshelfError(
          'BAD_OPTION',
          `--near-duplicate wants a correlation between 0 and 1 (not '${options.nearDuplicate}')`,
          { field: 'near-duplicate' },
        );
      }
      nearDuplicateThreshold = r;
    }
    const recipe =
      typeof options.recipe === 'string'
        ? readRecipeFile(resolve(context.cwd, options.recipe), { label: options.recipe })
        : undefined;
    let metaFile: { sections: LoadedSidecar; label: string } | undefined;
    if (typeof options.meta === 'string') {
      const text = readTextFile(resolve(context.cwd, options.meta), { label: options.meta });
      metaFile = { sections: loadSidecar(text, { file: options.meta }), label: options.meta };
    }
    const author =
      typeof options.author === 'string' && options.author.trim() ? options.author.trim() : defaultAuthor();
    const message = typeof options.message === 'string' ? options.message : '';

    const library = openLibrary(libraryPath(options.library, context.cwd));
    try {
      let outcome: IngestOutcome;
      try {
        outcome = ingest(library, paths, {
          cwd: context.cwd,
          manifest: typeof options.manifest === 'string' ? options.manifest : undefined,
          timeDomain: timeDomain === true,
          references: references ?? [],
          meta: checkedFlags.data,
          metaFile,
          recipe,
          read,
          force: Boolean(options.force),
          atomic: Boolean(options.atomic),
          ...(maxFileBytes === undefined ? {} : { maxFileBytes }),
          ...(nearDuplicateThreshold === undefined ? {} : { nearDuplicateThreshold }),
          author,
          message,
          progress: context.progress,
          nearDuplicateIndex: libraryNearDuplicateIndex,
        });
      } catch (error) {
        throw error instanceof BandshelfError ? inFlagWords(error) : error;
      }
      const { added, unchanged } = outcome;
      const failed = outcome.failed.map((f) => ({ file: f.file, error: flagWording(f.error) }));
      const notes = outcome.notes.map(flagWording);

      const exitCode = failed.length > 0 ? 1 : 0;
      const stderrLines = [...notes, ...failed.map((f) => `bandshelf: ${f.error}`)];
      if (options.json) {
        const brief = (o: CommitOutcome) => ({ id: o.id, revision: o.revision, hash: o.hash });
        return {
          stdout: JSON.stringify({ added: added.map(brief), unchanged: unchanged.map(brief), failed }),
          stderr: stderrLines.join('\n'),
          exitCode,
        };
      }
      const rows = [
        ...added.map((o) => ['added', o.id, `r${o.revision}`, o.hash.slice(0, 12), o.label]),
        ...unchanged.map((o) => ['unchanged', o.id, `r${o.revision}`, o.hash.slice(0, 12), o.label]),
      ];
      const summary = `${added.length} added, ${unchanged.length} unchanged, ${failed.length} failed${
        options.atomic && failed.length > 0 ? ' (--atomic: nothing was stored)' : ''
      }`;
      return {
        stdout: [rows.length > 0 ? textTable(rows) : '', summary].filter((s) => s !== '').join('\n'),
        stderr: stderrLines.join('\n'),
        exitCode,
      };
    } finally {
      closeLibrary(library);
    }
  },
};

// `bandshelf export`: one entry as JCAMP-DX or CSV, or the whole library as files + sidecars `add` can re-read.
import { existsSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { BandshelfError } from '../../error.js';
import { writeCsv } from '../../formats/writeCsv.js';
import { type JcampForm, writeJcampDx } from '../../formats/writeJcampDx.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { describeIoError } from '../../library/store/describeIoError.js';
import { exportAll } from '../../library/store/exportAll.js';
import { exportBundle } from '../../library/store/exportBundle.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import { readEntry } from '../../library/store/readEntry.js';
import { writeBundleFile } from '../../library/store/writeBundleFile.js';
import { gridAxis } from '../../spectrum/gridAxis.js';
import type { Spectrum } from '../../spectrum/types.js';
import type { CommandSpec } from '../command.js';

const FORMS: JcampForm[] = ['affn', 'pac', 'sqz', 'dif', 'difdup'];
const LABELS = ['origin', 'owner', 'resolution', 'state', 'samplingProcedure', 'cas', 'formula'] as const;

function formatOf(options: Record<string, unknown>, out: string): 'jcamp' | 'csv' {
  const given = options.format;
  if (given === 'jcamp' || given === 'csv') return given;
  if (given !== undefined) {
    throw new BandshelfError('BAD_OPTION', `--format must be jcamp or csv (not '${String(given)}')`, {
      field: 'format',
    });
  }
  if (/\.(jdx|dx|jcamp)$/i.test(out)) return 'jcamp';
  if (/\.csv$/i.test(out)) return 'csv';
  throw new BandshelfError('BAD_OPTION', 'give --format jcamp|csv (the --out name does not say)', {
    field: 'format',
  });
}

/** The covered points of the processed grid vector, as a spectrum (not-covered points are left out). */
function processedSpectrum(axis: Float64Array, processed: Float64Array): Spectrum {
  const keep: number[] = [];
  for (let i = 0; i < processed.length; i++) if (Number.isFinite(processed[i]!)) keep.push(i);
  return {
    wavenumber: Float64Array.from(keep, (i) => axis[i]!),
    absorbance: Float64Array.from(keep, (i) => processed[i]!),
  };
}

export const exportCommand: CommandSpec = {
  name: 'export',
  summary: 'write an entry as JCAMP-DX or CSV, or the whole library with --all',
  example: [
    'bandshelf export serum-07 --format jcamp --out serum-07.jdx           # original spectrum, DIFDUP',
    'bandshelf export serum-07 --format csv --out serum-07.csv --at 2026.1',
    'bandshelf export serum-07 --out serum-07-processed.csv --processed   # the processed grid vector',
    'bandshelf export --all backup/      # original files + sidecars; `bandshelf add backup/` re-creates them',
    'bandshelf export --bundle serum-refs.bundle   # every revision, review, release and lab assignment row',
    'bandshelf import serum-refs.bundle --library other-lab.sqlite',
  ].join('\n'),
  configure(command) {
    command
      .argument('[id]', 'entry id')
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--format <format>', 'jcamp or csv (default from the --out extension)')
      .option('--form <form>', `JCAMP-DX ordinate form: ${FORMS.join('|')}`, 'difdup')
      .option('--out <file>', 'file to write (never overwritten unless --force)')
      .option('--processed', 'export the processed grid vector instead of the original spectrum')
      .option('--all <dir>', 'export every entry (original bytes + sidecars) into a new or empty folder')
      .option(
        '--bundle <file>',
        'write the whole library with its history as one file `bandshelf import` reads',
      )
      .option(
        '--at <tag>',
        'export the state a release froze (with --bundle: its members and their histories)',
      )
      .option('--force', 'overwrite an existing --out file')
      .option('--json', 'print what was written as JSON');
  },
  async run(args, options, context) {
    const id = args[0] as string | undefined;
    const at = options.at as string | undefined;
    const path = libraryPath(options.library, context.cwd);
    if (typeof options.bundle === 'string') {
      if (id !== undefined || options.all !== undefined)
        throw new BandshelfError('BAD_OPTION', 'give --bundle FILE alone (no entry id, no --all)', {
          field: 'bundle',
        });
      const library = openLibrary(path, { readonly: true });
      try {
        const bundle = exportBundle(library, { at });
        const bytes = writeBundleFile(bundle, resolve(context.cwd, options.bundle), {
          force: options.force === true,
          label: options.bundle,
        });
        const revisions = bundle.entries.reduce((n, e) => n + e.revisions.length, 0);
        const result = {
          bundle: options.bundle,
          bytes,
          entries: bundle.entries.length,
          revisions,
          releases: bundle.releases.length,
          assignments: bundle.assignments.length,
          digest: bundle.digest,
        };
        if (options.json) return { stdout: JSON.stringify(result), exitCode: 0 };
        return {
          stdout:
            `${result.entries} entries (${revisions} revisions), ${result.releases} releases and ` +
            `${result.assignments} assignment rows written to ${options.bundle} (${bytes} bytes)`,
          exitCode: 0,
        };
      } finally {
        closeLibrary(library);
      }
    }
    if (typeof options.all === 'string') {
      if (id !== undefined)
        throw new BandshelfError('BAD_OPTION', 'give an entry id or --all, not both', { field: 'all' });
      const library = openLibrary(path, { readonly: true });
      try {
        const dir = resolve(context.cwd, options.all);
        const result = exportAll(library, dir, { at, progress: context.progress });
        if (options.json) return { stdout: JSON.stringify({ dir: options.all, ...result }), exitCode: 0 };
        return {
          stdout: `${result.entries} entries, ${result.files.length} files written to ${options.all}`,
          exitCode: 0,
        };
      } finally {
        closeLibrary(library);
      }
    }
    if (id === undefined)
      throw new BandshelfError('BAD_OPTION', 'name an entry id (or use --all DIR)', { field: 'id' });
    if (typeof options.out !== 'string' || options.out === '') {
      throw new BandshelfError('BAD_OPTION', 'export needs --out FILE', { field: 'out' });
    }
    const format = formatOf(options, options.out);
    const form = String(options.form ?? 'difdup') as JcampForm;
    if (!FORMS.includes(form)) {
      throw new BandshelfError('BAD_OPTION', `--form must be one of ${FORMS.join(', ')}`, { field: 'form' });
    }
    const out = resolve(context.cwd, options.out);
    if (existsSync(out) && !options.force) {
      throw new BandshelfError('ALREADY_EXISTS', 'the file exists; add --force to overwrite it', {
        file: options.out,
      });
    }
    const library = openLibrary(path, { readonly: true });
    try {
      const view = readEntry(library, id, { at });
      const spectrum = options.processed
        ? processedSpectrum(gridAxis(view.grid), view.processed)
        : view.original;
      let text: string;
      if (format === 'csv') text = writeCsv(spectrum);
      else {
        const meta: Record<string, string | number | undefined> = {};
        for (const label of LABELS) {
          const v = view.meta[label];
          if (typeof v === 'string' || typeof v === 'number') meta[label] = v;
        }
        if (meta.origin === undefined) meta.origin = String(view.meta.contributor ?? 'bandshelf export');
        if (meta.owner === undefined) meta.owner = String(view.meta.contributor ?? view.meta.licence ?? '');
        const name = String(view.meta.name ?? id);
        text = writeJcampDx(spectrum, {
          form,
          title: options.processed ? `${name} (processed)` : name,
          meta,
        });
      }
      try {
        writeFileSync(out, text, { flag: options.force ? 'w' : 'wx' });
      } catch (error) {
        throw new BandshelfError('IO_ERROR', `cannot write: ${describeIoError(error, { writing: true })}`, {
          file: options.out,
          cause: error,
        });
      }
      const result = {
        id,
        revision: view.revision,
        format,
        file: options.out,
        points: spectrum.wavenumber.length,
      };
      if (options.json) return { stdout: JSON.stringify(result), exitCode: 0 };
      return {
        stdout: `${id} revision ${view.revision}: ${result.points} points written to ${options.out} (${format === 'jcamp' ? `JCAMP-DX ${form.toUpperCase()}` : 'CSV'})`,
        exitCode: 0,
      };
    } finally {
      closeLibrary(library);
    }
  },
};

// Reads one ingest job's files and sidecar and turns it into revision inputs: parsed original, merged and validated
// metadata (flags > --meta file > sidecar > manifest > the file's own labels), recipe and reading options.
import { basename, dirname, join } from 'node:path';
import { BandshelfError } from '../../error.js';
import { MAX_INPUT_BYTES } from '../../formats/types.js';
import { type EntryMetaPatch, entryMetaPatchSchema, entryMetaSchema } from '../../schema/meta.js';
import { metaErrorFromIssues } from '../../schema/metaErrorFromIssues.js';
import { type Recipe, timeDomainSchema } from '../../schema/recipe.js';
import { pinNoiseFloor } from '../../spectrum/trace/pinNoiseFloor.js';
import { readOriginals } from '../store/readOriginals.js';
import { readRegularFile } from '../store/readRegularFile.js';
import { readTextFile } from '../store/readTextFile.js';
import type { Library, ReadOptions, RevisionExtras } from '../types.js';
import type { RevisionInput, SourceFile } from './ingestTypes.js';
import { type LoadedSidecar, loadSidecar } from './loadSidecar.js';
import type { IngestJob } from './planIngest.js';

export interface BuildRevisionInputsOptions {
  /** Metadata from command-line flags (--id, --name, --class); highest precedence. */
  flags?: EntryMetaPatch;
  /** A `--meta FILE` sidecar applied to every file of the add, above each file's own sidecar. */
  metaFile?: { sections: LoadedSidecar; label: string };
  /** A `--recipe FILE` recipe, above any sidecar recipe and the library default. */
  recipe?: Recipe;
  /** Reading options from flags (--x-unit, --y-unit, --block, --column, --time-unit). */
  read?: ReadOptions;
  /** Largest data or trace file accepted, bytes.
   * @default MAX_INPUT_BYTES (200 MB) */
  maxBytes?: number;
}

const LABEL_FIELDS: Record<string, string> = {
  origin: 'origin',
  owner: 'owner',
  state: 'state',
  samplingProcedure: 'samplingProcedure',
  resolution: 'resolution',
  cas: 'cas',
  formula: 'formula',
};

/** A lowercase slug made from a file stem or title, shaped to pass the entry-id rule. */
function slugOf(text: string): string {
  const slug = text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9._-]+/g, '-')
    .replace(/\.{2,}/g, '.')
    .replace(/-{2,}/g, '-')
    .replace(/^[^a-z0-9]+/, '')
    .replace(/[-._]+$/, '')
    .slice(0, 80)
    .replace(/[-._]+$/, '');
  return slug === '' ? 'entry' : slug;
}

function stemOf(path: string): string {
  const base = basename(path);
  const dot = base.lastIndexOf('.');
  return dot > 0 ? base.slice(0, dot) : base;
}

function readBytes(path: string, label: string, maxBytes: number): Uint8Array {
  return readRegularFile(path, { label, maxFileBytes: maxBytes });
}

/** Labels the file carried, each kept only when valid on its own (a bad CAS in a file header is dropped, not fatal). */
function metaFromLabels(labels: Record<string, string | number>, warnings: RevisionExtras['warnings'] & {}) {
  const meta: Record<string, unknown> = {};
  const shape = entryMetaPatchSchema.shape as Record<
    string,
    { safeParse: (v: unknown) => { success: boolean; data?: unknown } }
  >;
  for (const [label, field] of Object.entries(LABEL_FIELDS)) {
    const value = labels[label];
    if (value === undefined) continue;
    const checked = shape[field]!.safeParse(value);
    if (checked.success) meta[field] = checked.data;
    else
      warnings.push({
        message: `the file's ${label} label ${JSON.stringify(value)} is not valid metadata; ignored`,
      });
  }
  if (typeof labels.title === 'string' && labels.title.trim() !== '') {
    const checked = shape.name!.safeParse(labels.title);
    if (checked.success) meta.name = checked.data;
  }
  return meta;
}

export function buildRevisionInputs(
  library: Library,
  job: IngestJob,
  options: BuildRevisionInputsOptions = {},
): RevisionInput[] {
  if (job.error) throw job.error;
  const maxBytes = options.maxBytes ?? MAX_INPUT_BYTES;
  const sidecarLabel =
    job.sidecarPath === undefined
      ? undefined
      : job.label.endsWith(basename(job.sidecarPath))
        ? job.label
        : join(dirname(job.label), basename(job.sidecarPath));
  let sidecar = job.sidecar;
  const sidecarWarnings: { message: string }[] = [];
  if (sidecar === undefined && job.sidecarPath !== undefined) {
    const label = sidecarLabel ?? job.label;
    const text = readTextFile(job.sidecarPath, {
      label,
      onWarning: (message) => sidecarWarnings.push({ message: `${label}: ${message}` }),
    });
    sidecar = loadSidecar(text, { file: label });
  }
  const timeDomain = job.samplePaths.length > 0;
  if (!timeDomain && sidecar?.timeDomain !== undefined) {
    throw new BandshelfError(
      'BAD_METADATA',
      'its sidecar describes a time-domain measurement; add the sidecar instead',
      {
        file: job.label,
        field: 'timeDomain',
      },
    );
  }

  // Recipe: --recipe > --meta file's recipe > sidecar recipe > library default.
  let recipe: Recipe =
    options.recipe ?? options.metaFile?.sections.recipe ?? sidecar?.recipe ?? library.recipe;
  const read: ReadOptions = { ...sidecar?.read, ...options.metaFile?.sections.read, ...options.read };
  if (timeDomain) {
    const step = pinNoiseFloor(recipe.timeDomain ?? library.recipe.timeDomain ?? timeDomainSchema.parse({}));
    recipe = { ...recipe, timeDomain: read.timeUnit ? { ...step, timeUnit: read.timeUnit } : step };
    delete read.xUnit;
    delete read.yUnit;
    delete read.block;
  } else {
    recipe = { ...recipe, timeDomain: null };
    delete read.timeUnit;
  }

  const files: SourceFile[] = timeDomain
    ? [
        ...job.samplePaths.map((p) => ({
          role: 'sample-trace' as const,
          name: basename(p),
          bytes: readBytes(p, basename(p), maxBytes),
        })),
        ...job.referencePaths.map((p) => ({
          role: 'reference-trace' as const,
          name: basename(p),
          bytes: readBytes(p, basename(p), maxBytes),
        })),
      ]
    : [{ role: 'data', name: basename(job.dataPath!), bytes: readBytes(job.dataPath!, job.label, maxBytes) }];
  const originals = readOriginals(
    { files, read, recipe },
    { label: job.label, maxBytes, gridStep: library.grid.step },
  );

  const given: Record<string, unknown> = {
    ...job.manifestMeta,
    ...sidecar?.meta,
    ...options.metaFile?.sections.meta,
    ...options.flags,
  };
  const several = originals.length > 1;
  if (several && given.id !== undefined) {
    throw new BandshelfError(
      'BAD_OPTION',
      `the file holds ${originals.length} spectra but its metadata names one id ('${String(given.id)}'); choose one with \`${originals[0]!.column === undefined ? 'block' : 'column'}\``,
      { file: job.label, field: 'id' },
    );
  }
  const stemSource = timeDomain ? (job.sidecarPath ?? job.samplePaths[0]!) : job.dataPath!;
  const stem = stemOf(stemSource).replace(/\.meta$/i, '');
  const ids = new Set<string>();
  return originals.map((o) => {
    const warnings = [...sidecarWarnings, ...(o.extras.warnings ?? [])];
    const fromLabels = metaFromLabels(o.labels, warnings);
    const merged: Record<string, unknown> = { ...fromLabels, ...given };
    if (merged.id === undefined) {
      const title = typeof o.labels.title === 'string' ? o.labels.title : undefined;
      // A column of a multi-column file is named by its header (`y2` … without one): the id is made from that name.
      let id = !several
        ? slugOf(stem)
        : o.column !== undefined
          ? slugOf(o.column)
          : title
            ? slugOf(title)
            : `${slugOf(stem)}-${o.block ?? 1}`;
      if (ids.has(id)) id = `${id}-${o.block ?? ids.size + 1}`;
      merged.id = id;
    }
    ids.add(String(merged.id));
    if (merged.name === undefined) {
      merged.name = !several
        ? stem
        : o.column !== undefined
          ? `${stem}: ${o.column}`
          : `${stem} (block ${o.block ?? 1})`;
    }
    const checked = entryMetaSchema.safeParse(merged);
    if (!checked.success) {
      const first = checked.error.issues[0]?.path[0];
      // Name the file the offending value came from, so the user knows which one to fix.
      const source =
        first !== undefined && options.flags && first in options.flags
          ? undefined
          : first !== undefined && options.metaFile && first in options.metaFile.sections.meta
            ? options.metaFile.label
            : first !== undefined && sidecar && first in sidecar.meta
              ? (sidecarLabel ?? job.label)
              : job.label;
      throw metaErrorFromIssues(checked.error.issues, { file: source ?? job.label });
    }
    const extras: RevisionExtras = { ...o.extras };
    if (warnings.length > 0) extras.warnings = warnings;
    else delete extras.warnings;
    const entryRead: ReadOptions = { ...read };
    if (several && o.block !== undefined) entryRead.block = o.block;
    if (several && o.column !== undefined) entryRead.column = o.column;
    return {
      label: job.label,
      files,
      read: entryRead,
      original: o.spectrum,
      ...(o.saturated === undefined ? {} : { saturated: o.saturated }),
      meta: checked.data as RevisionInput['meta'],
      recipe,
      extras,
    };
  });
}

// Turns the paths given to `add` into ingest jobs: which data or trace files make one entry, with which sidecar
// and manifest row. Only names and sidecars are read here; a job's problems surface when it runs.
import { existsSync, readdirSync, realpathSync, statSync } from 'node:fs';
import { basename, dirname, join, relative, resolve, sep } from 'node:path';
import { BandshelfError } from '../../error.js';
import { isSidecarName } from '../../formats/isSidecarName.js';
import { readManifest } from '../../formats/readManifest.js';
import { sidecarNameFor } from '../../formats/sidecarNameFor.js';
import type { EntryMetaPatch } from '../../schema/meta.js';
import { readTextFile } from '../store/readTextFile.js';
import { type LoadedSidecar, loadSidecar } from './loadSidecar.js';

/** One entry-producing unit of an `add` (a file may still hold several JCAMP-DX blocks). */
export interface IngestJob {
  /** The path as the user would write it (relative to the working directory where possible). */
  label: string;
  /** The spectrum file (absolute), for a spectrum job. */
  dataPath?: string;
  /** Sample and reference traces (absolute), for a time-domain job. */
  samplePaths: string[];
  referencePaths: string[];
  /** The sidecar that describes this job (absolute), when there is one. */
  sidecarPath?: string;
  /** The parsed sidecar, when planning already read it (time-domain sidecars). */
  sidecar?: LoadedSidecar;
  /** The manifest row for this file, when a manifest names it. */
  manifestMeta?: EntryMetaPatch;
  /** A problem found while planning; the job fails with it. */
  error?: BandshelfError;
}

export interface PlanIngestOptions {
  /** Relative paths are read against this folder.
   * @default process.cwd() */
  cwd?: string;
  /** A manifest CSV for the files (`--manifest`); its `file` column is relative to the manifest's folder.
   * @default undefined (a folder's own `manifest.csv` is used when present) */
  manifest?: string;
  /** The positional files are repeated sample traces of one time-domain entry (`--time-domain`).
   * @default false */
  timeDomain?: boolean;
  /** Reference traces for `--time-domain` (`--reference`, repeatable).
   * @default [] */
  references?: string[];
}

export interface IngestPlan {
  jobs: IngestJob[];
  /** Notes for the user (manifest rows naming no file …). */
  warnings: string[];
}

/** File name extensions `add DIR` takes as spectrum files; a file named explicitly is always taken. */
const SPECTRUM_EXTENSIONS = new Set([
  'jdx',
  'dx',
  'jcamp',
  'jcm',
  'csv',
  'tsv',
  'txt',
  'dat',
  'asc',
  'prn',
  'xy',
]);
const MANIFEST_NAME = 'manifest.csv';

function extensionOf(name: string): string {
  const dot = name.lastIndexOf('.');
  return dot > 0 ? name.slice(dot + 1).toLowerCase() : '';
}

/** Sub-folders with this name hold query spectra (unknowns to match), not references: `add DIR` leaves them out. */
const QUERY_FOLDER = 'unknowns';

/** A file or folder `add DIR` leaves out, and why. */
interface Skipped {
  path: string;
  reason: string;
}

/**
 * Every file under `dir`, depth first in name order. Hidden files and folders are skipped, and so are sub-folders
 * named `unknowns`. A symbolic link is followed once: to a file it is read under the link's name unless that file
 * is added already, to a folder it is walked unless it leads back to a folder being walked (a loop); a link to
 * nothing, and anything that is neither file nor folder (a pipe, a device), is skipped. Each skip is listed.
 */
function walk(
  dir: string,
  skipped: Skipped[],
  seen: Map<string, string> = new Map(),
  ancestors: Set<string> = new Set(),
): string[] {
  const out: string[] = [];
  const real = realpathSync(dir);
  const inside = new Set(ancestors).add(real);
  const names = readdirSync(dir, { withFileTypes: true })
    .filter((d) => !d.name.startsWith('.'))
    .sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  type Item = { name: string; full: string; target: string; link: boolean; isDir: boolean; isFile: boolean };
  const items: Item[] = [];
  for (const d of names) {
    const full = join(dir, d.name);
    if (!d.isSymbolicLink()) {
      const isDir = d.isDirectory();
      const isFile = d.isFile();
      const target = isDir || isFile ? realpathSync(full) : full;
      items.push({ name: d.name, full, target, link: false, isDir, isFile });
      continue;
    }
    try {
      const target = realpathSync(full);
      const st = statSync(target);
      items.push({ name: d.name, full, target, link: true, isDir: st.isDirectory(), isFile: st.isFile() });
    } catch {
      skipped.push({ path: full, reason: 'a symbolic link to nothing' });
    }
  }
  // What is really here first, then links to folders, then links to files: a link to something added anyway is
  // the one left out.
  const rank = (i: Item): number => (!i.link ? 0 : i.isDir ? 1 : 2);
  items.sort((p, q) => rank(p) - rank(q));
  for (const item of items) {
    const { full, target } = item;
    const first = seen.get(target);
    const again =
      first === undefined
        ? ''
        : `the same ${item.isDir ? 'folder' : 'file'} as ${relative(dir, first)}, which is added already`;
    if (item.isDir) {
      if (item.link && inside.has(target)) {
        skipped.push({ path: full, reason: 'a symbolic link back to a folder it is in (a loop)' });
      } else if (item.name.toLowerCase() === QUERY_FOLDER) {
        skipped.push({ path: full, reason: 'a folder of unknowns to match, not references' });
      } else if (first !== undefined) {
        skipped.push({ path: full, reason: `${item.link ? 'a symbolic link to ' : ''}${again}` });
      } else {
        seen.set(target, full);
        out.push(...walk(full, skipped, seen, inside));
      }
    } else if (item.isFile) {
      if (first !== undefined) {
        skipped.push({ path: full, reason: `${item.link ? 'a symbolic link to ' : ''}${again}` });
        continue;
      }
      seen.set(target, full);
      out.push(full);
    } else {
      skipped.push({ path: full, reason: 'not a regular file (a pipe, socket or device)' });
    }
  }
  return out;
}

export function planIngest(paths: readonly string[], options: PlanIngestOptions = {}): IngestPlan {
  const cwd = options.cwd ?? process.cwd();
  const labelOf = (abs: string): string => {
    const rel = relative(cwd, abs);
    return rel === '' || rel.startsWith(`..${sep}`) || rel === '..' ? abs : rel;
  };
  const warnings: string[] = [];
  if (paths.length === 0) throw new BandshelfError('BAD_OPTION', 'name at least one file or folder to add');

  // Manifests: the one given, and any folder's own manifest.csv; each maps files relative to its folder.
  const manifests: { dir: string; rows: Map<string, EntryMetaPatch>; used: Set<string>; label: string }[] =
    [];
  const loadManifest = (abs: string) => {
    const label = labelOf(abs);
    if (!existsSync(abs))
      throw new BandshelfError('IO_ERROR', 'the manifest does not exist', { file: label });
    manifests.push({
      dir: dirname(abs),
      rows: readManifest(
        readTextFile(abs, { label, onWarning: (message) => warnings.push(`${label}: ${message}`) }),
        { file: label },
      ),
      used: new Set(),
      label,
    });
  };
  const manifestPath = options.manifest === undefined ? undefined : resolve(cwd, options.manifest);
  if (manifestPath !== undefined) loadManifest(manifestPath);
  const manifestMetaFor = (abs: string): EntryMetaPatch | undefined => {
    for (const m of manifests) {
      const rel = relative(m.dir, abs).split(sep).join('/');
      for (const key of [rel, `./${rel}`, basename(abs)]) {
        const meta = m.rows.get(key);
        if (meta !== undefined) {
          m.used.add(key);
          return meta;
        }
      }
    }
    return undefined;
  };

  const jobs: IngestJob[] = [];
  const exists = (abs: string, label: string) => {
    if (!existsSync(abs)) throw new BandshelfError('IO_ERROR', 'no such file or folder', { file: label });
  };

  if (options.timeDomain) {
    const samples = paths.map((p) => resolve(cwd, p));
    const references = (options.references ?? []).map((p) => resolve(cwd, p));
    for (const abs of [...samples, ...references]) {
      exists(abs, labelOf(abs));
      if (statSync(abs).isDirectory()) {
        throw new BandshelfError('BAD_OPTION', 'with `timeDomain` name trace files, not folders', {
          file: labelOf(abs),
        });
      }
    }
    if (references.length === 0) {
      throw new BandshelfError('BAD_OPTION', '`timeDomain` needs at least one trace file in `references`', {
        field: 'reference',
      });
    }
    const first = samples[0]!;
    const sidecar = sidecarNameFor(first);
    const job: IngestJob = { label: labelOf(first), samplePaths: samples, referencePaths: references };
    if (existsSync(sidecar)) job.sidecarPath = sidecar;
    const meta = manifestMetaFor(first);
    if (meta) job.manifestMeta = meta;
    return { jobs: [job], warnings };
  }
  if ((options.references ?? []).length > 0) {
    throw new BandshelfError('BAD_OPTION', '`references` go with `timeDomain`', { field: 'reference' });
  }

  const consumed = new Set<string>();
  const candidates: { abs: string; explicit: boolean }[] = [];
  for (const p of paths) {
    const abs = resolve(cwd, p);
    exists(abs, labelOf(abs));
    if (!statSync(abs).isDirectory()) {
      candidates.push({ abs, explicit: true });
      continue;
    }
    const skipped: Skipped[] = [];
    const files = walk(abs, skipped);
    for (const { path, reason } of skipped) warnings.push(`${labelOf(path)}: skipped (${reason})`);
    if (manifestPath === undefined) {
      for (const f of files) {
        if (basename(f).toLowerCase() === MANIFEST_NAME && dirname(f) === abs) loadManifest(f);
      }
    }
    for (const f of files) {
      if (basename(f).toLowerCase() === MANIFEST_NAME || f === manifestPath) continue;
      if (isSidecarName(f)) {
        candidates.push({ abs: f, explicit: false });
        continue;
      }
      if (SPECTRUM_EXTENSIONS.has(extensionOf(f))) candidates.push({ abs: f, explicit: false });
    }
  }

  // Time-domain sidecars first: the trace files they name belong to them and are not spectra of their own.
  const dataFiles: { abs: string; explicit: boolean }[] = [];
  for (const c of candidates) {
    if (!isSidecarName(c.abs)) {
      dataFiles.push(c);
      continue;
    }
    const label = labelOf(c.abs);
    let sidecar: LoadedSidecar;
    try {
      sidecar = loadSidecar(
        readTextFile(c.abs, { label, onWarning: (message) => warnings.push(`${label}: ${message}`) }),
        { file: label },
      );
    } catch (error) {
      // A broken sidecar beside a data file is reported once, by that file's job.
      const twinExists = candidates.some((d) => !isSidecarName(d.abs) && sidecarNameFor(d.abs) === c.abs);
      if (!twinExists || c.explicit) {
        jobs.push({ label, samplePaths: [], referencePaths: [], error: error as BandshelfError });
      }
      continue;
    }
    if (sidecar.timeDomain === undefined) {
      const twinExists = candidates.some((d) => !isSidecarName(d.abs) && sidecarNameFor(d.abs) === c.abs);
      if (!twinExists && !c.explicit)
        warnings.push(`${label}: no spectrum file bandshelf reads sits beside this sidecar; skipped`);
      if (c.explicit) {
        jobs.push({
          label,
          samplePaths: [],
          referencePaths: [],
          error: new BandshelfError('BAD_OPTION', 'this is a sidecar, not a spectrum; add its data file', {
            file: label,
          }),
        });
      }
      continue;
    }
    const dir = dirname(c.abs);
    const samplePaths = sidecar.timeDomain.sample.map((s) => resolve(dir, s));
    const referencePaths = sidecar.timeDomain.reference.map((s) => resolve(dir, s));
    for (const t of [...samplePaths, ...referencePaths]) consumed.add(t);
    const job: IngestJob = { label, samplePaths, referencePaths, sidecarPath: c.abs, sidecar };
    const missing = [...samplePaths, ...referencePaths].find((t) => !existsSync(t));
    if (missing !== undefined) {
      job.error = new BandshelfError(
        'IO_ERROR',
        `the trace file ${labelOf(missing)} it names does not exist`,
        {
          file: label,
          field: 'timeDomain',
        },
      );
    }
    const meta = manifestMetaFor(c.abs);
    if (meta) job.manifestMeta = meta;
    jobs.push(job);
  }
  for (const d of dataFiles) {
    if (consumed.has(d.abs)) continue;
    const job: IngestJob = { label: labelOf(d.abs), dataPath: d.abs, samplePaths: [], referencePaths: [] };
    const sidecar = sidecarNameFor(d.abs);
    if (existsSync(sidecar)) job.sidecarPath = sidecar;
    const meta = manifestMetaFor(d.abs);
    if (meta) job.manifestMeta = meta;
    jobs.push(job);
  }
  for (const m of manifests) {
    for (const key of m.rows.keys()) {
      if (!m.used.has(key)) warnings.push(`${m.label}: names ${key}, which is not among the files added`);
    }
  }
  return { jobs, warnings };
}

// Builds the static site: entry downloads, the search index, the matcher's binary matrix, the Eleventy pages and
// the copied scripts and styles, then records what it wrote so a later build knows its own files.
import { createHash } from 'node:crypto';
import {
  copyFileSync,
  existsSync,
  linkSync,
  mkdirSync,
  readdirSync,
  readFileSync,
  realpathSync,
  renameSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import { basename, dirname, join, relative, resolve } from 'node:path';
import { BandshelfError } from '../error.js';
import { canonicalJson } from '../library/store/canonicalJson.js';
import { BAND_TOLERANCE_CM1 } from '../match/types.js';
import { buildManifestPath } from './buildManifestPath.js';
import { buildSearchIndex, type SearchIndexEntry } from './buildSearchIndex.js';
import { contrastPage } from './contrastPage.js';
import { copySiteAssets } from './copySiteAssets.js';
import { dataScript } from './dataScript.js';
import { encodeSearchMatrix } from './encodeSearchMatrix.js';
import { entryJson } from './entryJson.js';
import { entryMarks } from './entryMarks.js';
import { entryPage } from './entryPage.js';
import { findPackageRoot } from './findPackageRoot.js';
import { float32Bytes } from './float32Bytes.js';
import { jsonForScript } from './jsonForScript.js';
import { prepareOutDir } from './prepareOutDir.js';
import { type BuildManifest, readBuildManifest } from './readBuildManifest.js';
import { redactReport } from './redactReport.js';
import { reportPage } from './reportPage.js';
import { siteEleventyPlugin } from './siteEleventyPlugin.js';
import { siteView } from './siteView.js';
import type { EntryPage, SiteContrast, SiteReport, SiteSource } from './types.js';
import { writeBuildManifest } from './writeBuildManifest.js';

export interface BuildSiteOptions {
  /** The output folder. */
  out: string;
  /** Path prefix the site is served under, e.g. `/spectra/`.
   * @default '/' */
  base?: string;
  /** Empty an output folder that holds files an earlier build did not make.
   * @default false */
  clean?: boolean;
  /** Validated match reports to publish.
   * @default [] */
  reports?: SiteReport[];
  /** Validated contrast reports to publish, each on a page of its own under contrasts/.
   * @default [] */
  contrasts?: SiteContrast[];
  /** Withhold the unknowns' file names and titles from the published reports: each is named by its SHA-256.
   * @default false */
  redact?: boolean;
  /** Paths the output folder must not contain (the library file).
   * @default [] */
  protect?: string[];
  /** The working directory (relative paths, and --clean never empties it).
   * @default process.cwd() */
  cwd?: string;
  /**
   * Reuse what the previous build in `out` made for entries whose inputs are unchanged: their files are hard-linked
   * (copied where links are refused) into the new site instead of being made and written again, and their pages are
   * not rendered. The output is byte for byte what a build without reuse writes.
   * @default true
   */
  reuse?: boolean;
  /** Called as entries are written.
   * @default no-op */
  progress?: (done: number, total: number, label: string) => void;
  /** Printed in the footer and the generator meta tag.
   * @default 'bandshelf' */
  version?: string;
  /** The caution every page carries. */
  caution: string;
}

export interface BuiltSite {
  out: string;
  files: number;
  bytes: number;
  entries: number;
  /** Entries whose files were taken over from the previous build unchanged. */
  reused: number;
  reports: number;
  pathPrefix: string;
}

/** `/`, `/spectra/`, `/a/b/`: leading and trailing slash added when missing; only plain path segments. */
function pathPrefixOf(base: string | undefined): string {
  const raw = (base ?? '/').trim();
  const withSlashes = `/${raw}/`.replace(/\/{2,}/g, '/');
  const segments = withSlashes.split('/').filter((s) => s !== '');
  if (segments.some((s) => !/^[A-Za-z0-9._~-]+$/.test(s) || s === '.' || s === '..')) {
    throw new BandshelfError(
      'BAD_OPTION',
      `'${raw}' is not a path prefix: use letters, digits, '-', '_', '.', '~' between slashes, e.g. /spectra/`,
      { field: '--base' },
    );
  }
  return withSlashes;
}

/** Entry ids are slugs already; anything outside the safe set still becomes a safe, unique path segment. */
function slugFor(id: string, taken: Set<string>): string {
  let slug =
    /^[A-Za-z0-9][A-Za-z0-9._~-]*$/.test(id) && !id.includes('..') ? id : id.replace(/[^A-Za-z0-9_-]/g, '_');
  if (slug === '' || slug.startsWith('.')) slug = `_${slug}`;
  let unique = slug;
  for (let n = 2; taken.has(unique); n++) unique = `${slug}-${n}`;
  taken.add(unique);
  return unique;
}

/** Eleventy wraps errors thrown inside plugins and templates; find ours, or the first message that says something. */
function unwrapError(error: unknown): BandshelfError {
  let e: unknown = error;
  const messages: string[] = [];
  for (let depth = 0; e && depth < 10; depth++) {
    if (e instanceof BandshelfError) return e;
    if (e instanceof Error) {
      messages.push(e.message);
      e = (e as { cause?: unknown }).cause ?? (e as { originalError?: unknown }).originalError;
    } else break;
  }
  return new BandshelfError('IO_ERROR', `the site templates failed: ${messages.at(-1) ?? String(error)}`);
}

export async function buildSite(source: SiteSource, options: BuildSiteOptions): Promise<BuiltSite> {
  const pathPrefix = pathPrefixOf(options.base);
  const cwd = resolve(options.cwd ?? process.cwd());
  const out = resolve(cwd, options.out);
  const root = findPackageRoot(import.meta.url);
  const templates = join(root, 'site');
  // Everything that can be missing is checked before the output folder is touched.
  copySiteAssets(root, out, { checkOnly: true });
  prepareOutDir(out, {
    clean: options.clean,
    protect: [...(options.protect ?? []), templates, root],
    cwd,
    checkOnly: true,
  });
  // The new site is written beside the old one and swapped in only when complete, so a build that fails or is
  // killed half-way leaves the old site as it was. Links are resolved so the swap replaces the real folder.
  const target = existsSync(out) ? realpathSync(out) : out;
  const building = join(dirname(target), `.${basename(target)}.bandshelf-building`);
  const retired = join(dirname(target), `.${basename(target)}.bandshelf-old`);
  // Leftovers of a killed build carry our marker; anything else by those names is not ours to remove.
  for (const stale of [building, retired]) {
    if (existsSync(stale)) {
      if (!existsSync(join(stale, BUILDING_MARKER)) && !existsSync(buildManifestPath(stale))) {
        throw new BandshelfError('OUT_NOT_EMPTY', `${stale} is in the way and was not made by bandshelf`, {
          file: stale,
          field: '--out',
        });
      }
      rmSync(stale, { recursive: true, force: true });
    }
  }
  mkdirSync(building, { recursive: true });
  writeFileSync(join(building, BUILDING_MARKER), '');
  const manifest = options.reuse !== false && existsSync(target) ? readBuildManifest(target) : undefined;
  const previous = manifest === undefined ? undefined : { dir: target, manifest };
  let built: BuiltSite;
  try {
    built = await writeSite(source, options, { out: building, root, templates, pathPrefix, previous });
  } catch (error) {
    rmSync(building, { recursive: true, force: true });
    throw error;
  }
  rmSync(join(building, BUILDING_MARKER), { force: true });
  const hadOld = existsSync(target);
  if (hadOld) renameSync(target, retired);
  renameSync(building, target);
  if (hadOld) rmSync(retired, { recursive: true, force: true });
  return { ...built, out };
}

const sha256Hex = (text: string): string => createHash('sha256').update(text).digest('hex');

/** The templates' names and bytes (every page is rendered from them). */
function templatesHash(templates: string): string {
  const hash = createHash('sha256');
  const walk = (dir: string): void => {
    for (const name of readdirSync(dir).sort()) {
      const full = join(dir, name);
      if (statSync(full).isDirectory()) walk(full);
      else if (name.endsWith('.njk'))
        hash.update(`${relative(templates, full)}\n`).update(readFileSync(full));
    }
  };
  walk(templates);
  return hash.digest('hex');
}

/** Written first into a folder being built, so a later build knows a leftover of a killed one as its own. */
const BUILDING_MARKER = '.bandshelf-building';

async function writeSite(
  source: SiteSource,
  options: BuildSiteOptions,
  where: {
    out: string;
    root: string;
    templates: string;
    pathPrefix: string;
    previous: { dir: string; manifest: BuildManifest } | undefined;
  },
): Promise<BuiltSite> {
  const { out, root, templates, pathPrefix, previous } = where;
  const made = new Set<string>();
  const folderOf = (path: string): string => {
    const full = join(out, path);
    const folder = dirname(full);
    if (!made.has(folder)) {
      mkdirSync(folder, { recursive: true });
      made.add(folder);
    }
    return full;
  };
  const write = (path: string, content: string | Uint8Array): number => {
    writeFileSync(folderOf(path), content);
    return typeof content === 'string' ? Buffer.byteLength(content) : content.byteLength;
  };
  /** A file of the previous build taken over as it is: a hard link (the old site stays whole until the swap). */
  const link = (from: string, path: string): void => {
    const to = folderOf(path);
    try {
      linkSync(from, to);
    } catch {
      copyFileSync(from, to);
    }
  };

  const taken = new Set<string>();
  const slugs = new Map(source.entries.map((e) => [e.id, slugFor(e.id, taken)]));
  const searchEntries: SearchIndexEntry[] = [];
  // Entries processed with a recipe of their own: a hit on one is marked, on report pages and in the matcher.
  const libraryRecipe = canonicalJson(source.recipe);
  const ownRecipe = new Set<string>();
  const total = source.entries.length;
  // What every entry page is also made from besides its entry: the site's name, caution, version and grid, and the
  // templates. An entry whose key is the previous build's has its files linked from there, not made again.
  const siteKey = sha256Hex(
    canonicalJson({
      name: source.name,
      version: options.version ?? 'bandshelf',
      caution: options.caution,
      grid: source.grid,
      templates: templatesHash(templates),
    }),
  );
  const known: Record<string, string> = {};
  const entryKeys: Record<string, string> = {};
  const toRender: EntryPage[] = [];
  let reused = 0;
  for (const [i, summary] of source.entries.entries()) {
    const slug = slugs.get(summary.id)!;
    const detail = source.loadEntry(summary.id);
    if (canonicalJson(detail.recipe) !== libraryRecipe) ownRecipe.add(summary.id);
    const folder = `entries/${slug}/`;
    const processed = float32Bytes(detail.processed);
    const json = entryJson(detail, { processedFile: `${slug}.processed.f32` });
    const page = entryPage(detail, {
      assignments: source.assignments,
      dataBytes: Buffer.byteLength(json),
      processedBytes: processed.byteLength,
      slug,
    });
    const key = createHash('sha256')
      .update(siteKey)
      .update(canonicalJson(page))
      .update(json)
      .update(processed)
      .digest('hex');
    entryKeys[folder] = key;
    const files = ['index.html', `${slug}.json`, `${slug}.processed.f32`, `${slug}.data.js`].map(
      (f) => `${folder}${f}`,
    );
    if (
      previous !== undefined &&
      previous.manifest.entries?.[folder] === key &&
      files.every((f) => previous.manifest.files[f] !== undefined)
    ) {
      for (const f of files) {
        link(join(previous.dir, f), f);
        known[f] = previous.manifest.files[f]!;
      }
      reused++;
    } else {
      write(`${folder}${slug}.processed.f32`, processed);
      write(`${folder}${slug}.json`, json);
      // The page reads the same data from a script file, which a browser loads from disk too (fetch it refuses).
      write(
        `${folder}${slug}.data.js`,
        dataScript(`entry:${slug}`, null, {
          json: `{"document":${json.trim()},"processed":${JSON.stringify(Buffer.from(processed).toString('base64'))}}`,
        }),
      );
      toRender.push(page);
    }
    searchEntries.push({
      summary: detail.summary,
      path: folder,
      peakPositions: detail.peaks.map((p) => p.position),
    });
    options.progress?.(i + 1, total, summary.id);
  }

  const summaries = new Map(source.entries.map((e) => [e.id, e]));
  const searchIndex = buildSearchIndex(searchEntries, { assignments: source.assignments });
  write('assets/search-index.json', searchIndex);
  write('assets/search-index.js', dataScript('search-index', null, { json: searchIndex }));
  const matrixBytes = encodeSearchMatrix(source.matrix);
  write('assets/search-matrix.bin', matrixBytes);
  const matrixMeta = `${jsonForScript({
    format: 'bandshelf-search-matrix',
    version: 1,
    rows: source.matrix.rows,
    cols: source.matrix.cols,
    grid: source.grid,
    recipe: source.recipe,
    stateKey: source.stateKey,
    at: source.at,
    name: source.name,
    peaks: {
      entry: Array.from(source.matrix.peaks.entry),
      position: Array.from(source.matrix.peaks.position),
      height: Array.from(source.matrix.peaks.height),
      prominence: Array.from(source.matrix.peaks.prominence),
    },
    assignments: source.matrix.assignments,
    wrongHitNull: source.matrix.wrongHitNull,
    entries: source.matrix.ids.map((id, i) => {
      const summary = summaries.get(id);
      return {
        id,
        revision: source.matrix.revisions[i],
        hash: source.matrix.hashes[i],
        name: summary?.name ?? id,
        class: summary?.class ?? 'other',
        path: slugs.has(id) ? `entries/${slugs.get(id)}/` : null,
        reviewState: summary?.reviewState ?? 'reviewed',
        ownRecipe: ownRecipe.has(id),
      };
    }),
    references: Object.fromEntries(
      Object.entries(source.references).map(([id, s]) => [
        id,
        { wavenumber: Array.from(s.wavenumber), absorbance: Array.from(s.absorbance) },
      ]),
    ),
  })}\n`;
  write('assets/search-matrix.json', matrixMeta);
  // The same metadata and matrix as one script file, for a page opened from disk (fetch is refused there).
  write(
    'assets/search-matrix.js',
    dataScript('search-matrix', null, {
      json: `{"meta":${matrixMeta.trim()},"matrix":${JSON.stringify(Buffer.from(matrixBytes).toString('base64'))}}`,
    }),
  );

  // The band search of the search page: the same peaks and entry rows `bandshelf bands` indexes, as a script file.
  write(
    'assets/band-index.js',
    dataScript('band-index', {
      grid: source.grid,
      tolerance: BAND_TOLERANCE_CM1,
      entries: source.matrix.ids.map((id, i) => {
        const summary = summaries.get(id);
        return {
          id,
          revision: source.matrix.revisions[i],
          name: summary?.name ?? id,
          class: summary?.class ?? 'other',
          path: slugs.has(id) ? `entries/${slugs.get(id)}/` : null,
        };
      }),
      peaks: {
        entry: Array.from(source.matrix.peaks.entry),
        position: Array.from(source.matrix.peaks.position),
        height: Array.from(source.matrix.peaks.height),
      },
    }),
  );

  const rowOf = new Map(source.matrix.ids.map((id, i) => [id, i]));
  const vector = (id: string, revision: number): Float32Array | undefined => {
    const row = rowOf.get(id);
    if (row === undefined || source.matrix.revisions[row] !== revision) return undefined;
    return source.matrix.processed.subarray(row * source.matrix.cols, (row + 1) * source.matrix.cols);
  };
  const reportTaken = new Set<string>();
  const published = (options.reports ?? []).map((r) => (options.redact ? redactReport(r) : r));
  const reportPages = published.map((r) => {
    const slug = slugFor(r.slug, reportTaken);
    // The report as published (redacted where asked), beside its page, for the page's download link.
    const jsonBytes = write(`reports/${slug}/${slug}.json`, `${JSON.stringify(r.report, null, 2)}\n`);
    const marks = (id: string): string[] =>
      entryMarks({ reviewState: summaries.get(id)?.reviewState, ownRecipe: ownRecipe.has(id) });
    return reportPage(r, { slugs, slug, vector, jsonBytes, marks });
  });
  const contrastTaken = new Set<string>();
  const contrastPages = (options.contrasts ?? []).map((c) => {
    const slug = slugFor(c.slug, contrastTaken);
    // Redacted: each spectrum is named by its file's SHA-256 (a file name can carry a patient or study code).
    const report = options.redact
      ? { ...c.report, spectra: c.report.spectra.map((s) => ({ ...s, file: s.hash })) }
      : c.report;
    write(`contrasts/${slug}/${slug}.json`, `${JSON.stringify(report, null, 2)}\n`);
    return contrastPage({ ...c, report }, { slug });
  });
  const view = siteView(source, {
    entryPages: toRender,
    reportPages,
    contrastPages,
    slugs,
    version: options.version,
    caution: options.caution,
  });

  const { Eleventy } = await import('@11ty/eleventy');
  const eleventy = new Eleventy(templates, out, {
    quietMode: true,
    configPath: false,
    pathPrefix,
    config(config) {
      config.addPlugin(siteEleventyPlugin, { view });
    },
  });
  eleventy.disableLogger();
  try {
    await eleventy.write();
  } catch (error) {
    throw unwrapError(error);
  }
  copySiteAssets(root, out);

  const { files, bytes } = writeBuildManifest(out, { known, entries: entryKeys });
  return { out, files, bytes, entries: total, reused, reports: reportPages.length, pathPrefix };
}

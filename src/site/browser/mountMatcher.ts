// The in-browser matcher page: loads the published data, takes a dropped or chosen file with the page's settings,
// runs the one match pipeline (in a Web Worker where the browser allows one) and shows the whole report with the
// report pages' own renderer and plots.

import type { XUnit, YUnit } from '../../formats/types.js';
import { rangeFromText } from '../../match/rangeFromText.js';
import type { Metric } from '../../match/searchTypes.js';
import { entryMarks } from '../entryMarks.js';
import { formatNumber } from '../formatNumber.js';
import { reportBodyHtml } from '../reportBodyHtml.js';
import { reportPage } from '../reportPage.js';
import { loadPublishedSet, type PublishedData } from './loadPublishedSet.js';
import { matchErrorText } from './matchErrorText.js';
import { type FileMatch, matchSpectrumFile } from './matchSpectrumFile.js';
import { mountReportPlots } from './mountReportPlots.js';
import { pageHref } from './pageHref.js';
import { siteData } from './siteData.js';
import { type MatchWorker, startMatchWorker } from './startMatchWorker.js';
import type { PublishedEntryRow, WorkerMatch, WorkerMatchOptions } from './workerMessages.js';

export interface MountMatcherOptions {
  /** Hits listed.
   * @default 10 */
  k?: number;
  /** Try to run the matching in a Web Worker (false: always on the page's thread).
   * @default true */
  worker?: boolean;
}

/** The settings form as match options; a malformed range throws the BandshelfError the CLI's --range would. */
function settingsOf(form: HTMLFormElement | null, k: number): WorkerMatchOptions {
  if (!form) return { k };
  const data = new FormData(form);
  const text = (name: string): string => String(data.get(name) ?? '').trim();
  const ranges = text('ranges')
    .split(/[,;]/)
    .map((s) => s.trim())
    .filter((s) => s !== '')
    .map((s) => rangeFromText(s, { label: 'a scoring range' }));
  const read: WorkerMatchOptions['read'] = {};
  if (text('xUnit') !== '') read.xUnit = text('xUnit') as XUnit;
  if (text('yUnit') !== '') read.yUnit = text('yUnit') as YUnit;
  if (text('block') !== '') read.block = Number(text('block'));
  const column = text('column');
  if (column !== '') read.column = /^\d+$/.test(column) ? Number(column) : column;
  return {
    k,
    ranges,
    metric: (text('metric') || 'pearson') as Metric,
    mixture: data.get('mixture') !== null,
    excludeClass: data.getAll('excludeClass').map(String),
    read,
  };
}

/** Who matches: the worker (the page holds only the entry list) or the page itself (holding the whole set). */
type Engine =
  | { worker: MatchWorker; entries: PublishedEntryRow[] }
  | { data: PublishedData; entries: PublishedEntryRow[] };

/** A hit's processed vector: sent with the worker's result, or read from the page's own matrix. */
function vectorsOf(result: FileMatch, matcher: Engine): (id: string) => Float32Array | undefined {
  if ('worker' in matcher) return (id) => (result as WorkerMatch).vectors?.[id];
  const { set } = matcher.data;
  const rowOf = new Map(set.entries.map((e, i) => [e.id, i]));
  const cols = set.processed.length / Math.max(1, set.entries.length);
  return (id) => {
    const row = rowOf.get(id);
    return row === undefined ? undefined : set.processed.subarray(row * cols, (row + 1) * cols);
  };
}

/** Where the worker script and data scripts are, as absolute URLs (a worker resolves against its own URL). */
function absolute(doc: Document, relative: string): string {
  return new URL(relative, doc.location.href).href;
}

export function mountMatcher(doc: Document, options: MountMatcherOptions = {}): void {
  const zone = doc.getElementById('match-drop');
  const input = doc.getElementById('match-file') as HTMLInputElement | null;
  const status = doc.getElementById('match-status');
  const engine = doc.getElementById('match-engine');
  const target = doc.getElementById('match-report');
  const form = doc.getElementById('match-options') as HTMLFormElement | null;
  const overlay = doc.getElementById('match-overlay') as HTMLSelectElement | null;
  const references = doc.getElementById('match-reference') as HTMLInputElement | null;
  const base = doc.body.dataset.base ?? '/';
  if (!zone || !input || !status || !target) return;
  const k = options.k ?? 10;
  const files = {
    script: zone.dataset.script ?? `${base}assets/search-matrix.js`,
    binary: zone.dataset.binary ?? `${base}assets/search-matrix.bin`,
    json: zone.dataset.json ?? `${base}assets/search-matrix.json`,
  };
  // Served over http the binary matrix is fetched as it is; from file://, where browsers refuse fetch, the data
  // script (the same matrix in base64) is loaded with a <script> tag.
  const served = /^https?:$/.test(doc.location.protocol);
  const note = (text: string): void => {
    if (engine) engine.textContent = text;
  };
  /** The page loads the set only when it matches itself; beside a worker it holds just the entry list. */
  const onPage = (): Promise<Engine> =>
    loadPublishedSet(files, { load: (src, key) => siteData(src, key, { doc }), base, fetch: served }).then(
      (data) => ({ data, entries: data.set.entries }),
    );
  let ready: Promise<Engine>;
  const workerSource = zone.dataset.workerSource;
  if (options.worker !== false && typeof Worker === 'function' && workerSource) {
    const load = (src: string, key: string) => siteData<never>(src, key, { doc });
    ready = siteData<string>(workerSource, 'worker-source', { doc })
      .then((source) =>
        startMatchWorker(source, {
          files: {
            script: absolute(doc, files.script),
            binary: absolute(doc, files.binary),
            json: absolute(doc, files.json),
          },
          base: absolute(doc, base),
          fetch: served,
          load,
        }),
      )
      .then(
        (w): Engine => {
          note('Matching runs in a background worker: the page stays responsive.');
          zone.dataset.engine = 'worker';
          return { worker: w, entries: w.entries };
        },
        (error: unknown) => {
          note(
            'This browser refused the background worker, so matching runs on the page itself: the page may ' +
              'pause while a file is matched.',
          );
          if (engine) engine.title = error instanceof Error ? error.message : String(error);
          zone.dataset.engine = 'page';
          return onPage();
        },
      );
  } else {
    note('Matching runs on the page itself: the page may pause while a file is matched.');
    zone.dataset.engine = 'page';
    ready = onPage();
  }
  ready.then(
    ({ entries }) => {
      status.textContent = `Ready: ${entries.length} reference spectra loaded.`;
      zone.dataset.ready = 'true';
    },
    (error: unknown) => {
      status.textContent = `The reference vectors could not be loaded (${error instanceof Error ? error.message : String(error)}).`;
    },
  );

  let last: { file: File; result: FileMatch; engine: Engine } | undefined;
  let lastFile: File | undefined;
  let lastMore: readonly File[] = [];
  let jsonUrl = '';

  /** The report through the report pages' renderer, its plots drawn as there. */
  const render = (result: FileMatch, matcher: Engine): void => {
    const { entries } = matcher;
    const slugs = new Map(
      entries.filter((e) => e.path).map((e) => [e.id, e.path!.replace(/\/$/, '').split('/').pop() ?? '']),
    );
    const byId = new Map(entries.map((e) => [e.id, e]));
    const vectorOf = vectorsOf(result, matcher);
    const json = `${JSON.stringify(result.report, null, 2)}\n`;
    if (jsonUrl) URL.revokeObjectURL(jsonUrl);
    jsonUrl = URL.createObjectURL(new Blob([json], { type: 'application/json' }));
    const chosen = overlay?.value ?? '';
    const page = reportPage(
      { slug: 'match', file: result.report.query.file, report: result.report },
      {
        slugs,
        slug: 'match',
        jsonBytes: json.length,
        vector: (id, revision) => (byId.get(id)?.revision === revision ? vectorOf(id) : undefined),
        marks: (id) => {
          const e = byId.get(id);
          return entryMarks({ reviewState: e?.reviewState, ownRecipe: e?.ownRecipe });
        },
        ...(chosen === '' ? {} : { overlayIds: chosen === 'none' ? [] : [chosen] }),
      },
    );
    target.innerHTML = reportBodyHtml(page, {
      href: (path) => pageHref(doc, path, { base }),
      heading: false,
      jsonHref: jsonUrl,
    });
    mountReportPlots(doc);
  };

  /** The overlay chooser: the top three hits (as the report pages draw), one hit, or none (the fit plot stays). */
  const fillOverlay = (result: FileMatch): void => {
    if (!overlay) return;
    const keep = overlay.value;
    overlay.replaceChildren();
    const add = (value: string, text: string): void => {
      const option = doc.createElement('option');
      option.value = value;
      option.textContent = text;
      overlay.append(option);
    };
    add('', 'the top three hits');
    for (const h of result.report.hits) add(h.id, `${h.rank}. ${h.name || h.id}`);
    add('none', 'no hit (the unknown alone)');
    overlay.value = Array.from(overlay.options).some((o) => o.value === keep) ? keep : '';
    overlay.closest('label')?.removeAttribute('hidden');
  };

  /** With reference traces chosen, the file (and any further dropped files) are sample traces, as `--time-domain`. */
  const timeDomainOf = async (more: readonly File[]): Promise<WorkerMatchOptions['timeDomain']> => {
    const chosen = Array.from(references?.files ?? []);
    if (chosen.length === 0) return undefined;
    const bytesOf = async (f: File) => ({ name: f.name, bytes: new Uint8Array(await f.arrayBuffer()) });
    const unit = form ? String(new FormData(form).get('timeUnit') ?? '') : '';
    return {
      references: await Promise.all(chosen.map(bytesOf)),
      samples: await Promise.all(more.map(bytesOf)),
      ...(unit === 'fs' || unit === 'ps' ? { timeUnit: unit } : {}),
    };
  };

  // A newer drop or settings change supersedes a match still running: only the latest request's result is shown
  // (the worker answers in its own order).
  let latest = 0;
  const show = async (file: File, more: readonly File[] = []): Promise<void> => {
    const request = ++latest;
    lastFile = file;
    lastMore = more;
    status.textContent = `Reading ${file.name} …`;
    delete zone.dataset.matched;
    delete zone.dataset.failed;
    // A failure inside the worker arrives as the status line already written there.
    let viaWorker = false;
    try {
      const timeDomain = await timeDomainOf(more);
      const settings = { ...settingsOf(form, k), ...(timeDomain === undefined ? {} : { timeDomain }) };
      const matcher = await ready;
      const bytes = new Uint8Array(await file.arrayBuffer());
      viaWorker = 'worker' in matcher;
      const result =
        'worker' in matcher
          ? await matcher.worker.match(bytes, file.name, settings)
          : await matchSpectrumFile(bytes, file.name, matcher.data.set, {
              ...settings,
              source: matcher.data.source,
            });
      if (request !== latest) return;
      last = { file, result, engine: matcher };
      fillOverlay(result);
      render(result, matcher);
      const notes = [
        result.spectra > 1 ? `the file holds ${result.spectra} spectra; the first was matched` : '',
        ...result.warnings,
      ].filter((n) => n !== '');
      const top = result.hits[0];
      status.textContent =
        `${result.title}: ${result.hits.length} hits, best ${top ? `${top.name || top.id} ${formatNumber(top.score, { decimals: 4 })}` : '–'}` +
        ` · hits in ${formatNumber(result.timings.hits, { decimals: 0 })} ms, full report in ${formatNumber(result.timings.report, { decimals: 0 })} ms` +
        (notes.length > 0 ? ` (${notes.join('; ')})` : '.');
      zone.dataset.hitsMs = String(result.timings.hits);
      zone.dataset.reportMs = String(result.timings.report);
      zone.dataset.matched = file.name;
    } catch (error) {
      if (request !== latest) return;
      target.replaceChildren();
      status.textContent =
        viaWorker && error instanceof Error ? error.message : matchErrorText(error, file.name);
      zone.dataset.matched = file.name;
      zone.dataset.failed = 'true';
    }
  };

  input.addEventListener('change', () => {
    const [file, ...more] = Array.from(input.files ?? []);
    if (file) void show(file, more);
  });
  // A changed setting matches the last file again; a changed overlay only redraws.
  form?.addEventListener('change', () => {
    if (lastFile) void show(lastFile, lastMore);
  });
  form?.addEventListener('submit', (event) => event.preventDefault());
  overlay?.addEventListener('change', () => {
    if (last) render(last.result, last.engine);
  });
  zone.addEventListener('dragover', (event) => {
    event.preventDefault();
    zone.classList.add('dragging');
  });
  zone.addEventListener('dragleave', () => zone.classList.remove('dragging'));
  zone.addEventListener('drop', (event) => {
    event.preventDefault();
    zone.classList.remove('dragging');
    const [file, ...more] = Array.from(event.dataTransfer?.files ?? []);
    if (file) void show(file, more);
  });
}

// The search page: loads the prebuilt lunr index once and lists matching entries as the user types; a query of band
// positions (`1652`, `1652:s 1545`) runs the CLI's band search (searchBands) over the published peaks instead.
import type lunr from 'lunr';
import { BandshelfError } from '../../error.js';
import { searchBands } from '../../match/searchBands.js';
import type { BandIndex } from '../../match/types.js';
import { bandHitItem } from './bandHitItem.js';
import { bandQueryOf } from './bandQueryOf.js';
import { pageHref } from './pageHref.js';
import { type PublishedBandFile, publishedBandIndex } from './publishedBandIndex.js';
import { searchQuery } from './searchQuery.js';
import { siteData } from './siteData.js';

export interface MountSearchOptions {
  /** Most results listed.
   * @default 50 */
  limit?: number;
}

/** Index field → what a reader calls it. */
const FIELD_NAMES: Record<string, string> = {
  name: 'name',
  synonyms: 'synonyms',
  ids: 'id',
  codes: 'CAS, InChIKey or formula',
  class: 'class',
  tags: 'tags',
  technique: 'technique',
  sampleForm: 'sample form',
  notes: 'notes',
  peaks: 'peak positions',
  bands: 'band names at its peaks',
};

interface IndexFile {
  format: string;
  docs: Record<string, [string, string, string]>;
  index: object;
}

export function mountSearch(doc: Document, options: MountSearchOptions = {}): void {
  const form = doc.getElementById('search-form') as HTMLFormElement | null;
  const input = doc.getElementById('search-input') as HTMLInputElement | null;
  const status = doc.getElementById('search-status');
  const list = doc.getElementById('search-results');
  const base = doc.body.dataset.base ?? '/';
  const lunrGlobal = (globalThis as { lunr?: typeof lunr }).lunr;
  if (!form || !input || !status || !list || input.disabled) return;
  if (!lunrGlobal) {
    status.textContent = 'The search script did not load.';
    return;
  }
  const limit = options.limit ?? 50;
  const toleranceInput = doc.getElementById('band-tolerance') as HTMLInputElement | null;
  const requireAllInput = doc.getElementById('band-require-all') as HTMLInputElement | null;
  let loaded: { index: lunr.Index; docs: IndexFile['docs'] } | undefined;
  let bandFile: PublishedBandFile | undefined;
  let bandIndex: BandIndex | undefined;
  // Loaded on the first band query only: a text search never needs the peaks.
  let bandReady: Promise<void> | undefined;
  const loadBands = (): Promise<void> => {
    bandReady ??= siteData<PublishedBandFile>(
      form.dataset.bands ?? `${base}assets/band-index.js`,
      'band-index',
      {
        doc,
      },
    ).then((file) => {
      bandFile = file;
      bandIndex = publishedBandIndex(file);
      if (toleranceInput && toleranceInput.value === '') toleranceInput.value = String(file.tolerance);
    });
    return bandReady;
  };
  const renderBands = (text: string, bands: NonNullable<ReturnType<typeof bandQueryOf>>): void => {
    if (!bandIndex || !bandFile) {
      status.textContent = 'Loading the band index …';
      loadBands()
        .then(render)
        .catch((error: unknown) => {
          status.textContent = `The band index could not be loaded (${error instanceof Error ? error.message : String(error)}).`;
        });
      return;
    }
    const tolerance = Number(toleranceInput?.value || bandFile.tolerance);
    const requireAll = requireAllInput?.checked === true;
    const lo = Math.min(bandFile.grid.start, bandFile.grid.stop);
    const hi = Math.max(bandFile.grid.start, bandFile.grid.stop);
    const outside = bands.find((b) => b.position < lo || b.position > hi);
    if (outside) {
      status.textContent = `Band ${outside.position} cm⁻¹ lies outside the library grid (${hi}–${lo} cm⁻¹).`;
      return;
    }
    let hits: ReturnType<typeof searchBands>;
    try {
      hits = searchBands(bandIndex, bands, { tolerance, requireAll, top: limit });
    } catch (error) {
      status.textContent = error instanceof BandshelfError ? error.message : String(error);
      return;
    }
    list.dataset.mode = 'bands';
    status.textContent =
      hits.length === 0
        ? `No entry has a peak within ±${tolerance} cm⁻¹ of ${requireAll ? 'all of' : 'any of'} “${text}”.`
        : `${hits.length} ${hits.length === 1 ? 'entry has' : 'entries have'} a peak within ±${tolerance} cm⁻¹ of “${text}”${requireAll ? ' (every band)' : ''}, ranked by bands matched, then score${hits.length === limit ? `; the first ${limit} are listed` : ''}.`;
    const pathOf = new Map(bandFile.entries.map((e) => [e.id, e.path]));
    for (const hit of hits) {
      const path = pathOf.get(hit.id);
      list.append(
        bandHitItem(doc, hit, bands, { href: path == null ? null : pageHref(doc, path, { base }) }),
      );
    }
  };
  // A script file, not fetch: browsers refuse fetch from file:// but load scripts.
  const ready = siteData<IndexFile>(form.dataset.index ?? `${base}assets/search-index.js`, 'search-index', {
    doc,
  }).then((file) => {
    loaded = { index: lunrGlobal.Index.load(file.index), docs: file.docs };
  });
  const render = (): void => {
    if (!loaded) return;
    const text = input.value.trim();
    list.replaceChildren();
    if (text === '') {
      status.textContent = 'Results appear as you type.';
      return;
    }
    const bands = bandQueryOf(text);
    if (bands !== null) {
      renderBands(text, bands);
      return;
    }
    list.dataset.mode = 'text';
    let results: lunr.Index.Result[];
    try {
      results = loaded.index.query(searchQuery(text));
    } catch {
      results = [];
    }
    status.textContent =
      results.length === 0
        ? `Nothing matches “${text}”.`
        : `${results.length} ${results.length === 1 ? 'entry matches' : 'entries match'} “${text}”${results.length > limit ? `; the first ${limit} are listed` : ''}.`;
    for (const result of results.slice(0, limit)) {
      const docInfo = loaded.docs[result.ref];
      if (!docInfo) continue;
      const [name, cls, path] = docInfo;
      const item = doc.createElement('li');
      const link = doc.createElement('a');
      link.href = pageHref(doc, path, { base });
      link.textContent = name;
      const why = doc.createElement('span');
      why.className = 'why';
      // Which field matched, and by which indexed term (e.g. “amide” in the band names at its peaks).
      const byField = new Map<string, Set<string>>();
      for (const [term, fields] of Object.entries(result.matchData.metadata))
        for (const f of Object.keys(fields)) {
          const label = FIELD_NAMES[f] ?? f;
          if (!byField.has(label)) byField.set(label, new Set());
          byField.get(label)!.add(term);
        }
      why.textContent = `${cls} · ${result.ref} · matched in ${[...byField]
        .map(([field, terms]) => `${field} (${[...terms].join(', ')})`)
        .join('; ')}`;
      item.append(link, why);
      list.append(item);
    }
  };
  input.addEventListener('input', render);
  toleranceInput?.addEventListener('input', render);
  requireAllInput?.addEventListener('change', render);
  form.addEventListener('submit', (event) => {
    event.preventDefault();
    render();
  });
  ready
    .then(() => {
      input.dataset.ready = 'true';
      render();
    })
    .catch((error: unknown) => {
      status.textContent = `The search index could not be loaded (${error instanceof Error ? error.message : String(error)}).`;
    });
}

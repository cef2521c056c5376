// The search page: loads the prebuilt lunr index once and lists matching entries as the user types.
import type lunr from 'lunr';
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
  let loaded: { index: lunr.Index; docs: IndexFile['docs'] } | undefined;
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
      link.href = `${base}${path}`;
      link.textContent = name;
      const why = doc.createElement('span');
      why.className = 'why';
      const fields = new Set<string>();
      for (const term of Object.values(result.matchData.metadata))
        for (const f of Object.keys(term)) fields.add(FIELD_NAMES[f] ?? f);
      why.textContent = `${cls} · ${result.ref} · matched in ${[...fields].join(', ')}`;
      item.append(link, why);
      list.append(item);
    }
  };
  input.addEventListener('input', render);
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

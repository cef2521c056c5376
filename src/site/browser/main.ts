// Entry of the browser bundle: starts the part of the site's behaviour the current page asks for.
import { mountBrowse } from './mountBrowse.js';
import { mountContrastPlots } from './mountContrastPlots.js';
import { mountEntryOverlay } from './mountEntryOverlay.js';
import { mountEntryPlot } from './mountEntryPlot.js';
import { mountMatcher } from './mountMatcher.js';
import { mountReportPlots } from './mountReportPlots.js';
import { mountSearch } from './mountSearch.js';

const pages: Record<string, (doc: Document) => void> = {
  browse: mountBrowse,
  entry: (doc) => {
    mountEntryPlot(doc);
    mountEntryOverlay(doc);
  },
  search: mountSearch,
  match: mountMatcher,
  report: mountReportPlots,
  contrast: mountContrastPlots,
};

/** Opened from disk, a link to a folder shows a file listing: point such links at the folder's index.html. */
function linkIndexFiles(doc: Document): void {
  if (doc.location.protocol !== 'file:') return;
  for (const link of Array.from(doc.querySelectorAll<HTMLAnchorElement>('a[href]'))) {
    const href = link.getAttribute('href') ?? '';
    if (/^[a-z][a-z0-9+.-]*:/i.test(href) || href.startsWith('#')) continue;
    const [path = '', hash] = href.split('#');
    if (path === '' || path.endsWith('/') || path === '.' || path === '..') {
      const folder = path === '' || path.endsWith('/') ? path : `${path}/`;
      link.setAttribute('href', `${folder}index.html${hash === undefined ? '' : `#${hash}`}`);
    }
  }
}

function start(): void {
  linkIndexFiles(document);
  const mount = pages[document.body.dataset.page ?? ''];
  if (mount) mount(document);
}

if (document.readyState === 'loading') document.addEventListener('DOMContentLoaded', start);
else start();

// Entry of the browser bundle: starts the part of the site's behaviour the current page asks for.
import { mountBrowse } from './mountBrowse.js';
import { mountEntryPlot } from './mountEntryPlot.js';
import { mountMatcher } from './mountMatcher.js';
import { mountReportPlots } from './mountReportPlots.js';
import { mountSearch } from './mountSearch.js';

const pages: Record<string, (doc: Document) => void> = {
  browse: mountBrowse,
  entry: mountEntryPlot,
  search: mountSearch,
  match: mountMatcher,
  report: mountReportPlots,
};

function start(): void {
  const mount = pages[document.body.dataset.page ?? ''];
  if (mount) mount(document);
}

if (document.readyState === 'loading') document.addEventListener('DOMContentLoaded', start);
else start();

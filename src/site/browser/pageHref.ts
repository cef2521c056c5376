// The link to a site page from the current page: the page's relative root plus the site path, with index.html
// added to a folder path when the page was opened from disk (a folder link there shows a file listing).

export interface PageHrefOptions {
  /** The page's relative root (the body's `data-base`).
   * @default doc.body.dataset.base ?? '/' */
  base?: string;
}

export function pageHref(doc: Document, sitePath: string, options: PageHrefOptions = {}): string {
  const base = options.base ?? doc.body.dataset.base ?? '/';
  const href = `${base}${sitePath}`;
  const fromDisk = doc.location.protocol === 'file:';
  return fromDisk && (href.endsWith('/') || href === '') ? `${href}index.html` : href;
}

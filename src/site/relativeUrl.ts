// Turns a site path (`/browse/`, `/assets/site.css`) into a URL relative to the page that links it, so one built
// folder works served from `/`, from any sub-path, and opened from disk.

export interface RelativeUrlOptions {
  /** The site path of the page the link sits on (a folder path ends in `/`).
   * @default '/' */
  from?: string;
}

export function relativeUrl(target: string, options: RelativeUrlOptions = {}): string {
  // Links to other hosts, fragments and already-relative paths stay as they are.
  if (!target.startsWith('/') || target.startsWith('//')) return target;
  const from = options.from ?? '/';
  const fromFolder = from
    .slice(0, from.lastIndexOf('/') + 1)
    .split('/')
    .filter((s) => s !== '');
  const to = target.split('/');
  const file = to.pop() ?? '';
  const toFolder = to.filter((s) => s !== '');
  let common = 0;
  while (common < fromFolder.length && common < toFolder.length && fromFolder[common] === toFolder[common])
    common++;
  const up = '../'.repeat(fromFolder.length - common);
  const down = toFolder
    .slice(common)
    .map((s) => `${s}/`)
    .join('');
  const url = `${up}${down}${file}`;
  return url === '' ? './' : url;
}

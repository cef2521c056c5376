// Withholds the unknown's file name and title from a published match report (`site --redact`): the page, its
// address and its JSON download name the unknown by its SHA-256 only, since a file name can carry a patient code.
import type { SiteReport } from './types.js';

export interface RedactReportOptions {
  /** Hex digits of the SHA-256 that name the unknown.
   * @default 12 */
  hashDigits?: number;
}

export function redactReport(site: SiteReport, options: RedactReportOptions = {}): SiteReport {
  const q = site.report.query;
  const block = q.block === undefined ? '' : `-b${q.block}`;
  const name = `unknown-${q.hash.slice(0, options.hashDigits ?? 12)}${block}`;
  // A reader's warning may quote the file (or its title); each is replaced by the hash name.
  const secrets = [q.file, q.file.split(/[\\/]/).pop() ?? '', q.title ?? '']
    .filter((s) => s.length > 0)
    .sort((a, b) => b.length - a.length);
  const scrub = (text: string): string => secrets.reduce((t, s) => t.split(s).join(name), text);
  const { title: _title, ...query } = q;
  return {
    slug: name,
    file: `${name}.match.json`,
    redacted: true,
    report: { ...site.report, query: { ...query, file: name, warnings: q.warnings.map(scrub) } },
  };
}

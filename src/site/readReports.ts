// Reads the match reports to publish from a folder and validates every one before the build writes anything.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { basename, join } from 'node:path';
import { BandshelfError } from '../error.js';
import { matchReportSchema } from '../schema/matchReport.js';
import { metaErrorFromIssues } from '../schema/metaErrorFromIssues.js';
import type { SiteReport } from './types.js';

export interface ReadReportsOptions {
  /** The folder as the user named it, for messages.
   * @default dir */
  shownAs?: string;
}

/**
 * Every `*.json` file directly in `dir`, in name order; other files (a batch CSV) are skipped. A file that is not
 * JSON, or fails `matchReportSchema`, is a BAD_REPORT error naming the file and the first failing field.
 */
export function readReports(dir: string, options: ReadReportsOptions = {}): SiteReport[] {
  const shown = options.shownAs ?? dir;
  let names: string[];
  try {
    if (!statSync(dir).isDirectory()) throw new Error('not a folder');
    names = readdirSync(dir)
      .filter((n) => n.toLowerCase().endsWith('.json'))
      .sort();
  } catch {
    throw new BandshelfError('NOT_FOUND', 'the reports folder does not exist or is not a folder', {
      file: shown,
      field: '--reports',
    });
  }
  const reports: SiteReport[] = [];
  for (const name of names) {
    const path = join(dir, name);
    const file = join(shown, name);
    if (!statSync(path).isFile()) continue;
    let json: unknown;
    try {
      json = JSON.parse(readFileSync(path, 'utf8'));
    } catch (error) {
      const detail = error instanceof Error ? error.message : String(error);
      throw new BandshelfError('BAD_REPORT', `not valid JSON (${detail})`, { file });
    }
    const parsed = matchReportSchema.safeParse(json);
    if (!parsed.success) {
      throw metaErrorFromIssues(parsed.error.issues, {
        file,
        code: 'BAD_REPORT',
        lead: 'not a bandshelf match report',
        knownFields: [],
      });
    }
    reports.push({
      slug: basename(name, name.slice(name.lastIndexOf('.'))),
      file: name,
      report: parsed.data,
    });
  }
  return reports;
}

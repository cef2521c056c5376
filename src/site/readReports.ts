// Reads the match reports to publish from a folder and validates every one before the build writes anything.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { basename, join } from 'node:path';
import { BandshelfError } from '../error.js';
import { contrastReportSchema } from '../schema/contrastReport.js';
import { matchReportSchema } from '../schema/matchReport.js';
import { metaErrorFromIssues } from '../schema/metaErrorFromIssues.js';
import type { SiteContrast, SiteReport } from './types.js';

export interface ReadReportsOptions {
  /** The folder as the user named it, for messages.
   * @default dir */
  shownAs?: string;
}

/** The match reports and the contrast reports of one folder. */
export interface SiteReports {
  reports: SiteReport[];
  contrasts: SiteContrast[];
}

/**
 * Every `*.json` file directly in `dir`, in name order; other files (a batch CSV) are skipped. A file with
 * `"kind": "contrast"` is a contrast report (`contrastReportSchema`), any other a match report (`matchReportSchema`).
 * A file that is not JSON, or fails its schema, is a BAD_REPORT error naming the file and the first failing field.
 */
export function readReports(dir: string, options: ReadReportsOptions = {}): SiteReports {
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
  const contrasts: SiteContrast[] = [];
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
    const slug = basename(name, name.slice(name.lastIndexOf('.')));
    if ((json as { kind?: unknown } | null)?.kind === 'contrast') {
      const contrast = contrastReportSchema.safeParse(json);
      if (!contrast.success) {
        throw metaErrorFromIssues(contrast.error.issues, {
          file,
          code: 'BAD_REPORT',
          lead: 'not a bandshelf contrast report',
          knownFields: [],
        });
      }
      contrasts.push({ slug, file: name, report: contrast.data });
      continue;
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
      slug,
      file: name,
      report: parsed.data,
    });
  }
  return { reports, contrasts };
}

// Writes match reports as JSON files for the site: one `<unknown>[-b<block>][-<column>].match.json` per report.
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { basename, extname, join, resolve } from 'node:path';
import { BandshelfError } from '../error.js';
import { describeIoError } from '../library/store/describeIoError.js';
import type { MatchOutcome } from './matchUnknowns.js';

export interface WriteMatchReportsOptions {
  /** The working directory `dir` is read against. @default process.cwd() */
  cwd?: string;
}

/** Each file is written to a temporary name and renamed, so a reader never sees half a report. */
export function writeMatchReports(
  outcomes: readonly MatchOutcome[],
  dir: string,
  options: WriteMatchReportsOptions = {},
): string[] {
  const target = resolve(options.cwd ?? process.cwd(), dir);
  try {
    mkdirSync(target, { recursive: true });
  } catch (error) {
    throw new BandshelfError('IO_ERROR', `cannot create the report folder: ${describeIoError(error)}`, {
      file: dir,
      cause: error,
    });
  }
  const used = new Set<string>();
  const written: string[] = [];
  for (const o of outcomes) {
    if (o.report === undefined) continue;
    const stem = basename(o.file, extname(o.file)).replace(/[^A-Za-z0-9._-]+/g, '-') || 'unknown';
    const part = `${o.block === undefined ? '' : `-b${o.block}`}${
      o.column === undefined ? '' : `-${o.column.replace(/[^A-Za-z0-9._-]+/g, '-')}`
    }`;
    let name = `${stem}${part}`;
    for (let i = 2; used.has(name); i++) name = `${stem}${part}-${i}`;
    used.add(name);
    const path = join(target, `${name}.match.json`);
    try {
      writeFileSync(`${path}.tmp`, `${JSON.stringify(o.report, null, 1)}\n`);
      renameSync(`${path}.tmp`, path);
    } catch (error) {
      throw new BandshelfError('IO_ERROR', `cannot write: ${describeIoError(error, { writing: true })}`, {
        file: join(dir, `${name}.match.json`),
        cause: error,
      });
    }
    written.push(join(dir, `${name}.match.json`));
  }
  return written;
}

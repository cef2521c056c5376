// Stores a lab's own band-assignment rows in its library, each validated by the band-assignment schema.
import { BandshelfError } from '../../error.js';
import { type BandAssignment, bandAssignmentSchema } from '../../schema/bandAssignment.js';
import { metaErrorFromIssues } from '../../schema/metaErrorFromIssues.js';
import type { Library } from '../types.js';
import { canonicalJson } from './canonicalJson.js';
import { writeTransaction } from './writeTransaction.js';

export interface AddAssignmentsOptions {
  /** The file the rows came from, named in errors. */
  file?: string;
  author?: string;
  now?: Date;
}

/** Validates every row first (a bad row stores none), marks each `origin: 'lab'`, and returns them as stored. */
export function addAssignments(
  library: Library,
  rows: readonly unknown[],
  options: AddAssignmentsOptions = {},
): BandAssignment[] {
  if (rows.length === 0) {
    throw new BandshelfError('EMPTY_FILE', 'there are no band-assignment rows to add', {
      file: options.file,
    });
  }
  const checked = rows.map((row, index) => {
    const input = row !== null && typeof row === 'object' ? { basis: 'lab', ...row, origin: 'lab' } : row;
    const parsed = bandAssignmentSchema.safeParse(input);
    if (!parsed.success) {
      throw metaErrorFromIssues(parsed.error.issues, {
        file: options.file,
        prefix: `row ${index + 1}`,
        knownFields: Object.keys(bandAssignmentSchema.shape),
      });
    }
    return parsed.data;
  });
  const createdAt = (options.now ?? new Date()).toISOString();
  const insert = library.db.prepare(
    'INSERT INTO band_assignments (row, author, created_at) VALUES (?, ?, ?)',
  );
  writeTransaction(
    library,
    () => {
      for (const row of checked) insert.run(canonicalJson(row), options.author ?? 'unknown', createdAt);
    },
    { what: 'the band-assignment rows' },
  );
  return checked;
}

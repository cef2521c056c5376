// The band-assignment rows a lab added to its library (the shipped table lives with the matcher; callers that
// show both put the shipped rows first).
import { type BandAssignment, bandAssignmentSchema } from '../../schema/bandAssignment.js';
import type { Library } from '../types.js';

export function listAssignments(library: Library): BandAssignment[] {
  const rows = library.db.prepare('SELECT row FROM band_assignments ORDER BY key').pluck().all() as string[];
  // Rows were validated when stored; a row that no longer parses is skipped here and reported by `check`.
  return rows.flatMap((row) => {
    const parsed = bandAssignmentSchema.safeParse(JSON.parse(row));
    return parsed.success ? [parsed.data] : [];
  });
}

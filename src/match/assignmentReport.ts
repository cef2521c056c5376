// A ranked band-assignment row in the form match and contrast reports carry it.
import type { RankedAssignmentReport } from '../schema/bandAssignment.js';
import type { RankedAssignment } from './rankAssignments.js';

/** Copies the row's published fields and its score; the row itself is not shared with the report. */
export function assignmentReport(ranked: RankedAssignment): RankedAssignmentReport {
  const { row, score } = ranked;
  return {
    ...(row.id === undefined ? {} : { id: row.id }),
    label: row.label,
    vibration: row.vibration,
    group: row.group,
    class: [...row.class],
    source: row.source,
    basis: row.basis,
    origin: row.origin,
    min: row.min,
    max: row.max,
    tolerance: row.tolerance,
    score,
  };
}

// The band-assignment rows whose range holds a wavenumber: what a band at that position may be.
import type { SiteAssignment } from './types.js';

export interface AssignmentsAtOptions {
  /** Widen every row's range by this much on both sides, cm⁻¹ (a measured band sits a few cm⁻¹ off the table).
   * @default 0 */
  tolerance?: number;
}

export function assignmentsAt(
  position: number,
  assignments: readonly SiteAssignment[],
  options: AssignmentsAtOptions = {},
): SiteAssignment[] {
  const tolerance = options.tolerance ?? 0;
  return assignments.filter((row) => position >= row.min - tolerance && position <= row.max + tolerance);
}

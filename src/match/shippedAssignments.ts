// The band-assignment table that ships with bandshelf, validated against its schema on every load.
import { type BandAssignment, bandAssignmentTableSchema } from '../schema/bandAssignment.js';
import table from './bandAssignments.json' with { type: 'json' };

/**
 * How the shipped rows were built: only from the band table of the project's outside-reference notes. A single
 * published value (`~1650`) becomes a window of ±10 cm⁻¹ around it (`centre` keeps the value), because a measured
 * band of a film or a biofluid sits within a few cm⁻¹ of the tabulated one; a published range (`1648–1657`) is
 * kept as given. Rows whose table line names no single source cite the table's sources together; small-molecule
 * and gas-phase rows without a source say "common practice".
 *
 * Returns a fresh copy of the shipped rows, each with `origin: 'shipped'`, sorted by descending wavenumber.
 */
export function shippedAssignments(): BandAssignment[] {
  return bandAssignmentTableSchema.parse(table);
}

// The band-assignment table that ships with bandshelf, validated against its schema on every load.
import { type BandAssignment, bandAssignmentTableSchema } from '../schema/bandAssignment.js';
import table from './bandAssignments.json' with { type: 'json' };

/**
 * How the shipped rows were built: from the published band tables (Barth 2007, Movasaghi et al. 2008, Bertie & Lan
 * 1996). A single published value (`~1650`) becomes a window of ±10 cm⁻¹ around it (`centre` keeps the value); a
 * published range (`1648–1657`) is kept as given. Each row carries its own `tolerance` beyond that range: 3–4 cm⁻¹
 * for narrow bands, wider for broad ones (O–H stretch 60, amide A 30, water combination and libration 40). Rows of
 * dissolved metabolites recalled without a checked source say "from memory"; water vapour is a `region` flag over
 * 2000–1300 and 3900–3500 cm⁻¹, because its many narrow rotational lines are no single band of a condensed-phase
 * spectrum.
 *
 * Returns a fresh copy of the shipped rows, each with `origin: 'shipped'`, sorted by descending wavenumber.
 */
export function shippedAssignments(): BandAssignment[] {
  return bandAssignmentTableSchema.parse(table);
}

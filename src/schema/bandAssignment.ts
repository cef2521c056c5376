// One row of the band-assignment table: a wavenumber range, what vibrates there, and the published source.
import { z } from 'zod';

/**
 * Why the row is believed: `seen` checked against the cited source, `memory` recalled from it (treat as such),
 * `lab` a row a lab added to its own library.
 */
export const assignmentBasisSchema = z.enum(['seen', 'memory', 'lab']);
export type AssignmentBasis = z.output<typeof assignmentBasisSchema>;

/** The row's fields, before the cross-field checks. */
const bandAssignmentFields = z
  .object({
    /** Stable short name of the row (shipped rows carry one; a lab row may), shown with every match. */
    id: z
      .string()
      .regex(/^[a-z0-9][a-z0-9-]*$/)
      .optional(),
    /** Lowest wavenumber of the range, cm⁻¹ (inclusive). */
    min: z.number().finite().positive(),
    /** Highest wavenumber of the range, cm⁻¹ (inclusive). */
    max: z.number().finite().positive(),
    /** Where the published value sits inside the range, cm⁻¹, when the source gives one value. */
    centre: z.number().finite().positive().optional(),
    /**
     * How far outside min–max a measured band may sit and still match, cm⁻¹: the row's own allowance for shifts
     * with environment and resolution (broad bands such as the O–H stretch wider).
     */
    tolerance: z.number().finite().nonnegative().default(4),
    /**
     * A region flag rather than a band: the range marks where something (such as the many narrow water-vapour lines)
     * may disturb the spectrum; it never claims a single band as an assignment.
     */
    region: z.boolean().default(false),
    /** Short name of the band, e.g. `amide I`. */
    label: z.string().trim().min(1),
    /** The vibration, e.g. `C=O stretch`. */
    vibration: z.string().trim().min(1),
    /** The functional group or molecule that carries it, e.g. `peptide backbone`. */
    group: z.string().trim().min(1),
    /** Biomolecule classes the band points to (entry-class vocabulary, plus `phospholipid`). */
    class: z.array(z.string().trim().min(1)).min(1),
    /** The published source (citation) of the row; never empty. */
    source: z.string().trim().min(3),
    basis: assignmentBasisSchema,
    /** Whether the row ships with bandshelf or was added by the lab to its library. */
    origin: z.enum(['shipped', 'lab']).default('shipped'),
  })
  .strict();

export const bandAssignmentSchema = bandAssignmentFields
  .refine((row) => row.max >= row.min, { message: 'max must not be below min', path: ['max'] })
  .refine((row) => row.centre === undefined || (row.centre >= row.min && row.centre <= row.max), {
    message: 'centre must lie inside min–max',
    path: ['centre'],
  });

export type BandAssignment = z.output<typeof bandAssignmentSchema>;
export type BandAssignmentInput = z.input<typeof bandAssignmentSchema>;

/** The whole table as shipped or as stored by a lab. */
export const bandAssignmentTableSchema = z.array(bandAssignmentSchema);

/** A table row offered for a measured band, as reports carry it (lab rows' `region` flag left out). */
export const rankedAssignmentSchema = bandAssignmentFields
  .omit({ centre: true, region: true })
  .extend({
    /** 0–1 ranking score: position agreement × width agreement × relative-intensity weight. */
    score: z.number().finite().min(0).max(1),
  })
  .strict();
export type RankedAssignmentReport = z.output<typeof rankedAssignmentSchema>;

// The library bundle: one self-describing file with a library's whole history, written by `export --bundle`.
import { z } from 'zod';
import { gridSchema } from './recipe.js';

/** The `format` value every bundle carries, so a reader knows what it holds before anything else. */
export const BUNDLE_FORMAT = 'bandshelf-library-bundle';

/** Bump on any change a reader must know about; readers refuse versions they do not know. */
export const BUNDLE_VERSION = 1;

const sha256 = z.string().regex(/^[0-9a-f]{64}$/);
/** Stored bytes, base64 (standard alphabet, padded). */
const base64 = z.string().regex(/^[A-Za-z0-9+/]*={0,2}$/);
const isoTime = z.string().min(1);

export const bundleReviewSchema = z
  .object({
    state: z.enum(['reviewed', 'rejected']),
    reviewer: z.string(),
    note: z.string(),
    createdAt: isoTime,
  })
  .strict();

/**
 * One revision exactly as the library stores it: the JSON columns as their stored text and the blobs as base64,
 * so its content hash and record hash recompute to the same values in any library.
 */
export const bundleRevisionSchema = z
  .object({
    revision: z.number().int().positive(),
    kind: z.enum(['data', 'metadata', 'retire']),
    contentHash: sha256,
    dataHash: sha256,
    /** Stored text (canonical JSON) of the reading options, recipe, metadata, QC flags and extras. */
    readOptions: z.string(),
    recipe: z.string(),
    meta: z.string(),
    qc: z.string(),
    extras: z.string(),
    /** Float64 little-endian wavenumbers (cm⁻¹) and absorbances of the original, ascending. */
    originalX: base64,
    originalY: base64,
    /** Float32 little-endian processed vector on the grid (NaN = not covered). */
    processed: base64,
    coveredPoints: z.number().int().nonnegative(),
    coverageMin: z.number().nullable(),
    coverageMax: z.number().nullable(),
    /** Float64 quadruples (position cm⁻¹, height, prominence, FWHM cm⁻¹), ascending in position. */
    peaks: base64,
    author: z.string(),
    message: z.string(),
    createdAt: isoTime,
    recordHash: sha256,
    files: z.array(
      z
        .object({
          position: z.number().int().nonnegative(),
          role: z.enum(['data', 'sample-trace', 'reference-trace']),
          name: z.string(),
          sha256,
        })
        .strict(),
    ),
    /** Review decisions on this revision, oldest first (the last is its state). */
    reviews: z.array(bundleReviewSchema),
  })
  .strict();

export const bundleEntrySchema = z
  .object({
    id: z.string().min(1),
    createdAt: isoTime,
    /** Every revision, 1 … n in order. */
    revisions: z.array(bundleRevisionSchema).min(1),
  })
  .strict();

export const bundleReleaseSchema = z
  .object({
    tag: z.string().min(1),
    createdAt: isoTime,
    message: z.string(),
    reviewedOnly: z.boolean(),
    members: z.array(z.object({ id: z.string().min(1), revision: z.number().int().positive() }).strict()),
  })
  .strict();

export const bundleSchema = z
  .object({
    format: z.literal(BUNDLE_FORMAT),
    version: z.literal(BUNDLE_VERSION),
    /** The source library's settings: its name (which imported release tags carry), grid and default recipe. */
    library: z
      .object({
        name: z.string().min(1),
        grid: gridSchema,
        /** The default recipe, as stored. */
        recipe: z.record(z.string(), z.unknown()),
        createdAt: isoTime,
      })
      .strict(),
    exportedAt: isoTime,
    /** The release the bundle was cut at (its members' histories up to the frozen revision), or null for all. */
    at: z.string().nullable(),
    /** Stored file bytes by SHA-256, base64. */
    files: z.record(sha256, base64),
    entries: z.array(bundleEntrySchema),
    releases: z.array(bundleReleaseSchema),
    /** The lab's own band-assignment rows (stored JSON text), oldest first. */
    assignments: z.array(z.object({ row: z.string(), author: z.string(), createdAt: isoTime }).strict()),
    /** SHA-256 of the canonical JSON of every other field: a damaged or edited bundle is refused. */
    digest: sha256,
  })
  .strict();

export type Bundle = z.infer<typeof bundleSchema>;
export type BundleEntry = z.infer<typeof bundleEntrySchema>;
export type BundleRevision = z.infer<typeof bundleRevisionSchema>;
export type BundleRelease = z.infer<typeof bundleReleaseSchema>;

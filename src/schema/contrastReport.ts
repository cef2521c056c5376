// The contrast report: two groups of spectra compared point by point, printed by `contrast --json`.
import { z } from 'zod';
import { rankedAssignmentSchema } from './bandAssignment.js';
import { bandCandidateSchema, matchHitSchema } from './matchReport.js';
import { gridSchema, gridVectorSchema, windowSchema } from './recipe.js';

/** Bump on any change a reader must know about; readers refuse versions they do not know. */
export const CONTRAST_REPORT_VERSION = 2;

/** The caution every contrast report and table carries. */
export const CONTRAST_CAUTION =
  'Research use only: a difference between groups is an association, not a diagnosis; band assignments and ' +
  'library hits are candidates, not identifications; confirm by orthogonal methods; defer to local regulations ' +
  'and licensed clinical practice.';

export const contrastSpectrumSchema = z
  .object({
    group: z.enum(['a', 'b']),
    /** The file name (no folder: a path can carry a patient or study code). */
    file: z.string(),
    block: z.number().int().positive().optional(),
    /** SHA-256 of the file's bytes. */
    hash: z.string().regex(/^[0-9a-f]{64}$/),
    /** Root mean square of (spectrum − group median) over the points every spectrum of the group covers. */
    distance: z.number().finite().nonnegative(),
    /** 0.6745 · (distance − median distance) / MAD of the group's distances (Iglewicz & Hoaglin's modified z). */
    robustZ: z.number().finite().nullable(),
    outlier: z.boolean(),
    /** Left out of the statistics (only with dropOutliers). */
    dropped: z.boolean(),
    qc: z.array(
      z.object({ code: z.string(), level: z.enum(['error', 'warning']), message: z.string() }).strict(),
    ),
  })
  .strict();

export const contrastGroupSchema = z
  .object({
    label: z.string().min(1),
    /** Spectra read. */
    read: z.number().int().nonnegative(),
    /** Spectra in the statistics. */
    n: z.number().int().nonnegative(),
    outliers: z.number().int().nonnegative(),
    mean: gridVectorSchema,
    sd: gridVectorSchema,
  })
  .strict();

/** A library hit of a difference part (Pearson, clamped to 0–1 as in match reports). */
export const contrastHitSchema = matchHitSchema
  .pick({ rank: true, id: true, revision: true, name: true, class: true, score: true, rawScore: true })
  .strict();

export const differenceBandSchema = z
  .object({
    /** Wavenumber of the largest |difference| in the region, cm⁻¹. */
    position: z.number().finite(),
    /** The region's edges, cm⁻¹ (inclusive grid points). */
    min: z.number().finite(),
    max: z.number().finite(),
    /** Number of grid points × grid step, cm⁻¹. */
    width: z.number().finite().positive(),
    /** 'higher': mean A > mean B over the region. */
    sign: z.enum(['higher', 'lower']),
    /** Mean A − mean B at `position`, with its Welch interval. */
    difference: z.number().finite(),
    lower: z.number().finite(),
    upper: z.number().finite(),
    /** Hedges' g at `position`. */
    g: z.number().finite(),
    /** The smallest Benjamini–Hochberg q-value in the region. */
    smallestQ: z.number().finite().min(0).max(1),
    /** Band-assignment table rows for a band at `position` with the region's width, best first. */
    assignments: z.array(rankedAssignmentSchema),
    /** Library entries with a stored peak within the band tolerance of `position`, closest first. */
    candidates: z.array(bandCandidateSchema),
  })
  .strict();

/** One band-level test: a window's integrated area per spectrum (above a local straight baseline), Welch-tested. */
export const bandAreaTestSchema = z
  .object({
    /** The window's centre: the pooled mean's band maximum, or the middle of a given window, cm⁻¹. */
    position: z.number().finite(),
    /** The window's edges, cm⁻¹ (inclusive grid points). */
    min: z.number().finite(),
    max: z.number().finite(),
    /** 'pooled-mean': found on the mean of all spectra, groups ignored; 'given': a window named in advance. */
    origin: z.enum(['pooled-mean', 'given']),
    /** Mean integrated area per group, absorbance × cm⁻¹ (of the processed spectra). */
    meanA: z.number().finite(),
    meanB: z.number().finite(),
    /** Mean area A − mean area B, with its Welch interval. */
    difference: z.number().finite(),
    lower: z.number().finite(),
    upper: z.number().finite(),
    t: z.number(),
    df: z.number(),
    p: z.number().min(0).max(1),
    /** Benjamini–Hochberg q-value over the windows tested. */
    q: z.number().min(0).max(1),
    /** Hedges' g of the areas (0 when both groups are constant). */
    g: z.number().finite(),
    /** q ≤ the report's q. */
    significant: z.boolean(),
    /** Band-assignment table rows for a band at `position` with the window's width, best first. */
    assignments: z.array(
      z
        .object({
          id: z.string().optional(),
          label: z.string(),
          vibration: z.string(),
          group: z.string(),
          class: z.array(z.string()),
          source: z.string(),
          score: z.number().finite(),
        })
        .strict(),
    ),
  })
  .strict();

export const contrastReportSchema = z
  .object({
    version: z.literal(CONTRAST_REPORT_VERSION),
    kind: z.literal('contrast'),
    created: z.string(),
    library: z
      .object({ name: z.string(), release: z.string().nullable(), stateKey: z.string() })
      .strict()
      .nullable(),
    grid: gridSchema,
    settings: z
      .object({
        /** False-discovery rate of the Benjamini–Hochberg procedure. */
        q: z.number().gt(0).lt(1),
        /** Coverage of the pointwise interval of the difference. */
        level: z.number().gt(0).lt(1),
        dropOutliers: z.boolean(),
        /** Modified z above which a spectrum is an outlier. */
        outlierCutoff: z.number().positive(),
        /** cm⁻¹ for a library peak to sit on a difference band. */
        tolerance: z.number().positive(),
        /** The windows tested, cm⁻¹; empty: the whole grid. */
        ranges: z.array(windowSchema),
        /** The band-level test's windows named in advance, cm⁻¹; empty: the bands of the pooled mean ± 1 FWHM. */
        bandWindows: z.array(windowSchema),
      })
      .strict(),
    method: z
      .object({
        test: z.string(),
        assumptions: z.array(z.string()),
        fdr: z.string(),
        interval: z.string(),
        effectSize: z.string(),
        outliers: z.string(),
        search: z.string(),
        bandTest: z.string(),
      })
      .strict(),
    groups: z.object({ a: contrastGroupSchema, b: contrastGroupSchema }).strict(),
    spectra: z.array(contrastSpectrumSchema),
    /** Per grid point; null where a group has fewer than two values; t, df, p, q, g and the interval null outside `ranges`. */
    pointwise: z
      .object({
        difference: gridVectorSchema,
        lower: gridVectorSchema,
        upper: gridVectorSchema,
        t: gridVectorSchema,
        df: gridVectorSchema,
        p: gridVectorSchema,
        q: gridVectorSchema,
        g: gridVectorSchema,
      })
      .strict(),
    /** Grid points tested (the m of the Benjamini–Hochberg procedure). */
    tested: z.number().int().nonnegative(),
    discoveries: z.number().int().nonnegative(),
    bands: z.array(differenceBandSchema),
    /** The band-level test, one row per window, highest wavenumber first. */
    bandTests: z.array(bandAreaTestSchema),
    /** Library hits of the positive (higher in A) and negative (lower in A) parts; null without a library or part. */
    search: z
      .object({ higher: z.array(contrastHitSchema).nullable(), lower: z.array(contrastHitSchema).nullable() })
      .strict(),
    caution: z.literal(CONTRAST_CAUTION),
  })
  .strict();

export type ContrastReport = z.infer<typeof contrastReportSchema>;
export type DifferenceBand = z.infer<typeof differenceBandSchema>;
export type BandAreaTestRow = z.infer<typeof bandAreaTestSchema>;
export type ContrastSpectrumSummary = z.infer<typeof contrastSpectrumSchema>;
export type ContrastHit = z.infer<typeof contrastHitSchema>;

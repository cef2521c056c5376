// The match report: one versioned JSON document per unknown, printed by `match --json` and read by the site.
import { z } from 'zod';
import { rankedAssignmentSchema } from './bandAssignment.js';
import { gridSchema, gridVectorSchema, recipeSchema, windowSchema } from './recipe.js';

/** Bump on any change a reader must know about; readers refuse versions they do not know. */
export const MATCH_REPORT_VERSION = 1;

/** The caution every match report and every match table carries. */
export const MATCH_CAUTION =
  'Research use only: candidates, not identifications; confirm by orthogonal methods; defer to local regulations ' +
  'and licensed clinical practice.';

export const metricSchema = z.enum(['pearson', 'derivative', 'cosine', 'euclidean']);

export const matchHitSchema = z
  .object({
    rank: z.number().int().positive(),
    id: z.string().min(1),
    revision: z.number().int().positive(),
    name: z.string(),
    class: z.string(),
    /**
     * pearson, derivative, cosine: the correlation clamped to 0–1 (a negative correlation shows as 0, its value
     * stays in rawScore); euclidean: the distance of the unit-normalised vectors, 0–2, lower is closer.
     */
    score: z.number().finite(),
    rawScore: z.number().finite(),
    /** Wavenumber range both spectra cover inside the scoring ranges, cm⁻¹. */
    overlap: z.number().finite().nonnegative(),
    /** Lead over the next hit in rawScore units; null for the last scored row. */
    gapToNext: z.number().finite().nullable(),
    /** (rawScore − mean) / sd over every other library score of this query (sign-flipped for euclidean). */
    z: z.number().finite().nullable(),
    /**
     * Empirical p-value of this score against the library's own best wrong hits (see `confidence`): how often an
     * entry's best match to a different substance scores at least this high. A per-hit score calibration, not the
     * probability that the identification is right. Null for metrics without a null (only pearson has one).
     */
    pValue: z.number().finite().min(0).max(1).nullable().default(null),
    /**
     * Why this hit: each spectral region's share of the Pearson r (Σ over the region of the products of the
     * centred, unit-norm vectors over the scored points); the shares sum to r. Null where not computed.
     */
    contributions: z
      .array(
        z
          .object({
            label: z.string().min(1),
            /** Region bounds, cm⁻¹; null for the `elsewhere` row (points in no named region). */
            min: z.number().finite().nullable(),
            max: z.number().finite().nullable(),
            share: z.number().finite(),
            points: z.number().int().positive(),
          })
          .strict(),
      )
      .nullable()
      .default(null),
  })
  .strict();
export type MatchHit = z.output<typeof matchHitSchema>;

/** How far the best hit stands out, so a weak best match reads as weak. */
export const standingSchema = z
  .object({
    metric: metricSchema,
    verdict: z.enum(['distinct', 'ambiguous', 'weak', 'none']),
    text: z.string().min(1),
  })
  .strict();

/** ICH Q2(R1) detection limit 3.3 σ/S: as a weight (null if not detectable at all) and as a share of the signal. */
export const detectionLimitSchema = z
  .object({
    weight: z.number().finite().nonnegative().nullable(),
    share: z.number().finite().min(0).max(1),
  })
  .strict();
export type DetectionLimitReport = z.output<typeof detectionLimitSchema>;

export const mixtureComponentSchema = z
  .object({
    id: z.string().min(1),
    revision: z.number().int().positive(),
    name: z.string().optional(),
    class: z.string().optional(),
    weight: z.number().finite().nonnegative(),
    /** Share of the fitted signal (component area over the summed component area), 0–1. */
    share: z.number().finite().min(0).max(1),
    /**
     * 95 % interval of the share [low, high] within [0, 1]: the weights' HAC covariance propagated to first order
     * (delta method). The share is of the processed signal over the fit points (each reference as the recipe leaves
     * it), not of the raw integrated absorbance.
     */
    shareInterval95: z.tuple([z.number().finite().min(0).max(1), z.number().finite().min(0).max(1)]),
    forced: z.boolean(),
    /** Fractional drop of the residual sum of squares when forward selection added it; null when forced. */
    improvement: z.number().finite().nullable(),
    /** p-value of the partial F-test that admitted it; null when forced. */
    pValue: z.number().min(0).max(1).nullable(),
    /**
     * Standard error of the weight (HAC error from the final residual combined with the line-shape and baseline model parts); null if
     * infinite.
     */
    standardError: z.number().finite().nonnegative().nullable(),
    /** 95 % interval of the weight [low, high], low clipped at 0; high null if unbounded. */
    interval95: z.tuple([z.number().finite().nonnegative(), z.number().finite().nullable()]),
    /** The interval's lower end is above 0; a component that is not significant is not reported as found. */
    significant: z.boolean(),
    detectionLimit: detectionLimitSchema,
    /**
     * Ids of offered candidates that, put in its place, fit this spectrum as well at the fit's level (a likelihood-
     * ratio comparison against χ²₁): this spectrum cannot tell them apart (proteins, often). Absent when none.
     */
    alternatives: z.array(z.string().min(1)).optional(),
  })
  .strict();
export type MixtureComponentReport = z.output<typeof mixtureComponentSchema>;

/** An offered candidate the fit did not keep, with what this spectrum could have shown of it. */
export const unselectedCandidateSchema = z
  .object({
    id: z.string().min(1),
    revision: z.number().int().positive(),
    name: z.string().optional(),
    class: z.string().optional(),
    detectionLimit: detectionLimitSchema,
  })
  .strict();
export type UnselectedCandidateReport = z.output<typeof unselectedCandidateSchema>;

export const residualBandSchema = z
  .object({
    position: z.number().finite(),
    height: z.number().finite(),
    prominence: z.number().finite(),
    /**
     * Width at half prominence, cm⁻¹ (findPeaks): the FWHM for a band standing alone on a flat baseline, narrower
     * for a band sitting on a neighbour's flank. The key keeps its older name.
     */
    fwhm: z.number().finite().nullable(),
    /** FWHM of the residual band, cm⁻¹ (at least the instrument resolution). */
    width: z.number().finite().nullable(),
    /** Residual height over the unknown's value at that position, 0–1. */
    share: z.number().finite().min(0).max(1),
    /** Local noise σ the k × threshold was built on. */
    localNoise: z.number().finite().nonnegative(),
  })
  .strict();
export type ResidualBandReport = z.output<typeof residualBandSchema>;

/** A residual peak on a band of a fitted component that gives at least twice the residual there: a shape mismatch. */
export const misfitBandSchema = z
  .object({
    position: z.number().finite(),
    height: z.number().finite(),
    /** The fitted component whose band it sits on. */
    component: z.string().min(1),
    /** That component's fitted absorbance at the position (processed units). */
    contribution: z.number().finite(),
  })
  .strict();
export type MisfitBandReport = z.output<typeof misfitBandSchema>;

export const mixtureReportSchema = z
  .object({
    components: z.array(mixtureComponentSchema),
    r2: z.number().finite().nullable(),
    rss: z.number().finite().nonnegative(),
    /** Free-sign polynomial in u = (wavenumber − centre) / halfWidth; null when the fit had none. */
    baseline: z
      .object({
        degree: z.number().int().nonnegative(),
        coefficients: z.array(z.number().finite()),
        centre: z.number().finite(),
        halfWidth: z.number().finite().positive(),
      })
      .strict()
      .nullable(),
    fitted: gridVectorSchema,
    residual: gridVectorSchema,
    noise: z.number().finite().nonnegative(),
    noiseSource: z.enum(['band-free-window', 'residual-differences']),
    /** Lag-1 autocorrelation of the residual noise and the effective independent points it implies. */
    noiseLag1: z.number().finite(),
    effectivePoints: z.number().finite().nonnegative(),
    /** Significance level of the selection test. */
    alpha: z.number().gt(0).lt(1),
    /** The selection, uncertainty, detection-limit and residual-band rules in words. */
    rule: z.string().min(1),
    notSelected: z.array(unselectedCandidateSchema),
    k: z.number().finite().positive(),
    /** Peaks of the residual above k × noise: the bands the fitted components do not explain. */
    residualBands: z.array(residualBandSchema),
    /** Residual peaks above k × noise that sit on a fitted component's band (not unexplained; see misfitBandSchema). */
    misfitBands: z.array(misfitBandSchema),
    points: z.number().int().nonnegative(),
    span: z.object({ min: z.number().finite(), max: z.number().finite() }).strict().nullable(),
    /** How many candidates forward selection chose from. */
    candidates: z.number().int().nonnegative(),
    criterion: z.string().min(1),
    stopReason: z.string(),
    skipped: z.array(z.string()),
    /**
     * Like with like: the common resolution (cm⁻¹, Gaussian line shape) the unknown and its references were fitted
     * at, the unknown's own (as compared under its recipe), the references degraded to it and whether the unknown
     * was. Absent when every resolution already agreed (and in reports written before this field).
     */
    resolution: z
      .object({
        common: z.number().finite().positive(),
        unknown: z.number().finite().positive(),
        degraded: z.array(z.string()),
        unknownDegraded: z.boolean(),
      })
      .strict()
      .optional(),
  })
  .strict();
export type MixtureReport = z.output<typeof mixtureReportSchema>;

/** A library entry with a stored peak near a band. */
export const bandCandidateSchema = z
  .object({
    id: z.string().min(1),
    revision: z.number().int().positive(),
    name: z.string(),
    class: z.string(),
    /** The entry's peak position, cm⁻¹. */
    position: z.number().finite(),
    /** Peak position minus band position, cm⁻¹. */
    error: z.number().finite(),
  })
  .strict();

export const identifiedBandSchema = z
  .object({
    position: z.number().finite(),
    height: z.number().finite(),
    /**
     * A peak's width at half prominence (findPeaks: the FWHM for a band alone on a flat baseline), a shoulder's
     * FWHM estimated from its second-derivative trough assuming a Gaussian shape (findShoulders), cm⁻¹.
     */
    fwhm: z.number().finite().nullable(),
    kind: z.enum(['peak', 'shoulder']),
    /** Table rows offered for a band no fitted component carries, best first (empty when `assignedTo` is set). */
    assignments: z.array(rankedAssignmentSchema),
    /** The fitted mixture component that carries most of the band's height; table rows are then not offered. */
    assignedTo: z
      .object({
        id: z.string().min(1),
        revision: z.number().int().positive(),
        name: z.string().optional(),
        share: z.number().finite(),
      })
      .strict()
      .nullable()
      .default(null),
    /** Region rows the band lies in (e.g. among water-vapour lines): a caution, not an assignment. */
    flags: z
      .array(
        z.object({ id: z.string().optional(), label: z.string().min(1), source: z.string().min(1) }).strict(),
      )
      .default([]),
    /** Library entries with a stored peak within tolerance, closest first. */
    candidates: z.array(bandCandidateSchema),
    /** Whether the mixture fit explains the band; null when no fit was made. */
    explained: z.boolean().nullable(),
  })
  .strict();
export type IdentifiedBandReport = z.output<typeof identifiedBandSchema>;

const hitListSchema = z.array(matchHitSchema);

export const matchReportSchema = z
  .object({
    kind: z.literal('bandshelf-match-report'),
    version: z.literal(MATCH_REPORT_VERSION),
    /** Printed with every report: research use only. */
    caution: z.string().min(1),
    query: z
      .object({
        /** The file as the user named it. */
        file: z.string().min(1),
        /** 1-based spectrum of a multi-block file, when the file held several. */
        block: z.number().int().positive().optional(),
        /** The y column's header name, when the delimited file held several spectra. */
        column: z.string().min(1).optional(),
        /** SHA-256 of the file's bytes, lowercase hex. */
        hash: z.string().regex(/^[0-9a-f]{64}$/),
        /** The file's own title, where it had one. */
        title: z.string().optional(),
        /** The recipe the unknown was processed with, and where it came from. */
        recipe: recipeSchema,
        recipeSource: z.enum(['library', 'file']),
        grid: gridSchema,
        /** Scoring windows (cm⁻¹); empty means the whole grid. Recipe exclusion windows always apply. */
        ranges: z.array(windowSchema),
        /** The grid span the unknown covers inside the ranges. */
        coverage: z
          .object({
            min: z.number().finite(),
            max: z.number().finite(),
            points: z.number().int().nonnegative(),
            /** Covered wavenumber range summed over covered stretches, cm⁻¹. */
            overlap: z.number().finite().nonnegative(),
          })
          .strict()
          .nullable(),
        /** The processed unknown on the grid. */
        processed: gridVectorSchema,
        warnings: z.array(z.string()),
      })
      .strict(),
    library: z
      .object({
        name: z.string(),
        /** The release tag the search read, or null for the working state. */
        release: z.string().nullable(),
        /** Hash of the revision set (and grid): equal keys mean the same library contents. */
        stateKey: z.string().min(1),
        entries: z.number().int().nonnegative(),
        /** The revision set itself, for libraries of up to 5,000 entries (the state key pins larger ones). */
        revisions: z
          .array(z.object({ id: z.string().min(1), revision: z.number().int().positive() }).strict())
          .optional(),
      })
      .strict(),
    settings: z
      .object({
        top: z.number().int().positive(),
        minOverlap: z.number().finite().nonnegative(),
        tolerance: z.number().finite().positive(),
        maxComponents: z.number().int().positive(),
        with: z.array(z.string()),
      })
      .strict(),
    metrics: z.array(metricSchema).min(1),
    /** The hits of the first metric in `metrics`. */
    hits: hitListSchema,
    hitsByMetric: z
      .object({
        pearson: hitListSchema.optional(),
        derivative: hitListSchema.optional(),
        cosine: hitListSchema.optional(),
        euclidean: hitListSchema.optional(),
      })
      .strict(),
    standing: standingSchema,
    /** How `pValue` was calibrated: the null, its size, and what it means. Null when no null was computed. */
    confidence: z
      .object({
        metric: metricSchema,
        /** Best-wrong-hit scores in the null, and entries in the library. */
        nullSize: z.number().int().nonnegative(),
        entries: z.number().int().nonnegative(),
        text: z.string().min(1),
      })
      .strict()
      .nullable()
      .default(null),
    mixture: mixtureReportSchema.nullable(),
    bands: z.array(identifiedBandSchema),
  })
  .strict();

export type MatchReport = z.output<typeof matchReportSchema>;

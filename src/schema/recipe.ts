// The processing recipe: a JSON object stored with every revision that fully determines the processed vector.
import { z } from 'zod';

/** A wavenumber window in cm⁻¹; min and max may be given in either order and are stored sorted. */
export const windowSchema = z
  .object({ min: z.number().finite(), max: z.number().finite() })
  .strict()
  .transform((w) => (w.min <= w.max ? w : { min: w.max, max: w.min }))
  .refine((w) => w.max > w.min, { message: 'a window needs max > min' });
export type WavenumberWindow = z.output<typeof windowSchema>;

/** The most points a grid may have; a guard, not a target (0.01 cm⁻¹ over 4000–600 cm⁻¹ is 340,001). */
const MAX_GRID_POINTS = 1_000_001;

/**
 * The library grid: `start` and `stop` in cm⁻¹ (either order, both > 0), `step` > 0, at most 1,000,001
 * points. Vectors on it run ascending.
 */
/** A vector on the grid, ascending wavenumber; null where not covered or not computed (JSON has no NaN). */
export const gridVectorSchema = z.array(z.number().finite().nullable());

export const gridSchema = z
  .object({
    start: z.number().finite(),
    stop: z.number().finite(),
    step: z.number().finite().positive({ message: 'the step must be > 0' }),
  })
  .strict()
  .refine((g) => g.start > 0 && g.stop > 0, { message: 'start and stop must be wavenumbers > 0 cm⁻¹' })
  .refine((g) => Math.abs(g.start - g.stop) >= g.step, { message: 'the grid must span at least one step' })
  .refine((g) => Math.abs(g.start - g.stop) / g.step < MAX_GRID_POINTS, {
    message: `the grid would have more than ${MAX_GRID_POINTS.toLocaleString('en')} points; take a coarser step`,
  })
  .refine(
    (g) =>
      Math.abs(Math.round((g.start - g.stop) / g.step) * g.step - (g.start - g.stop)) < 1e-9 * g.step * 1e3,
    {
      message: 'start − stop must be a whole number of steps',
    },
  );
export type Grid = z.output<typeof gridSchema>;

export const baselineSchema = z.discriminatedUnion('method', [
  z.object({ method: z.literal('none') }).strict(),
  /** Lower convex hull, anchored on the spectrum's ends. */
  z.object({ method: z.literal('rubberband') }).strict(),
  /**
   * Asymmetric least squares (Eilers & Boelens 2005). λ: per point in a version-1 recipe; in cm⁴ (second
   * differences) in version 2, i.e. the per-point λ of a 1 cm⁻¹ spectrum, rescaled to each file's spacing.
   */
  z
    .object({
      method: z.literal('als'),
      lambda: z.number().positive().default(1e5),
      p: z.number().gt(0).lt(1).default(0.01),
      iterations: z.number().int().min(1).max(100).default(10),
    })
    .strict(),
  /**
   * Adaptive iteratively reweighted penalised least squares (Zhang et al. 2010). λ: per point in a version-1
   * recipe; in cm² (first differences) in version 2, rescaled to each file's spacing.
   */
  z
    .object({
      method: z.literal('airpls'),
      lambda: z.number().positive().default(100),
      iterations: z.number().int().min(1).max(100).default(20),
    })
    .strict(),
]);
export type BaselineStep = z.output<typeof baselineSchema>;

export const normaliseSchema = z.discriminatedUnion('method', [
  z.object({ method: z.literal('none') }).strict(),
  z.object({ method: z.literal('vector') }).strict(),
  z.object({ method: z.literal('minmax') }).strict(),
  z.object({ method: z.literal('area') }).strict(),
  /** Divide by the maximum inside a band window, e.g. amide I 1600–1700 cm⁻¹. */
  z.object({ method: z.literal('band'), window: windowSchema }).strict(),
]);
export type NormaliseStep = z.output<typeof normaliseSchema>;

/**
 * The noise-floor factor k pinned into new time-domain adds and matches: a bin is covered only where both amplitudes
 * exceed 3 × the noise floor, the usual 3σ detection criterion (IUPAC detection limit, k = 3; common practice).
 */
export const NOISE_FLOOR_FACTOR_DEFAULT = 3;

export const timeDomainSchema = z
  .object({
    /** Delay unit of the trace files when their header does not say. */
    timeUnit: z.enum(['fs', 'ps']).default('fs'),
    /** Keep only this delay range (in `timeUnit`), with a raised-cosine edge of `edge` on each side. */
    gate: z
      .object({ start: z.number(), end: z.number(), edge: z.number().min(0).default(0) })
      .strict()
      .nullable()
      .default(null),
    apodisation: z.enum(['none', 'hann', 'blackman-harris', 'happ-genzel']).default('hann'),
    /** Zero-fill to the next power of two times this factor. */
    zeroFill: z.number().int().min(1).max(16).default(2),
    /** Coverage keeps only wavenumbers where the reference power exceeds this fraction of its peak. */
    powerThreshold: z.number().gt(0).lt(1).default(1e-4),
    /**
     * Coverage also needs both the sample's and the reference's spectral amplitude to exceed this many times the
     * noise floor measured on the reference trace (pre-pulse part or highest frequencies; a per-bin amplitude floor,
     * so k = 3 keeps bins whose power is above 9 × the floor). A new time-domain add or match without the key gets
     * NOISE_FLOOR_FACTOR_DEFAULT pinned in (`pinNoiseFloor`); null turns the test off. Absent in a stored recipe
     * (revisions written before the default): no such test, so those revisions recompute as they were.
     */
    noiseFloorFactor: z.number().finite().positive().nullable().optional(),
  })
  .strict();
export type TimeDomainStep = z.output<typeof timeDomainSchema>;

export const recipeSchema = z
  .object({
    /**
     * What the parameters mean. 1: smoothing and baseline parameters in points of each file (libraries made
     * before version 2; kept so their stored vectors recompute identically). 2: every smoothing and baseline
     * parameter in wavenumbers, so a spectrum gives the same processed vector at any point spacing.
     */
    version: z.union([z.literal(1), z.literal(2)]).default(2),
    crop: windowSchema.nullable().default(null),
    /** Windows removed before anything else; default the atmospheric CO₂ stretch. */
    exclude: z.array(windowSchema).default([{ min: 2280, max: 2400 }]),
    baseline: baselineSchema.default({ method: 'rubberband' }),
    /**
     * ATR correction to transmission-equivalent absorbance (Harrick's penetration depth), applied to the sample
     * after crop and exclusion, before the baseline. 'auto' (or absent in a recipe given to `add`): corrected
     * with the diamond preset when the entry's metadata says `technique: atr`, not otherwise; ingest pins the
     * choice, so a stored recipe holds an explicit step or none. A stored recipe without the key (written before
     * the step existed) or with null is not corrected.
     */
    atr: z
      .union([
        z.literal('auto'),
        z.null(),
        z
          .object({
            crystal: z.enum(['diamond', 'znse', 'ge']).default('diamond'),
            /** Overrides the preset's refractive index. */
            crystalIndex: z.number().gt(1).optional(),
            sampleIndex: z.number().gt(1).default(1.5),
            angle: z.number().gt(0).lt(90).default(45),
            /** Wavenumber (cm⁻¹) where corrected and measured absorbance agree. */
            referenceWavenumber: z.number().positive().default(1000),
          })
          .strict(),
      ])
      .optional(),
    /**
     * Resolution matching: a spectrum sharper than `target` (cm⁻¹, FWHM of the instrument line shape) is convolved
     * with a Gaussian of FWHM √(target² − own²), after crop, exclusion and ATR correction and before any subtraction
     * or baseline, so spectra from sharper and coarser instruments are compared at one resolution; a spectrum coarser
     * than the target is kept as it is, with a QC note. `own` is pinned at ingest from the entry's resolution (its
     * metadata or JCAMP-DX `##RESOLUTION=`, else estimated as two point spacings and marked `estimated`); absent,
     * it is estimated from the spectrum. References of a subtraction step are brought to the target too, at their
     * estimated resolution. Absent or null: no such step (recipes written before it).
     */
    resolution: z
      .object({
        target: z.number().finite().positive().default(4),
        /** The instrument line shape assumed and applied; Gaussian widths add in quadrature. */
        lineShape: z.literal('gaussian').default('gaussian'),
        /** The spectrum's own resolution, cm⁻¹ (pinned at ingest). */
        own: z.number().finite().positive().optional(),
        /** True when `own` was estimated from the point spacing rather than stated. */
        estimated: z.boolean().optional(),
      })
      .strict()
      .nullable()
      .optional(),
    /** Subtract a library spectrum (water, buffer) scaled by least squares inside `window`. */
    reference: z
      .object({
        id: z.string().min(1),
        /** Pinned at ingest so the processed vector stays reproducible. */
        revision: z.number().int().positive().optional(),
        window: windowSchema.default({ min: 1900, max: 2300 }),
      })
      .strict()
      .nullable()
      .default(null),
    /**
     * Subtract several library spectra at once (liquid water, water vapour), fitted with an offset and a slope
     * inside `windows` and run before the baseline step; each scale and its standard error are recorded with the
     * revision. An entry named here is not subtracted from itself. Absent: no such step (recipes written before it).
     */
    subtract: z
      .object({
        references: z
          .array(
            z.object({ id: z.string().min(1), revision: z.number().int().positive().optional() }).strict(),
          )
          .min(1)
          .max(6),
        windows: z
          .array(windowSchema)
          .min(1)
          .default([{ min: 1900, max: 2300 }]),
        /**
         * Subtract a reference only when its scale is at least this many standard errors above 0 (one-sided z-test,
         * weakest first, the rest refitted); one taken out is recorded with scale 0. Absent: every reference is
         * subtracted at its fitted scale (recipes written before the key).
         */
        minZ: z.number().finite().nonnegative().optional(),
      })
      .strict()
      .optional(),
    /** Extended multiplicative scatter correction against a library spectrum (Martens & Stark 1991). */
    emsc: z
      .object({
        id: z.string().min(1),
        revision: z.number().int().positive().optional(),
        degree: z.number().int().min(0).max(6).default(2),
      })
      .strict()
      .nullable()
      .default(null),
    /**
     * Savitzky–Golay smoothing. Version 2 takes `width`, the window in cm⁻¹ (turned into the nearest odd
     * number of points at each file's spacing); version 1 takes `window` in points.
     */
    smooth: z
      .object({
        /** Window in points (version-1 recipes only); odd. @default 9 */
        window: z
          .number()
          .int()
          .min(3)
          .max(101)
          .refine((w) => w % 2 === 1, { message: 'the window must be odd' })
          .optional(),
        /** Window in cm⁻¹ (version 2). @default 9 */
        width: z.number().finite().positive().optional(),
        order: z.number().int().min(0).max(6).default(2),
      })
      .strict()
      .refine((s) => s.window === undefined || s.order < s.window, {
        message: 'order must be below the window',
      })
      .nullable()
      .default(null),
    resample: z
      .object({
        /** Source points further apart than this (cm⁻¹) leave the grid between them not covered. */
        maxGap: z.number().positive().default(16),
        /**
         * 'area' conserves band area (each grid cell the mean of the source curve over it); 'cell-or-interpolate'
         * is the version-1 rule (bin-average dense cells, interpolate sparse ones).
         * @default 'area' in version 2, 'cell-or-interpolate' in version 1
         */
        method: z.enum(['area', 'cell-or-interpolate']).optional(),
      })
      .strict()
      .default({ maxGap: 16 }),
    normalise: normaliseSchema.default({ method: 'vector' }),
    /** Present only for entries ingested from field-resolved time-domain traces. */
    timeDomain: timeDomainSchema.nullable().default(null),
  })
  .strict()
  .refine((r) => r.version === 1 || r.smooth === null || r.smooth.window === undefined, {
    message: 'a version-2 recipe gives the smoothing window in cm⁻¹ (smooth.width), not in points',
    path: ['smooth', 'window'],
  });
export type Recipe = z.output<typeof recipeSchema>;
export type RecipeInput = z.input<typeof recipeSchema>;
export type AtrStep = Exclude<NonNullable<Recipe['atr']>, 'auto'>;

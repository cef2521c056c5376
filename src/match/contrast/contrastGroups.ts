// Two groups of processed spectra contrasted (browser-safe): outliers, pointwise Welch tests with FDR, difference bands.
import { BandshelfError } from '../../error.js';
import type { BandAssignment } from '../../schema/bandAssignment.js';
import {
  type BandAreaTestRow,
  CONTRAST_CAUTION,
  CONTRAST_REPORT_VERSION,
  type ContrastHit,
  type ContrastReport,
  type ContrastSpectrumSummary,
  contrastReportSchema,
  type DifferenceBand,
} from '../../schema/contrastReport.js';
import type { Grid, WavenumberWindow } from '../../schema/recipe.js';
import { gridAxis } from '../../spectrum/gridAxis.js';
import { gridLength } from '../../spectrum/gridLength.js';
import type { QcFlag } from '../../spectrum/types.js';
import { assignmentReport } from '../assignmentReport.js';
import { entriesWithBandAt } from '../entriesWithBandAt.js';
import type { MatchScorer, MatchSource } from '../pipeline/types.js';
import { rankAssignments } from '../rankAssignments.js';
import { MIN_OVERLAP_DEFAULT } from '../searchTypes.js';
import { shippedAssignments } from '../shippedAssignments.js';
import type { BandIndex } from '../types.js';
import { type BandAreaTest, bandAreaTests } from './bandAreaTests.js';
import { type DifferenceRegion, differenceRegions } from './differenceRegions.js';
import { type PointwiseContrast, pointwiseContrast } from './pointwiseContrast.js';
import { robustDistances } from './robustDistances.js';

/** One spectrum of a group, already processed onto the grid with the library's recipe. */
export interface ContrastSpectrum {
  file: string;
  block?: number;
  /** SHA-256 of the file's bytes, lowercase hex. */
  hash: string;
  /** gridLength(grid) values, ascending wavenumber, NaN where not covered. */
  processed: ArrayLike<number>;
  qc?: readonly QcFlag[];
}

export interface ContrastGroup {
  label: string;
  spectra: readonly ContrastSpectrum[];
}

export interface ContrastInput {
  a: ContrastGroup;
  b: ContrastGroup;
  grid: Grid;
  /** The library the parts of the difference are searched in, with its scorer. @default none (no search) */
  library?: { source: MatchSource; scorer: MatchScorer; index?: BandIndex };
  /** Band-assignment rows. @default shippedAssignments() */
  assignments?: readonly BandAssignment[];
}

export interface ContrastGroupsOptions {
  /** False-discovery rate of the Benjamini–Hochberg procedure. @default 0.05 */
  q?: number;
  /** Coverage of the pointwise interval of the difference. @default 0.95 */
  level?: number;
  /** Leave the flagged outliers out of the statistics. @default false */
  dropOutliers?: boolean;
  /** Modified z above which a spectrum is an outlier. @default 3.5 */
  outlierCutoff?: number;
  /** cm⁻¹ for a library peak to sit on a difference band. @default 4 */
  tolerance?: number;
  /** Library hits per part of the difference, and library candidates per band. @default 5 */
  top?: number;
  /** Table rows kept per band. @default 3 */
  assignmentsPerBand?: number;
  /** Spectra each group needs in the statistics. @default 3 */
  minGroupSize?: number;
  /**
   * Test only inside these windows, cm⁻¹ (a region of interest chosen before looking at the data: fewer tests, more
   * power). @default [] (the whole grid)
   */
  ranges?: readonly WavenumberWindow[];
  /**
   * Windows of the band-level test, cm⁻¹, named before looking at the data. @default [] (each band of the mean of
   * all spectra, groups ignored, ± 1 FWHM)
   */
  bandWindows?: readonly WavenumberWindow[];
  /** The report's creation time, ISO 8601. @default now */
  created?: string;
}

const nullable = (v: ArrayLike<number>): (number | null)[] =>
  Array.from(v, (x) => (Number.isFinite(x) ? x : null));

function checkOptions(q: number, level: number): void {
  if (!(q > 0 && q < 1)) {
    throw new BandshelfError('BAD_OPTION', `q must lie between 0 and 1, not ${q}`, { field: 'q' });
  }
  if (!(level > 0 && level < 1)) {
    throw new BandshelfError('BAD_OPTION', `the level must lie between 0 and 1, not ${level}`, {
      field: 'level',
    });
  }
}

/** The group's spectra with their outlier status; throws when too few are left for the statistics. */
function screenGroup(
  key: 'a' | 'b',
  group: ContrastGroup,
  cols: number,
  options: { cutoff: number; drop: boolean; minSize: number },
): { summaries: ContrastSpectrumSummary[]; kept: ArrayLike<number>[] } {
  for (const s of group.spectra) {
    if (s.processed.length !== cols) {
      throw new BandshelfError(
        'BAD_OPTION',
        `the processed spectrum has ${s.processed.length} values but the grid has ${cols} points`,
        { file: s.file, field: 'processed' },
      );
    }
  }
  const screened = robustDistances(
    group.spectra.map((s) => s.processed),
    { cutoff: options.cutoff },
  );
  const summaries = group.spectra.map(
    (s, i): ContrastSpectrumSummary => ({
      group: key,
      file: s.file,
      ...(s.block === undefined ? {} : { block: s.block }),
      hash: s.hash,
      distance: screened.distance[i]!,
      robustZ: screened.robustZ[i]!,
      outlier: screened.outlier[i]!,
      dropped: options.drop && screened.outlier[i]!,
      qc: (s.qc ?? []).map((f) => ({ code: f.code, level: f.level, message: f.message })),
    }),
  );
  const kept = group.spectra.filter((_, i) => !summaries[i]!.dropped).map((s) => s.processed);
  if (kept.length < options.minSize) {
    throw new BandshelfError(
      'BAD_OPTION',
      `group '${group.label}' has ${kept.length} spectr${kept.length === 1 ? 'um' : 'a'} for the statistics` +
        `${options.drop ? ' after leaving out its outliers' : ''}; a contrast needs at least ${options.minSize} per group`,
      { field: key === 'a' ? 'groupA' : 'groupB' },
    );
  }
  return { summaries, kept };
}

/** Regions → difference bands, each with its table rows and the library entries that have a peak there. */
function describeBands(
  regions: readonly DifferenceRegion[],
  stats: PointwiseContrast,
  axis: Float64Array,
  step: number,
  input: ContrastInput,
  options: { tolerance: number; top: number; perBand: number },
): DifferenceBand[] {
  const rows = input.assignments ?? shippedAssignments();
  const strongest = regions.reduce((m, r) => Math.max(m, Math.abs(stats.difference[r.peak]!)), 0);
  const index = input.library?.index;
  return regions
    .map((r): DifferenceBand => {
      const position = axis[r.peak]!;
      const width = (r.to - r.from + 1) * step;
      const difference = stats.difference[r.peak]!;
      const ranked = rankAssignments(
        { position, fwhm: width, relative: strongest > 0 ? Math.abs(difference) / strongest : 0 },
        rows,
      ).slice(0, options.perBand);
      const candidates = entriesWithBandAt(index, position, {
        tolerance: options.tolerance,
        top: options.top,
      });
      const lower = stats.lower[r.peak]!;
      const upper = stats.upper[r.peak]!;
      return {
        position,
        min: axis[r.from]!,
        max: axis[r.to]!,
        width,
        sign: r.sign,
        difference,
        lower: Number.isFinite(lower) ? lower : difference,
        upper: Number.isFinite(upper) ? upper : difference,
        g: Number.isFinite(stats.g[r.peak]!) ? stats.g[r.peak]! : 0,
        smallestQ: r.smallestQ,
        assignments: ranked.map(assignmentReport),
        candidates,
      };
    })
    .sort((x, y) => y.position - x.position);
}

/** Band-level rows with their q-based verdict and the table rows for a band at that position and width. */
function describeBandTests(
  tests: readonly BandAreaTest[],
  rows: readonly BandAssignment[],
  options: { q: number; perBand: number },
): BandAreaTestRow[] {
  const strongest = tests.reduce((m, t) => Math.max(m, Math.abs(t.difference)), 0);
  return tests.map((t) => ({
    ...t,
    g: Number.isFinite(t.g) ? t.g : 0,
    significant: t.q <= options.q,
    assignments: rankAssignments(
      {
        position: t.position,
        fwhm: (t.max - t.min) / 2,
        relative: strongest > 0 ? Math.abs(t.difference) / strongest : 0,
      },
      rows,
    )
      .slice(0, options.perBand)
      .map(({ row, score }) => ({
        ...(row.id === undefined ? {} : { id: row.id }),
        label: row.label,
        vibration: row.vibration,
        group: row.group,
        class: [...row.class],
        source: row.source,
        score,
      })),
  }));
}

/** One part of the difference (|difference| inside the regions of one sign, 0 elsewhere) scored as an unknown. */
async function searchPart(
  sign: 'higher' | 'lower',
  regions: readonly DifferenceRegion[],
  stats: PointwiseContrast,
  library: NonNullable<ContrastInput['library']>,
  top: number,
): Promise<ContrastHit[] | null> {
  const own = regions.filter((r) => r.sign === sign);
  if (own.length === 0) return null;
  const query = new Float64Array(stats.difference.length);
  for (let j = 0; j < query.length; j++) query[j] = Number.isNaN(stats.difference[j]!) ? Number.NaN : 0;
  for (const r of own) for (let j = r.from; j <= r.to; j++) query[j] = Math.abs(stats.difference[j]!);
  const k = Math.min(top, library.source.entries.length);
  const [hits] = await library.scorer(library.source, [query], {
    metric: 'pearson',
    k,
    minOverlap: MIN_OVERLAP_DEFAULT,
  });
  return (hits ?? []).map((h, i) => ({
    rank: i + 1,
    id: h.id,
    revision: h.revision,
    name: h.name,
    class: h.class,
    score: h.score,
    rawScore: h.rawScore,
  }));
}

function methodText(
  stats: PointwiseContrast,
  settings: ContrastReport['settings'],
  groups: { a: string; b: string },
): ContrastReport['method'] {
  return {
    test:
      `Welch's unequal-variance t-test (Welch, Biometrika 34:28, 1947), two-sided, of mean ${groups.a} − mean ` +
      `${groups.b} at each grid point of the processed spectra (\`bandshelf contrast\`: the library's recipe, ` +
      'normalisation included).',
    assumptions: [
      'the spectra are independent (one spectrum per subject or sample; average replicate spectra of one sample first)',
      'the variances of the two groups may differ (no pooled variance)',
      'the group means are approximately normal at each grid point (normal data, or groups large enough for the central limit theorem)',
    ],
    fdr:
      `Benjamini–Hochberg (J. R. Stat. Soc. B 57:289, 1995) over the ${stats.tested} tested grid points` +
      (settings.ranges.length === 0
        ? ', '
        : ` (inside ${settings.ranges.map((w) => `${w.max}–${w.min} cm⁻¹`).join(', ')} only), `) +
      `false-discovery rate q = ${settings.q}; it holds for independent or positively dependent tests, as ` +
      'neighbouring points of a spectrum are expected to be.',
    interval:
      `${settings.level * 100} % Welch interval of the difference at each point (t quantile with the ` +
      'Welch–Satterthwaite degrees of freedom), not adjusted for multiplicity.',
    effectSize:
      "Hedges' g: the difference over the pooled SD times J = 1 − 3 / (4(nA + nB) − 9) (Hedges, J. Educ. Stat. 6:107, 1981).",
    outliers:
      "Each spectrum's RMS distance from its group's point-wise median spectrum; a modified z = 0.6745 (d − median d) / " +
      `MAD above ${settings.outlierCutoff} flags an outlier (Iglewicz & Hoaglin, 1993). ` +
      (settings.dropOutliers
        ? 'Outliers were left out.'
        : 'Outliers are listed and kept (dropOutliers leaves them out).'),
    bandTest:
      "Band level: each window's integrated area above a straight baseline through its ends (the means of its " +
      "three first and three last points), per spectrum, compared by Welch's t-test; Benjamini–Hochberg over the " +
      `windows tested at q = ${settings.q}. ` +
      (settings.bandWindows.length > 0
        ? 'The windows were named in advance.'
        : 'The windows are the bands of the mean of all spectra (groups ignored) ± 1 FWHM: chosen blind to the ' +
          'labels, so the choice does not favour a difference (independent filtering, Bourgon, Gentleman & Huber, ' +
          'PNAS 107:9546, 2010).') +
      ' One test per band instead of one per grid point: a change of a whole band is found with far fewer tests; ' +
      'a change of shape inside a window that leaves its area unchanged is not.',
    search:
      'The positive part (higher in the first group) and the negative part (lower, sign flipped) of the difference, ' +
      'zero outside the difference bands, are each scored against the library by Pearson correlation like an unknown.',
  };
}

/**
 * The cohort question on spectra already processed with the library's recipe: which wavenumbers differ between
 * group A and group B. Returns a validated `ContrastReport`: per-spectrum QC and outlier status, mean ± SD per
 * group, the difference of means with its Welch interval, Welch's t-test and Hedges' g per grid point with
 * Benjamini–Hochberg q-values, and the passing regions as difference bands, each assigned with the band table and,
 * with a library, matched to entries with a peak there; the two parts of the difference are searched as unknowns.
 * Refuses (BAD_OPTION) a group with fewer than `minGroupSize` spectra in the statistics.
 */
export async function contrastGroups(
  input: ContrastInput,
  options: ContrastGroupsOptions = {},
): Promise<ContrastReport> {
  const q = options.q ?? 0.05;
  const level = options.level ?? 0.95;
  checkOptions(q, level);
  const settings = {
    q,
    level,
    dropOutliers: options.dropOutliers ?? false,
    outlierCutoff: options.outlierCutoff ?? 3.5,
    tolerance: options.tolerance ?? 4,
    ranges: (options.ranges ?? []).map((w) => ({ min: Math.min(w.min, w.max), max: Math.max(w.min, w.max) })),
    bandWindows: (options.bandWindows ?? []).map((w) => ({
      min: Math.min(w.min, w.max),
      max: Math.max(w.min, w.max),
    })),
  };
  const top = options.top ?? 5;
  const cols = gridLength(input.grid);
  const screen = {
    cutoff: settings.outlierCutoff,
    drop: settings.dropOutliers,
    minSize: options.minGroupSize ?? 3,
  };
  const a = screenGroup('a', input.a, cols, screen);
  const b = screenGroup('b', input.b, cols, screen);
  const axis = gridAxis(input.grid);
  const mask =
    settings.ranges.length === 0
      ? undefined
      : Uint8Array.from(axis, (x) => (settings.ranges.some((w) => x >= w.min && x <= w.max) ? 1 : 0));
  const stats = pointwiseContrast(a.kept, b.kept, { level, ...(mask === undefined ? {} : { mask }) });
  const regions = differenceRegions(stats, { q });
  const bands = describeBands(regions, stats, axis, input.grid.step, input, {
    tolerance: settings.tolerance,
    top,
    perBand: options.assignmentsPerBand ?? 3,
  });
  const bandTests = describeBandTests(
    bandAreaTests(
      { a: a.kept, b: b.kept, axis },
      { windows: settings.bandWindows, ranges: settings.ranges, level },
    ),
    input.assignments ?? shippedAssignments(),
    { q, perBand: options.assignmentsPerBand ?? 3 },
  );
  const library = input.library;
  const search = {
    higher: library === undefined ? null : await searchPart('higher', regions, stats, library, top),
    lower: library === undefined ? null : await searchPart('lower', regions, stats, library, top),
  };
  const group = (g: ContrastGroup, screened: typeof a, mean: Float64Array, sd: Float64Array) => ({
    label: g.label,
    read: g.spectra.length,
    n: screened.kept.length,
    outliers: screened.summaries.filter((s) => s.outlier).length,
    mean: nullable(mean),
    sd: nullable(sd),
  });
  let discoveries = 0;
  for (const r of regions) discoveries += r.to - r.from + 1;
  return contrastReportSchema.parse({
    version: CONTRAST_REPORT_VERSION,
    kind: 'contrast',
    created: options.created ?? new Date().toISOString(),
    library:
      library === undefined
        ? null
        : { name: library.source.name, release: library.source.at, stateKey: library.source.stateKey },
    grid: input.grid,
    settings,
    method: methodText(stats, settings, { a: input.a.label, b: input.b.label }),
    groups: {
      a: group(input.a, a, stats.meanA, stats.sdA),
      b: group(input.b, b, stats.meanB, stats.sdB),
    },
    spectra: [...a.summaries, ...b.summaries],
    pointwise: {
      difference: nullable(stats.difference),
      lower: nullable(stats.lower),
      upper: nullable(stats.upper),
      t: nullable(stats.t),
      df: nullable(stats.df),
      p: nullable(stats.p),
      q: nullable(stats.q),
      g: nullable(stats.g),
    },
    tested: stats.tested,
    discoveries,
    bands,
    bandTests,
    search,
    caution: CONTRAST_CAUTION,
  } satisfies ContrastReport);
}

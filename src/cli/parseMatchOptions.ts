// Turns the shared options of `match` and `identify` (the reading options among them) into checked values, one clear BAD_OPTION per mistake.
import { BandshelfError } from '../error.js';
import { rangeFromText } from '../match/rangeFromText.js';
import { type Metric, MIN_OVERLAP_DEFAULT } from '../match/searchTypes.js';
import { techniques } from '../schema/meta.js';
import type { WavenumberWindow } from '../schema/recipe.js';
import type { MatchUnknownsOptions } from './matchUnknowns.js';
import { readingOptions } from './readingOptions.js';

export interface ParseMatchOptionsOptions {
  /**
   * Whether the mixture fit runs when neither --mixture nor --no-mixture is given.
   * @default false
   */
  mixtureByDefault?: boolean;
}

const METRICS: readonly Metric[] = ['pearson', 'derivative', 'cosine', 'euclidean'];

function number(
  value: unknown,
  flag: string,
  check: (n: number) => boolean,
  what: string,
): number | undefined {
  if (value === undefined) return undefined;
  const n = typeof value === 'number' ? value : Number(String(value).trim());
  if (String(value).trim() === '' || !Number.isFinite(n) || !check(n)) {
    throw new BandshelfError('BAD_OPTION', `--${flag} must be ${what}, not '${String(value)}'`, {
      field: flag,
    });
  }
  return n;
}

function list(value: unknown): string[] {
  if (value === undefined) return [];
  const items = Array.isArray(value) ? value : [value];
  return items.flatMap((v) =>
    String(v)
      .split(',')
      .map((s) => s.trim())
      .filter((s) => s !== ''),
  );
}

/** `--range 1800:900` (either order, repeatable) → windows. */
function ranges(value: unknown): WavenumberWindow[] {
  return list(value).map((text) => rangeFromText(text, { label: '--range' }));
}

/** `--explain-region "C=O=1800:1700"` (repeatable) → the regions of "why this hit": LABEL=HIGH:LOW. */
function explainRegions(value: unknown): { label: string; min: number; max: number }[] | undefined {
  const texts = Array.isArray(value) ? value.map(String) : [];
  if (texts.length === 0) return undefined;
  return texts.map((text) => {
    const at = text.lastIndexOf('=');
    const label = at > 0 ? text.slice(0, at).trim() : '';
    if (label === '') {
      throw new BandshelfError('BAD_OPTION', `--explain-region wants LABEL=HIGH:LOW (not '${text}')`, {
        field: 'explain-region',
      });
    }
    const w = rangeFromText(text.slice(at + 1), { label: '--explain-region' });
    return { label, min: w.min, max: w.max };
  });
}

export function parseMatchOptions(
  options: Record<string, unknown>,
  settings: ParseMatchOptionsOptions = {},
): MatchUnknownsOptions {
  const metricText = String(options.metric ?? 'pearson');
  let metrics: Metric[];
  if (metricText === 'all') metrics = [...METRICS];
  else {
    metrics = list(metricText).map((m) => {
      if (!(METRICS as readonly string[]).includes(m)) {
        throw new BandshelfError(
          'BAD_OPTION',
          `--metric must be one of ${METRICS.join(', ')} or all, not '${m}'`,
          {
            field: 'metric',
          },
        );
      }
      return m as Metric;
    });
  }
  const degreeText = options.baselineDegree;
  // Unset: fitMixture's own default, the one owner of that rule.
  let baselineDegree: MatchUnknownsOptions['baselineDegree'];
  if (degreeText === 'none') baselineDegree = null;
  else if (degreeText !== undefined && degreeText !== 'auto') {
    baselineDegree = number(
      degreeText,
      'baseline-degree',
      (n) => Number.isInteger(n) && n >= 0 && n <= 6,
      'auto, none or 0–6',
    );
  }
  // commander sets `mixture` false for --no-mixture, true for --mixture, and leaves it out (or true by default).
  const mixture =
    options.mixture === undefined ? (settings.mixtureByDefault ?? false) : options.mixture !== false;
  const parsed: MatchUnknownsOptions = {
    library: options.library,
    keepPath: options.keepPath === true,
    ranges: ranges(options.range),
    ...(explainRegions(options.explainRegion) === undefined
      ? {}
      : { contributionRegions: explainRegions(options.explainRegion)! }),
    metrics,
    top: number(options.top, 'top', (n) => Number.isInteger(n) && n >= 1, 'a whole number ≥ 1') ?? 10,
    minOverlap:
      number(options.minOverlap, 'min-overlap', (n) => n >= 0, 'a number of cm⁻¹ ≥ 0') ?? MIN_OVERLAP_DEFAULT,
    mixture,
    with: list(options.with),
    excludeClass: list(options.excludeClass),
    exclude: list(options.exclude),
    onlyClass: list(options.onlyClass),
    ...(baselineDegree === undefined ? {} : { baselineDegree }),
  };
  // Left unset when not given: the match pipeline owns the defaults.
  const maxComponents = number(
    options.maxComponents,
    'max-components',
    (n) => Number.isInteger(n) && n >= 1,
    'a whole number ≥ 1',
  );
  if (maxComponents !== undefined) parsed.maxComponents = maxComponents;
  const candidates = number(
    options.candidates,
    'candidates',
    (n) => Number.isInteger(n) && n >= 1,
    'a whole number ≥ 1',
  );
  if (candidates !== undefined) parsed.candidates = candidates;
  const tolerance = number(options.tolerance, 'tolerance', (n) => n > 0, 'a positive number of cm⁻¹');
  if (tolerance !== undefined) parsed.tolerance = tolerance;
  const read = readingOptions(undefined, { flags: options });
  if (Object.keys(read).length > 0) parsed.read = read;
  if (typeof options.at === 'string') parsed.at = options.at;
  if (typeof options.recipe === 'string') parsed.recipe = options.recipe;
  if (options.technique !== undefined) {
    const technique = String(options.technique).trim().toLowerCase();
    if (!(techniques as readonly string[]).includes(technique)) {
      throw new BandshelfError(
        'BAD_OPTION',
        `--technique must be one of ${techniques.join(', ')}, not '${String(options.technique)}'`,
        { field: 'technique' },
      );
    }
    parsed.technique = technique;
  }
  if (parsed.with!.length > 0 && !mixture) {
    throw new BandshelfError('BAD_OPTION', '--with forces entries into the mixture fit: add --mixture', {
      field: 'with',
    });
  }
  return parsed;
}

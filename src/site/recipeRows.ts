// Describes a processing recipe step by step in words, for the entry page (the JSON download keeps the recipe).
import type { Recipe } from '../schema/recipe.js';
import { formatNumber } from './formatNumber.js';
import type { SiteRow } from './types.js';

export interface RecipeRowsOptions {
  /** Leave out steps that do nothing (no crop, no smoothing …).
   * @default false */
  skipNone?: boolean;
}

function windowText(w: { min: number; max: number }): string {
  return `${formatNumber(w.max, { decimals: 0 })}–${formatNumber(w.min, { decimals: 0 })} cm⁻¹`;
}

/** In the order the steps run (see processSpectrum). */
export function recipeRows(recipe: Recipe, options: RecipeRowsOptions = {}): SiteRow[] {
  const rows: SiteRow[] = [];
  const add = (label: string, value: string | null): void => {
    if (value === null && options.skipNone) return;
    rows.push({ label, value: value ?? 'none' });
  };
  const td = recipe.timeDomain;
  if (td) {
    const gate = td.gate
      ? `, gate ${td.gate.start}–${td.gate.end} ${td.timeUnit} (edge ${td.gate.edge})`
      : '';
    add(
      'Time-domain traces',
      `${td.apodisation} window${gate}, zero-fill ×${td.zeroFill}, coverage where reference power > ${formatNumber(td.powerThreshold)} of its peak`,
    );
  }
  add('Crop', recipe.crop ? windowText(recipe.crop) : null);
  add('Excluded', recipe.exclude.length > 0 ? recipe.exclude.map(windowText).join(', ') : null);
  const b = recipe.baseline;
  add(
    'Baseline',
    b.method === 'none'
      ? null
      : b.method === 'als'
        ? `asymmetric least squares (λ ${formatNumber(b.lambda)}, p ${formatNumber(b.p)})`
        : b.method === 'airpls'
          ? `airPLS (λ ${formatNumber(b.lambda)})`
          : 'rubberband (lower convex hull)',
  );
  add(
    'Reference subtracted',
    recipe.reference
      ? `${recipe.reference.id}${recipe.reference.revision ? ` revision ${recipe.reference.revision}` : ''}, scaled in ${windowText(recipe.reference.window)}`
      : null,
  );
  add(
    'EMSC',
    recipe.emsc
      ? `against ${recipe.emsc.id}${recipe.emsc.revision ? ` revision ${recipe.emsc.revision}` : ''}, polynomial degree ${recipe.emsc.degree}`
      : null,
  );
  add(
    'Smoothing',
    recipe.smooth
      ? `Savitzky–Golay, ${recipe.smooth.width === undefined ? `${recipe.smooth.window ?? 9} points` : `${recipe.smooth.width} cm⁻¹`}, order ${recipe.smooth.order}`
      : null,
  );
  add(
    'Resampling',
    `onto the library grid; gaps wider than ${formatNumber(recipe.resample.maxGap)} cm⁻¹ left not covered`,
  );
  const n = recipe.normalise;
  add(
    'Normalisation',
    n.method === 'none'
      ? null
      : n.method === 'band'
        ? `band maximum in ${windowText(n.window)} = 1`
        : n.method === 'vector'
          ? 'unit vector (L2)'
          : n.method === 'minmax'
            ? 'min–max'
            : 'unit area',
  );
  return rows;
}

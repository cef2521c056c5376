// The mixture fit with the unknown and its references at one common resolution: the coarsest of those that matter.
import { BandshelfError } from '../../error.js';
import type { Recipe, WavenumberWindow } from '../../schema/recipe.js';
import { processSpectrum } from '../../spectrum/processSpectrum.js';
import type { Spectrum } from '../../spectrum/types.js';
import { comparedResolution, LIKE_RESOLUTION_TOLERANCE } from '../comparedResolution.js';
import { entryResolution } from '../entryResolution.js';
import { recipeAtResolution } from '../recipeAtResolution.js';
import { reprocessOverWindow } from '../reprocessOverWindow.js';
import type { MixtureCandidate, MixtureResult } from '../types.js';
import type { EntryOriginal, MatchSource } from './types.js';

export interface FitAtCommonResolutionInput {
  source: MatchSource;
  /** The unknown as read, its own resolution (cm⁻¹; NaN when unknown) and its clipped points. */
  unknown: { spectrum: Spectrum; resolution: number; saturated?: Uint8Array };
  /** The unknown processed with `recipe` as the hits were scored. */
  processed: Float64Array;
  /** The recipe the unknown was processed with (its resolution step pinned). */
  recipe: Recipe;
  /** The reference spectra `recipe` names. */
  references: ReadonlyMap<string, Spectrum>;
  /** The candidates offered (stored vectors, or processed again over `window`), with the source row of each. */
  candidates: readonly (MixtureCandidate & { row: number })[];
  /** The unknown's span when the candidates were processed again over it, else null. */
  window: WavenumberWindow | null;
  /** The fit itself (fitMixture with the caller's settings). */
  fitWith: (processed: Float64Array, candidates: MixtureCandidate[]) => MixtureResult;
}

export interface FitAtCommonResolutionOptions {
  /** Resolutions within this fraction of the finer one count as equal. @default LIKE_RESOLUTION_TOLERANCE (0.25) */
  tolerance?: number;
  /** Rounds of raising the common resolution to the coarsest fitted component's. @default 3 */
  rounds?: number;
}

export interface CommonResolutionFit {
  mixture: MixtureResult;
  /** The candidates as fitted (sharper ones degraded to the common resolution). */
  candidates: MixtureCandidate[];
  /** The unknown as fitted (degraded when the common resolution is coarser than its own). */
  processed: Float64Array;
  /** The common resolution, cm⁻¹, and what was degraded to it; null when nothing had to be. */
  resolution: { common: number; unknown: number; degraded: string[]; unknownDegraded: boolean } | null;
}

/**
 * Like with like in the mixture fit. The common resolution starts at the unknown's (as compared under its recipe:
 * a resolution step's target is a floor). Every candidate sharper than it by more than `tolerance` is processed
 * again from its original with its own recipe and a Gaussian line shape that brings it there (FWHM
 * √(common² − own²); Gaussian widths add in quadrature, common practice), over the unknown's span when the
 * candidates were. A candidate coarser than the unknown cannot be sharpened; when the fit keeps one, the common
 * resolution is raised to the coarsest kept component's, the unknown and the sharper candidates are degraded to
 * it, and the fit is made again (at most `rounds` times). Candidates whose resolution is not known, or whose recipe
 * cannot run again, keep their vectors. Browser-safe.
 */
export async function fitAtCommonResolution(
  input: FitAtCommonResolutionInput,
  options: FitAtCommonResolutionOptions = {},
): Promise<CommonResolutionFit> {
  const { source, unknown, recipe, candidates, window, fitWith } = input;
  const tolerance = options.tolerance ?? LIKE_RESOLUTION_TOLERANCE;
  const atUnknown = Number.isFinite(unknown.resolution)
    ? comparedResolution(unknown.resolution, recipe)
    : Number.NaN;
  if (!(atUnknown > 0) || candidates.length === 0) {
    const mixture = fitWith(input.processed, [...candidates]);
    return { mixture, candidates: [...candidates], processed: input.processed, resolution: null };
  }
  const originals: ReadonlyMap<number, EntryOriginal> = await source.originals([
    ...new Set(candidates.map((c) => c.row)),
  ]);
  const ownOf = new Map<number, number>();
  const atOf = new Map<number, number>();
  for (const [row, view] of originals) {
    const own = entryResolution(view);
    if (Number.isFinite(own) && own > 0) {
      ownOf.set(row, own);
      atOf.set(row, comparedResolution(own, view.recipe));
    }
  }
  const sharper = (at: number, than: number) => at < than && than - at > tolerance * at;
  const degradeEntry = (row: number, target: number): Float64Array | null => {
    const view = originals.get(row)!;
    const atTarget = recipeAtResolution(view.recipe, { own: ownOf.get(row)!, target });
    try {
      const again =
        window === null
          ? null
          : reprocessOverWindow(view.original, atTarget, source.grid, window, {
              references: view.references,
            });
      return (
        again ??
        processSpectrum(view.original, atTarget, source.grid, { references: new Map(view.references) })
          .processed
      );
    } catch (error) {
      if (error instanceof BandshelfError) return null;
      throw error;
    }
  };
  const at = (common: number) => {
    const degraded: string[] = [];
    const fitted = candidates.map((c): MixtureCandidate => {
      const entryAt = atOf.get(c.row);
      if (entryAt === undefined || !sharper(entryAt, common)) return c;
      const vector = degradeEntry(c.row, common);
      if (vector === null) return c;
      if (!degraded.includes(c.id)) degraded.push(c.id);
      return { ...c, vector };
    });
    const unknownDegraded = sharper(atUnknown, common);
    const processed = unknownDegraded
      ? processSpectrum(
          unknown.spectrum,
          recipeAtResolution(recipe, { own: unknown.resolution, target: common }),
          source.grid,
          {
            references: new Map(input.references),
            ...(unknown.saturated === undefined ? {} : { saturated: unknown.saturated }),
          },
        ).processed
      : input.processed;
    return { fitted, degraded, unknownDegraded, processed };
  };

  let common = atUnknown;
  let round = at(common);
  let mixture = fitWith(round.processed, round.fitted);
  const rowOf = new Map(candidates.map((c) => [c.id, c.row]));
  for (let k = 0; k < (options.rounds ?? 3); k++) {
    const coarsest = Math.max(
      common,
      ...mixture.components.map((c) => atOf.get(rowOf.get(c.id) ?? -1) ?? common),
    );
    if (!sharper(common, coarsest)) break;
    common = coarsest;
    round = at(common);
    mixture = fitWith(round.processed, round.fitted);
  }
  const changed = round.degraded.length > 0 || round.unknownDegraded;
  return {
    mixture,
    candidates: round.fitted,
    processed: round.processed,
    resolution: changed
      ? { common, unknown: atUnknown, degraded: round.degraded, unknownDegraded: round.unknownDegraded }
      : null,
  };
}

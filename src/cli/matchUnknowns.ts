// Runs the whole match of one or more unknown files against a library: read, process, search, fit, identify, report.
import { basename, resolve } from 'node:path';
import { BandshelfError, errorLine } from '../error.js';
import type { SpectrumReadOptions } from '../formats/types.js';
import { closeLibrary } from '../library/store/closeLibrary.js';
import { libraryPath } from '../library/store/libraryPath.js';
import { listAssignments } from '../library/store/listAssignments.js';
import { openLibrary } from '../library/store/openLibrary.js';
import { readRecipeFile } from '../library/store/readRecipeFile.js';
import { readSearchSet } from '../library/store/readSearchSet.js';
import { recipeReferences } from '../library/store/recipeReferences.js';
import type { SearchSet } from '../library/types.js';
import { buildBandIndex } from '../match/buildBandIndex.js';
import { libraryMatchSource } from '../match/libraryMatchSource.js';
import { checkMatchSource } from '../match/pipeline/checkMatchSource.js';
import { type RunMatchPipelineOptions, runMatchPipeline } from '../match/pipeline/runMatchPipeline.js';
import type { MatchUnknown } from '../match/pipeline/types.js';
import { shippedAssignments } from '../match/shippedAssignments.js';
import type { MatchReport } from '../schema/matchReport.js';
import type { CommandContext } from './command.js';
import { flagWording } from './flagWording.js';
import { readTimeDomainUnknown } from './readTimeDomainUnknown.js';
import { readUnknownFile } from './readUnknownFile.js';
import { spectrumFilesOf } from './spectrumFilesOf.js';

/** The pipeline's settings as the CLI takes them, plus where the library, release and recipe file are. */
export interface MatchUnknownsOptions
  extends Omit<
    RunMatchPipelineOptions,
    'recipe' | 'recipeSource' | 'references' | 'fitExcludeClass' | 'index'
  > {
  /** --library as given. @default './bandshelf.sqlite' */
  library?: unknown;
  /** A release tag. @default undefined (working state) */
  at?: string;
  /** A recipe JSON file overriding the library's default recipe. @default undefined */
  recipe?: string;
  /** Keep the unknown's path as given in the report (else its file name only). @default false */
  keepPath?: boolean;
  /**
   * How to read the unknowns (units, block, column; or time-domain sample traces with their references, which
   * make one unknown together, as `add --time-domain` makes one entry). @default {} (as the files say)
   */
  read?: SpectrumReadOptions;
  /**
   * How the unknowns were measured, as entry metadata says it (`atr` → the ATR correction ATR entries get).
   * @default undefined (the file's own label, if any; else no ATR correction)
   */
  technique?: string;
}

export interface MatchOutcome {
  /** The file as the user named it (a folder's files joined onto the folder as given). */
  file: string;
  block?: number;
  /** The y column of a multi-column delimited file. */
  column?: string;
  report?: MatchReport;
  /** The one-line error when this unknown failed (batch mode keeps going). */
  error?: string;
}

export interface MatchRun {
  outcomes: MatchOutcome[];
  /** More than one unknown (a folder, several files, a multi-block or a multi-column file). */
  batch: boolean;
  warnings: string[];
}

/**
 * One unknown → one report, each through `runMatchPipeline`. In batch mode an unknown that cannot be read,
 * processed or scored is recorded with its error and the rest go on; a single unknown's error is thrown.
 * Library-level problems (no library, empty library, unknown release, a `--with` id that does not exist) always throw.
 */
export async function matchUnknowns(
  targets: readonly string[],
  options: MatchUnknownsOptions,
  context: CommandContext,
): Promise<MatchRun> {
  if (targets.length === 0) throw new BandshelfError('BAD_OPTION', 'name an unknown spectrum file or folder');
  const forced = [...new Set(options.with ?? [])];
  const library = openLibrary(libraryPath(options.library, context.cwd), { readonly: true });
  try {
    // Lazy: with a current disk cache the processed vectors stay in the file; hits and candidates read their rows.
    const set: SearchSet = readSearchSet(library, {
      lazy: true,
      ...(options.at === undefined ? {} : { at: options.at }),
    });
    const { source, scorer } = libraryMatchSource(
      library,
      set,
      options.at === undefined ? {} : { at: options.at },
    );
    try {
      checkMatchSource(source, { with: forced });
    } catch (error) {
      if (!(error instanceof BandshelfError)) throw error;
      const hint =
        error.code === 'EMPTY_LIBRARY' && set.at === null ? ' (add some with `bandshelf add`)' : '';
      throw new BandshelfError(error.code, `${flagWording(error.message)}${hint}`, { field: error.field });
    }
    const recipe =
      options.recipe === undefined
        ? undefined
        : readRecipeFile(resolve(context.cwd, options.recipe), { label: options.recipe });
    const settings: RunMatchPipelineOptions = {
      ...(recipe === undefined
        ? {}
        : {
            recipe,
            recipeSource: 'file' as const,
            references: recipeReferences(library, recipe, options.at === undefined ? {} : { at: options.at }),
          }),
      ranges: options.ranges ?? [],
      ...(options.metrics === undefined ? {} : { metrics: options.metrics }),
      ...(options.top === undefined ? {} : { top: options.top }),
      ...(options.minOverlap === undefined ? {} : { minOverlap: options.minOverlap }),
      mixture: options.mixture === true,
      with: forced,
      excludeClass: options.excludeClass ?? [],
      exclude: options.exclude ?? [],
      onlyClass: options.onlyClass ?? [],
      ...(options.maxComponents === undefined ? {} : { maxComponents: options.maxComponents }),
      ...(options.candidates === undefined ? {} : { candidates: options.candidates }),
      ...(options.baselineDegree === undefined ? {} : { baselineDegree: options.baselineDegree }),
      ...(options.tolerance === undefined ? {} : { tolerance: options.tolerance }),
      index: buildBandIndex(set),
      ...(options.contributionRegions === undefined
        ? {}
        : { contributionRegions: options.contributionRegions }),
    };
    const assignments = [...shippedAssignments(), ...listAssignments(library)];

    const read = options.read ?? {};
    const outcomes: MatchOutcome[] = [];
    const warnings: string[] = [];
    if (read.timeDomain === true) {
      const unknown = readTimeDomainUnknown(
        { samples: targets, references: read.references ?? [], recipe: recipe ?? source.recipe },
        {
          cwd: context.cwd,
          keepPath: options.keepPath === true,
          ...(read.timeUnit === undefined ? {} : { timeUnit: read.timeUnit }),
          gridStep: source.grid.step,
          ...(options.technique === undefined ? {} : { technique: options.technique }),
        },
      );
      const report = await runMatchPipeline({ unknown, source, scorer, assignments }, settings);
      for (const w of report.query.warnings) warnings.push(`${targets[0]}: ${w}`);
      return { outcomes: [{ file: targets[0]!, report }], batch: false, warnings };
    }
    const files = targets.flatMap((t) => spectrumFilesOf(t, { cwd: context.cwd }));
    const single = files.length === 1;
    for (const [i, file] of files.entries()) {
      context.progress(i, files.length, basename(file));
      let unknowns: MatchUnknown[];
      try {
        unknowns = readUnknownFile(file, {
          cwd: context.cwd,
          keepPath: options.keepPath === true,
          read,
          ...(options.technique === undefined ? {} : { technique: options.technique }),
        });
      } catch (error) {
        if (single) throw error;
        outcomes.push({ file, error: errorLine(error) });
        continue;
      }
      for (const unknown of unknowns) {
        const outcome: MatchOutcome = {
          file,
          ...(unknown.block === undefined ? {} : { block: unknown.block }),
          ...(unknown.column === undefined ? {} : { column: unknown.column }),
        };
        outcomes.push(outcome);
        try {
          outcome.report = await runMatchPipeline({ unknown, source, scorer, assignments }, settings);
        } catch (error) {
          if (single && unknowns.length === 1) throw error;
          outcome.error = errorLine(error);
        }
        // The reader's warnings, the resolution step's and the like-with-like notes, as the report records them.
        for (const w of outcome.report?.query.warnings ?? unknown.warnings) warnings.push(`${file}: ${w}`);
      }
    }
    context.progress(files.length, files.length, 'done');
    return { outcomes, batch: outcomes.length > 1, warnings };
  } finally {
    closeLibrary(library);
  }
}

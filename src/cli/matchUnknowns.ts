// Runs the whole match of one or more unknown files against a library: read, process, search, fit, identify, report.
import { createHash } from 'node:crypto';
import { basename, resolve } from 'node:path';
import { BandshelfError, errorLine } from '../error.js';
import type { SpectrumReadOptions } from '../formats/types.js';
import type { SourceFile } from '../library/ingest/ingestTypes.js';
import { closeLibrary } from '../library/store/closeLibrary.js';
import { libraryPath } from '../library/store/libraryPath.js';
import { listAssignments } from '../library/store/listAssignments.js';
import { openLibrary } from '../library/store/openLibrary.js';
import { readOriginals } from '../library/store/readOriginals.js';
import { readRecipeFile } from '../library/store/readRecipeFile.js';
import { readRegularFile } from '../library/store/readRegularFile.js';
import { readSearchSet } from '../library/store/readSearchSet.js';
import { recipeReferences } from '../library/store/recipeReferences.js';
import type { SearchSet } from '../library/types.js';
import { buildBandIndex } from '../match/buildBandIndex.js';
import { compareAtCoarserResolution } from '../match/compareAtCoarserResolution.js';
import { libraryMatchSource } from '../match/libraryMatchSource.js';
import { type RunMatchPipelineOptions, runMatchPipeline } from '../match/pipeline/runMatchPipeline.js';
import type { MatchUnknown } from '../match/pipeline/types.js';
import { resolutionForUnknown } from '../match/resolutionForUnknown.js';
import { MIN_OVERLAP_DEFAULT } from '../match/searchTypes.js';
import { shippedAssignments } from '../match/shippedAssignments.js';
import type { MatchReport } from '../schema/matchReport.js';
import { type Recipe, timeDomainSchema } from '../schema/recipe.js';
import { resolutionOf } from '../spectrum/resolutionOf.js';
import { pinNoiseFloor } from '../spectrum/trace/pinNoiseFloor.js';
import type { CommandContext } from './command.js';
import { readUnknownFile, type UnknownOfFile } from './readUnknownFile.js';
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

function readBytes(file: string, cwd: string): Uint8Array {
  return readRegularFile(resolve(cwd, file), { label: file });
}

function warningLines(warnings: readonly { line?: number; message: string }[]): string[] {
  return warnings.map((w) => (w.line === undefined ? w.message : `line ${w.line}: ${w.message}`));
}

/**
 * Sample traces and reference traces → one unknown, through the same conversion `add --time-domain` uses (the
 * recipe's time-domain step, the library default's, or the step's defaults). Its hash is the SHA-256 of the
 * sample files' bytes followed by the references', in the order given.
 */
function readTimeDomainUnknown(
  samples: readonly string[],
  references: readonly string[],
  settings: { cwd: string; keepPath: boolean; recipe: Recipe; timeUnit?: 'fs' | 'ps' },
): MatchUnknown {
  const hash = createHash('sha256');
  const files: SourceFile[] = [
    ...samples.map((f) => ({ role: 'sample-trace' as const, f })),
    ...references.map((f) => ({ role: 'reference-trace' as const, f })),
  ].map(({ role, f }) => {
    const bytes = readBytes(f, settings.cwd);
    hash.update(bytes);
    return { role, name: basename(f), bytes };
  });
  const step = pinNoiseFloor(settings.recipe.timeDomain ?? timeDomainSchema.parse({}));
  const [original] = readOriginals(
    {
      files,
      read: settings.timeUnit === undefined ? {} : { timeUnit: settings.timeUnit },
      recipe: { ...settings.recipe, timeDomain: step },
    },
    { label: samples[0] },
  );
  return {
    file: settings.keepPath ? samples[0]! : basename(samples[0]!),
    hash: hash.digest('hex'),
    spectrum: original!.spectrum,
    warnings: warningLines(original!.extras.warnings ?? []),
  };
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
    if (set.entries.length === 0) {
      throw new BandshelfError(
        'EMPTY_LIBRARY',
        set.at === null
          ? 'the library has no entries to match against (add some with `bandshelf add`)'
          : `release '${set.at}' holds no entries to match against`,
      );
    }
    const ids = new Set(set.entries.map((e) => e.id));
    for (const id of forced) {
      if (!ids.has(id)) {
        throw new BandshelfError(
          'NOT_FOUND',
          `--with names '${id}', which is not an entry of ${set.at === null ? 'the library' : `release '${set.at}'`}`,
          { field: 'with' },
        );
      }
    }
    const { source, scorer } = libraryMatchSource(
      library,
      set,
      options.at === undefined ? {} : { at: options.at },
    );
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
      metrics: options.metrics ?? ['pearson'],
      top: options.top ?? 10,
      minOverlap: options.minOverlap ?? MIN_OVERLAP_DEFAULT,
      mixture: options.mixture === true,
      with: forced,
      excludeClass: options.excludeClass ?? [],
      exclude: options.exclude ?? [],
      onlyClass: options.onlyClass ?? [],
      maxComponents: options.maxComponents ?? 6,
      candidates: options.candidates ?? 30,
      ...(options.baselineDegree === undefined ? {} : { baselineDegree: options.baselineDegree }),
      tolerance: options.tolerance ?? 4,
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
      const unknown = readTimeDomainUnknown(targets, read.references ?? [], {
        cwd: context.cwd,
        keepPath: options.keepPath === true,
        recipe: recipe ?? source.recipe,
        ...(read.timeUnit === undefined ? {} : { timeUnit: read.timeUnit }),
      });
      const report = await runMatchPipeline({ unknown, source, scorer, assignments }, settings);
      for (const w of unknown.warnings) warnings.push(`${targets[0]}: ${w}`);
      return { outcomes: [{ file: targets[0]!, report }], batch: false, warnings };
    }
    const files = targets.flatMap((t) => spectrumFilesOf(t, { cwd: context.cwd }));
    const single = files.length === 1;
    for (const [i, file] of files.entries()) {
      context.progress(i, files.length, basename(file));
      let unknowns: UnknownOfFile[];
      try {
        unknowns = readUnknownFile(file, { cwd: context.cwd, keepPath: options.keepPath === true, read });
      } catch (error) {
        if (single) throw error;
        outcomes.push({ file, error: errorLine(error) });
        continue;
      }
      for (const { resolution: stated, ...given } of unknowns) {
        const matched = resolutionForUnknown(given.spectrum, settings.recipe ?? source.recipe, { stated });
        const unknown: MatchUnknown = { ...given, warnings: [...given.warnings, ...matched.warnings] };
        const unknownSettings =
          matched.recipe === (settings.recipe ?? source.recipe)
            ? settings
            : { ...settings, recipe: matched.recipe };
        const outcome: MatchOutcome = {
          file,
          ...(unknown.block === undefined ? {} : { block: unknown.block }),
          ...(unknown.column === undefined ? {} : { column: unknown.column }),
        };
        outcomes.push(outcome);
        let notes: string[] = [];
        try {
          const report = await runMatchPipeline({ unknown, source, scorer, assignments }, unknownSettings);
          // Like with like: hits of another resolution are scored again at the coarser of the two.
          const own = resolutionOf(given.spectrum, { stated }).value;
          const alike = await compareAtCoarserResolution(
            { report, unknown: given.spectrum, resolution: own, source },
            settings.references === undefined ? {} : { references: settings.references },
          );
          outcome.report = alike.report;
          notes = alike.notes;
        } catch (error) {
          if (single && unknowns.length === 1) throw error;
          outcome.error = errorLine(error);
        }
        for (const w of [...unknown.warnings, ...notes]) warnings.push(`${file}: ${w}`);
      }
    }
    context.progress(files.length, files.length, 'done');
    return { outcomes, batch: outcomes.length > 1, warnings };
  } finally {
    closeLibrary(library);
  }
}

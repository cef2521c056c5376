// Runs `contrast` against a library: reads both groups' files, processes them with the library's recipe, contrasts.
import { readFileSync } from 'node:fs';
import { dirname, isAbsolute, join, resolve } from 'node:path';
import { BandshelfError } from '../error.js';
import type { SpectrumReadOptions } from '../formats/types.js';
import { closeLibrary } from '../library/store/closeLibrary.js';
import { describeIoError } from '../library/store/describeIoError.js';
import { libraryPath } from '../library/store/libraryPath.js';
import { listAssignments } from '../library/store/listAssignments.js';
import { openLibrary } from '../library/store/openLibrary.js';
import { readSearchSet } from '../library/store/readSearchSet.js';
import { buildBandIndex } from '../match/buildBandIndex.js';
import {
  type ContrastGroupsOptions,
  type ContrastSpectrum,
  contrastGroups,
} from '../match/contrast/contrastGroups.js';
import { libraryMatchSource } from '../match/libraryMatchSource.js';
import type { MatchSource } from '../match/pipeline/types.js';
import { shippedAssignments } from '../match/shippedAssignments.js';
import type { ContrastReport } from '../schema/contrastReport.js';
import { processSpectrum } from '../spectrum/processSpectrum.js';
import { qcFlags } from '../spectrum/qcFlags.js';
import type { CommandContext } from './command.js';
import { readUnknownFile } from './readUnknownFile.js';
import { spectrumFilesOf } from './spectrumFilesOf.js';

export interface ContrastCohortOptions extends ContrastGroupsOptions {
  /** --library as given. @default './bandshelf.sqlite' */
  library?: unknown;
  /** A release tag whose recipe, grid and entries to use. @default undefined (working state) */
  at?: string;
  /** Reading options, the same for every file of both groups. @default {} */
  read?: SpectrumReadOptions;
}

export interface ContrastCohortRun {
  report: ContrastReport;
  warnings: string[];
}

/**
 * A CSV whose header has a `file` column lists the group's spectrum files (relative to the CSV's folder); any
 * other target is a spectrum file or a folder of them.
 */
function groupFiles(target: string, cwd: string): string[] {
  if (target.toLowerCase().endsWith('.csv')) {
    let text: string;
    try {
      text = readFileSync(resolve(cwd, target), 'utf8');
    } catch (error) {
      throw new BandshelfError('IO_ERROR', `cannot read: ${describeIoError(error)}`, {
        file: target,
        cause: error,
      });
    }
    const lines = text.split(/\r?\n/).filter((l) => l.trim() !== '');
    const header = (lines[0] ?? '').split(',').map((c) => c.trim().replace(/^"|"$/g, '').toLowerCase());
    const column = header.indexOf('file');
    if (column >= 0) {
      const files = lines.slice(1).map((l) => (l.split(',')[column] ?? '').trim().replace(/^"|"$/g, ''));
      return files.filter((f) => f !== '').map((f) => (isAbsolute(f) ? f : join(dirname(target), f)));
    }
  }
  return spectrumFilesOf(target, { cwd });
}

/** Every spectrum of one group read and processed exactly like a `match` unknown, with its QC flags. */
function readGroup(
  target: string,
  source: MatchSource,
  read: SpectrumReadOptions,
  cwd: string,
  warnings: string[],
): ContrastSpectrum[] {
  const spectra: ContrastSpectrum[] = [];
  const recipe = source.recipe;
  for (const file of groupFiles(target, cwd)) {
    const readAs = {
      ...(read.xUnit === undefined ? {} : { xUnit: read.xUnit }),
      ...(read.yUnit === undefined ? {} : { yUnit: read.yUnit }),
      ...(read.block === undefined ? {} : { block: read.block }),
    };
    for (const unknown of readUnknownFile(file, { cwd, read: readAs })) {
      const { processed } = processSpectrum(unknown.spectrum, recipe, source.grid, {
        references: new Map(source.references),
        file,
        ...(unknown.saturated === undefined ? {} : { saturated: unknown.saturated }),
      });
      const qc = qcFlags(unknown.spectrum, processed, source.grid, {
        maxGap: recipe.resample.maxGap,
        exclude: recipe.exclude,
        crop: recipe.crop,
      });
      for (const w of unknown.warnings) warnings.push(`${file}: ${w}`);
      spectra.push({
        file: unknown.file,
        ...(unknown.block === undefined ? {} : { block: unknown.block }),
        hash: unknown.hash,
        processed,
        qc,
      });
    }
  }
  return spectra;
}

/** Any file that cannot be read or processed stops the contrast: a group is never quietly made smaller. */
export async function contrastCohort(
  groups: { a: { target: string; label: string }; b: { target: string; label: string } },
  options: ContrastCohortOptions,
  context: CommandContext,
): Promise<ContrastCohortRun> {
  const read = options.read ?? {};
  if (read.timeDomain === true || read.column !== undefined) {
    throw new BandshelfError(
      'BAD_OPTION',
      'contrast reads absorbance spectra only (no --time-domain or --column)',
      {
        field: read.timeDomain === true ? 'time-domain' : 'column',
      },
    );
  }
  const library = openLibrary(libraryPath(options.library, context.cwd), { readonly: true });
  try {
    const set = readSearchSet(library, options.at === undefined ? {} : { at: options.at });
    const { source, scorer } = libraryMatchSource(
      library,
      set,
      options.at === undefined ? {} : { at: options.at },
    );
    const warnings: string[] = [];
    context.progress(0, 2, groups.a.label);
    const a = readGroup(groups.a.target, source, read, context.cwd, warnings);
    context.progress(1, 2, groups.b.label);
    const b = readGroup(groups.b.target, source, read, context.cwd, warnings);
    context.progress(2, 2, 'done');
    const report = await contrastGroups(
      {
        a: { label: groups.a.label, spectra: a },
        b: { label: groups.b.label, spectra: b },
        grid: source.grid,
        ...(set.entries.length === 0 ? {} : { library: { source, scorer, index: buildBandIndex(set) } }),
        assignments: [...shippedAssignments(), ...listAssignments(library)],
      },
      options,
    );
    return { report, warnings };
  } finally {
    closeLibrary(library);
  }
}

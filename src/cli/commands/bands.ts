// `bandshelf bands`: finds library entries with stored peaks at given positions, or at the bands of a spectrum file.
import { BandshelfError } from '../../error.js';
import type { SpectrumReadOptions } from '../../formats/types.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import { readPeakSet } from '../../library/store/readPeakSet.js';
import { recipeReferences } from '../../library/store/recipeReferences.js';
import type { Library } from '../../library/types.js';
import { buildBandIndex } from '../../match/buildBandIndex.js';
import { parseBandQuery } from '../../match/parseBandQuery.js';
import type { MatchUnknown } from '../../match/pipeline/types.js';
import { type SearchBandsOptions, searchBands } from '../../match/searchBands.js';
import { type SpectrumBandSearch, searchBandsOfSpectrum } from '../../match/searchBandsOfSpectrum.js';
import { BAND_TOLERANCE_CM1, type BandIndex, type BandQuery } from '../../match/types.js';
import { MATCH_CAUTION } from '../../schema/matchReport.js';
import type { CommandSpec } from '../command.js';
import { readingOptions } from '../readingOptions.js';
import { readTimeDomainUnknown } from '../readTimeDomainUnknown.js';
import { readUnknownFile } from '../readUnknownFile.js';
import { textTable } from '../textTable.js';

function positiveNumber(value: unknown, flag: string, integer: boolean): number {
  const n = Number(String(value).trim());
  if (String(value).trim() === '' || !Number.isFinite(n) || n <= 0 || (integer && !Number.isInteger(n))) {
    throw new BandshelfError(
      'BAD_OPTION',
      `--${flag} must be a positive ${integer ? 'whole number' : 'number'}, not '${String(value)}'`,
      { field: flag },
    );
  }
  return n;
}

interface FromFileSettings {
  library: Library;
  at: string | undefined;
  read: SpectrumReadOptions;
  index: BandIndex;
  search: SearchBandsOptions;
  maxBands: number;
  cwd: string;
  /** Warnings and notes for standard error, appended to. */
  notes: string[];
}

/** The file read like a `match` unknown (its first spectrum), then the match layer's search from its bands. */
function searchFromFile(from: string, settings: FromFileSettings): SpectrumBandSearch & { name: string } {
  const { library, at, read, cwd } = settings;
  const recipe = library.recipe;
  const unknowns: MatchUnknown[] =
    read.timeDomain === true
      ? [
          readTimeDomainUnknown(
            { samples: [from], references: read.references ?? [], recipe },
            { cwd, ...(read.timeUnit === undefined ? {} : { timeUnit: read.timeUnit }) },
          ),
        ]
      : readUnknownFile(from, { cwd, read });
  const unknown = unknowns[0]!;
  if (unknowns.length > 1) {
    settings.notes.push(
      `${from} holds ${unknowns.length} spectra; bands searches with the first (pick one with --column or --block)`,
    );
  }
  for (const w of unknown.warnings) settings.notes.push(`${from}: ${w}`);
  const found = searchBandsOfSpectrum(
    {
      spectrum: unknown.spectrum,
      ...(unknown.saturated === undefined ? {} : { saturated: unknown.saturated }),
      ...(unknown.resolution === undefined ? {} : { resolution: unknown.resolution }),
      file: from,
      recipe,
      grid: library.grid,
      references: recipeReferences(library, recipe, at === undefined ? {} : { at }),
      index: settings.index,
    },
    { ...settings.search, maxBands: settings.maxBands },
  );
  return { ...found, name: unknown.file };
}

export const bandsCommand: CommandSpec = {
  name: 'bands',
  summary: 'find entries with peaks at the given band positions',
  example: [
    'bandshelf bands 1652 1545 1240                # ranked by bands matched, then position error',
    'bandshelf bands 1652:s 1545:m 1080:w --tolerance 6 --require-all',
    "bandshelf bands --from unknown-serum.csv      # the file's own bands, read as match reads an unknown",
    'bandshelf bands --from old-bench.txt --y-unit %T --max-bands 8',
    '',
    "With --from the file is read with the reading options below, processed with the library's recipe onto its grid",
    'and its bands found as the stored peaks were (its --max-bands most prominent, each rated s/m/w against its',
    'strongest); those are the query.',
    'A stored peak within ±tolerance cm⁻¹ matches a band. Strengths compare the peak with the entry’s strongest',
    'one: s ≥ 0.6, m ≥ 0.25, w below. score = mean over the bands of (1 − |error| / (2 × tolerance)) × strength',
    'agreement (1 same, 0.75 adjacent, 0.5 strong vs weak); unmatched bands count 0.',
  ].join('\n'),
  configure(command) {
    command
      .argument('[positions...]', 'band positions in cm⁻¹, e.g. 1652, 1652cm-1 or 1652:s')
      .option('--from <file>', 'search with the bands of this spectrum file instead of positions')
      .option('--max-bands <n>', 'with --from: search with this many of its most prominent bands', '12')
      .option('--library <path>', 'library file', 'bandshelf.sqlite')
      .option('--at <tag>', 'search a release instead of the working state')
      .option(
        '--tolerance <cm-1>',
        'largest position difference that still matches',
        String(BAND_TOLERANCE_CM1),
      )
      .option('--require-all', 'only entries that match every band')
      .option('--top <n>', 'hits to list', '20')
      .option('--json', 'print {hits:[{id,revision,name,class,matched,score,meanError,matches}]} as JSON');
    readingOptions(command);
  },
  async run(args, options, context) {
    const texts = (args[0] as string[] | undefined) ?? [];
    const from = typeof options.from === 'string' ? options.from : undefined;
    const read = readingOptions(undefined, { flags: options });
    if (from === undefined && (read.timeDomain === true || Object.keys(read).length > 0)) {
      throw new BandshelfError('BAD_OPTION', 'the reading options are for --from FILE', { field: 'from' });
    }
    if (from !== undefined && texts.length > 0) {
      throw new BandshelfError('BAD_OPTION', 'give band positions or --from FILE, not both', {
        field: 'from',
      });
    }
    if (from === undefined && texts.length === 0)
      throw new BandshelfError('BAD_OPTION', 'give at least one band position (or --from FILE)', {
        field: 'bands',
      });
    const given = texts.map((t) => parseBandQuery(t));
    const tolerance = positiveNumber(options.tolerance ?? BAND_TOLERANCE_CM1, 'tolerance', false);
    const top = positiveNumber(options.top ?? '20', 'top', true);
    const maxBands = positiveNumber(options.maxBands ?? '12', 'max-bands', true);
    const at = typeof options.at === 'string' ? options.at : undefined;
    const library = openLibrary(libraryPath(options.library, context.cwd), { readonly: true });
    try {
      // Peaks only: the band index never needs the processed vectors.
      const set = readPeakSet(library, at === undefined ? {} : { at });
      const lo = Math.min(set.grid.start, set.grid.stop);
      const hi = Math.max(set.grid.start, set.grid.stop);
      for (const band of given) {
        if (band.position < lo || band.position > hi) {
          throw new BandshelfError(
            'BAD_OPTION',
            `band ${band.position} cm⁻¹ lies outside the library grid (${hi}–${lo} cm⁻¹)`,
            { field: 'bands' },
          );
        }
      }
      if (set.entries.length === 0) {
        throw new BandshelfError(
          'EMPTY_LIBRARY',
          set.at === null ? 'the library has no entries to search' : `release '${set.at}' holds no entries`,
        );
      }
      const index = buildBandIndex(set);
      const search = { tolerance, requireAll: options.requireAll === true, top };
      const notes: string[] = [];
      let bands: BandQuery[] = given;
      let hits: ReturnType<typeof searchBands>;
      let fromName: string | null = null;
      if (from === undefined) hits = searchBands(index, bands, search);
      else {
        const found = searchFromFile(from, {
          library,
          at,
          read,
          index,
          search,
          maxBands,
          cwd: context.cwd,
          notes,
        });
        fromName = found.name;
        bands = found.bands;
        hits = found.hits;
      }
      const stderr = notes.join('\n');
      if (options.json) {
        return {
          stdout: JSON.stringify({
            query: {
              ...(fromName === null ? {} : { from: fromName }),
              bands,
              tolerance,
              requireAll: options.requireAll === true,
            },
            library: {
              release: set.at,
              stateKey: set.stateKey,
              entries: set.entries.length,
              peaks: index.position.length,
            },
            hits: hits.map(({ row: _row, ...hit }) => hit),
            caution: MATCH_CAUTION,
          }),
          stderr,
          exitCode: 0,
        };
      }
      const wanted = bands
        .map(
          (b) =>
            `${fromName === null ? b.position : b.position.toFixed(1)}${b.strength ? `:${b.strength}` : ''}`,
        )
        .join(' ');
      const head = `${fromName === null ? 'Bands' : `Bands of ${fromName}:`} ${wanted} cm⁻¹ ±${tolerance}; ${set.entries.length} entries, ${index.position.length} stored peaks${
        set.at === null ? '' : `, release ${set.at}`
      }`;
      if (hits.length === 0)
        return {
          stdout: `${head}\nNo entry has a peak at any of these positions.\n${MATCH_CAUTION}`,
          stderr,
          exitCode: 0,
        };
      const table = textTable(
        [
          ['#', 'ID', 'REV', 'NAME', 'CLASS', 'MATCHED', 'SCORE', 'MEAN |ERR|', 'PEAKS'],
          ...hits.map((h, i) => [
            String(i + 1),
            h.id,
            String(h.revision),
            h.name,
            h.class,
            `${h.matched}/${bands.length}`,
            h.score.toFixed(3),
            h.meanError.toFixed(1),
            h.matches.map((m) => `${m.position.toFixed(1)}${m.strength}`).join(' '),
          ]),
        ],
        { right: [0, 2, 5, 6, 7] },
      );
      return { stdout: `${head}\n\n${table}\n\n${MATCH_CAUTION}`, stderr, exitCode: 0 };
    } finally {
      closeLibrary(library);
    }
  },
};

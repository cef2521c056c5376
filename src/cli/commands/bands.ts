// `bandshelf bands`: finds library entries with stored peaks at given positions (band-position search).
import { BandshelfError } from '../../error.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { openLibrary } from '../../library/store/openLibrary.js';
import { readPeakSet } from '../../library/store/readPeakSet.js';
import { buildBandIndex } from '../../match/buildBandIndex.js';
import { parseBandQuery } from '../../match/parseBandQuery.js';
import { searchBands } from '../../match/searchBands.js';
import { BAND_TOLERANCE_CM1 } from '../../match/types.js';
import { MATCH_CAUTION } from '../../schema/matchReport.js';
import type { CommandSpec } from '../command.js';
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

export const bandsCommand: CommandSpec = {
  name: 'bands',
  summary: 'find entries with peaks at the given band positions',
  example: [
    'bandshelf bands 1652 1545 1240                # ranked by bands matched, then position error',
    'bandshelf bands 1652:s 1545:m 1080:w --tolerance 6 --require-all',
    '',
    'A stored peak within ±tolerance cm⁻¹ matches a band. Strengths compare the peak with the entry’s strongest',
    'one: s ≥ 0.6, m ≥ 0.25, w below. score = mean over the bands of (1 − |error| / (2 × tolerance)) × strength',
    'agreement (1 same, 0.75 adjacent, 0.5 strong vs weak); unmatched bands count 0.',
  ].join('\n'),
  configure(command) {
    command
      .argument('<positions...>', 'band positions in cm⁻¹, e.g. 1652 or 1652:s')
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
  },
  async run(args, options, context) {
    const texts = (args[0] as string[] | undefined) ?? [];
    if (texts.length === 0)
      throw new BandshelfError('BAD_OPTION', 'give at least one band position', { field: 'bands' });
    const bands = texts.map((t) => parseBandQuery(t));
    const tolerance = positiveNumber(options.tolerance ?? BAND_TOLERANCE_CM1, 'tolerance', false);
    const top = positiveNumber(options.top ?? '20', 'top', true);
    const library = openLibrary(libraryPath(options.library, context.cwd), { readonly: true });
    try {
      // Peaks only: the band index never needs the processed vectors.
      const set = readPeakSet(library, typeof options.at === 'string' ? { at: options.at } : {});
      const lo = Math.min(set.grid.start, set.grid.stop);
      const hi = Math.max(set.grid.start, set.grid.stop);
      for (const band of bands) {
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
      const hits = searchBands(index, bands, { tolerance, requireAll: options.requireAll === true, top });
      if (options.json) {
        return {
          stdout: JSON.stringify({
            query: { bands, tolerance, requireAll: options.requireAll === true },
            library: {
              release: set.at,
              stateKey: set.stateKey,
              entries: set.entries.length,
              peaks: index.position.length,
            },
            hits: hits.map(({ row: _row, ...hit }) => hit),
            caution: MATCH_CAUTION,
          }),
          exitCode: 0,
        };
      }
      const wanted = bands.map((b) => `${b.position}${b.strength ? `:${b.strength}` : ''}`).join(' ');
      const head = `Bands ${wanted} cm⁻¹ ±${tolerance}; ${set.entries.length} entries, ${index.position.length} stored peaks${
        set.at === null ? '' : `, release ${set.at}`
      }`;
      if (hits.length === 0)
        return {
          stdout: `${head}\nNo entry has a peak at any of these positions.\n${MATCH_CAUTION}`,
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
      return { stdout: `${head}\n\n${table}\n\n${MATCH_CAUTION}`, exitCode: 0 };
    } finally {
      closeLibrary(library);
    }
  },
};

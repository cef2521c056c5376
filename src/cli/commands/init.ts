// `bandshelf init`: creates an empty library file with its grid and default processing recipe.
import { resolve } from 'node:path';
import { BandshelfError } from '../../error.js';
import { closeLibrary } from '../../library/store/closeLibrary.js';
import { initLibrary } from '../../library/store/initLibrary.js';
import { libraryPath } from '../../library/store/libraryPath.js';
import { readRecipeFile } from '../../library/store/readRecipeFile.js';
import type { Grid } from '../../schema/recipe.js';
import { RECIPE_PRESETS } from '../../schema/recipePresets.js';
import { gridLength } from '../../spectrum/gridLength.js';
import type { CommandSpec } from '../command.js';

function parseGrid(text: string): Grid {
  const parts = text.split(':').map((p) => p.trim());
  const numbers = parts.map(Number);
  if (parts.length !== 3 || parts.some((p) => p === '') || numbers.some((n) => !Number.isFinite(n))) {
    throw new BandshelfError(
      'BAD_OPTION',
      `--grid wants START:STOP:STEP in cm⁻¹ (e.g. 4000:600:2), not '${text}'`,
      {
        field: 'grid',
      },
    );
  }
  return { start: numbers[0]!, stop: numbers[1]!, step: numbers[2]! };
}

function presetRecipe(name: unknown) {
  if (name === undefined) return {};
  const preset = (RECIPE_PRESETS as Record<string, unknown>)[String(name)];
  if (preset === undefined) {
    throw new BandshelfError(
      'BAD_OPTION',
      `--preset wants one of ${Object.keys(RECIPE_PRESETS).join(', ')}, not '${String(name)}'`,
      { field: 'preset' },
    );
  }
  return preset as (typeof RECIPE_PRESETS)[keyof typeof RECIPE_PRESETS];
}

export const initCommand: CommandSpec = {
  name: 'init',
  summary: 'create an empty library with its grid and default recipe',
  example: [
    'bandshelf init --library serum-refs.sqlite --grid 4000:600:2 --name "Serum film references"',
    'bandshelf init --recipe recipe.json     # a default recipe other than the built-in one',
    'bandshelf init --preset liquid-biofluid # water fitted on 2300–1900 cm⁻¹ and subtracted, then the baseline',
  ].join('\n'),
  configure(command) {
    command
      .option('--library <path>', 'library file to create', 'bandshelf.sqlite')
      .option('--grid <start:stop:step>', 'the library grid in cm⁻¹', '4000:600:2')
      .option('--recipe <file>', 'default processing recipe (JSON; missing fields take their defaults)')
      .option('--preset <name>', `a named default recipe: ${Object.keys(RECIPE_PRESETS).join(', ')}`)
      .option('--name <name>', 'display name of the library', 'bandshelf library')
      .option('--json', 'print the settings as JSON');
  },
  async run(_args, options, context) {
    const path = libraryPath(options.library, context.cwd);
    const grid = parseGrid(String(options.grid ?? '4000:600:2'));
    const recipe =
      typeof options.recipe === 'string'
        ? readRecipeFile(resolve(context.cwd, options.recipe), { label: options.recipe })
        : presetRecipe(options.preset);
    const library = initLibrary(path, { grid, recipe, name: String(options.name ?? 'bandshelf library') });
    try {
      const settings = { library: path, name: library.name, grid: library.grid, recipe: library.recipe };
      if (options.json) return { stdout: JSON.stringify(settings), exitCode: 0 };
      return {
        stdout: `created ${path}\ngrid ${library.grid.start}:${library.grid.stop}:${library.grid.step} cm⁻¹ (${gridLength(library.grid)} points)`,
        exitCode: 0,
      };
    } finally {
      closeLibrary(library);
    }
  },
};

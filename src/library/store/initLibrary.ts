// Creates a new, empty library file with its grid and default recipe.
import { existsSync } from 'node:fs';
import { BandshelfError } from '../../error.js';
import { metaErrorFromIssues } from '../../schema/metaErrorFromIssues.js';
import { type Grid, gridSchema, type RecipeInput, recipeSchema } from '../../schema/recipe.js';
import type { Library } from '../types.js';
import { appendSeal } from './appendSeal.js';
import { connectLibrary } from './connectLibrary.js';
import { migrateLibrary } from './migrateLibrary.js';
import { openLibrary } from './openLibrary.js';

export interface InitLibraryOptions {
  /** The library grid; vectors run ascending on it whatever the order of start and stop.
   * @default { start: 4000, stop: 600, step: 2 } */
  grid?: Grid;
  /** The default recipe (zod input: defaults fill the rest).
   * @default {} (every recipe default) */
  recipe?: RecipeInput;
  /** A display name for the site and reports.
   * @default 'bandshelf library' */
  name?: string;
  /** Creation time (tests pin it).
   * @default new Date() */
  now?: Date;
}

export function initLibrary(path: string, options: InitLibraryOptions = {}): Library {
  if (existsSync(path)) {
    throw new BandshelfError(
      'ALREADY_EXISTS',
      'a file is already there; bandshelf never overwrites a library',
      {
        file: path,
      },
    );
  }
  const grid = gridSchema.safeParse(options.grid ?? { start: 4000, stop: 600, step: 2 });
  if (!grid.success) {
    throw metaErrorFromIssues(grid.error.issues, {
      code: 'BAD_OPTION',
      lead: 'bad grid',
      field: 'grid',
      knownFields: Object.keys(gridSchema.shape),
    });
  }
  const recipe = recipeSchema.safeParse(options.recipe ?? {});
  if (!recipe.success) {
    throw metaErrorFromIssues(recipe.error.issues, {
      code: 'BAD_RECIPE',
      knownFields: Object.keys(recipeSchema.shape),
    });
  }
  let db: ReturnType<typeof connectLibrary>;
  try {
    db = connectLibrary(path, { create: true });
  } catch (error) {
    throw new BandshelfError('IO_ERROR', `cannot create the library: ${(error as Error).message}`, {
      file: path,
      cause: error,
    });
  }
  try {
    migrateLibrary(db, { file: path });
    const insert = db.prepare('INSERT INTO settings (key, value) VALUES (?, ?)');
    db.transaction(() => {
      insert.run('name', options.name ?? 'bandshelf library');
      insert.run('grid', JSON.stringify(grid.data));
      insert.run('recipe', JSON.stringify(recipe.data));
      insert.run('created_at', (options.now ?? new Date()).toISOString());
      appendSeal(db);
    }).immediate();
  } finally {
    db.close();
  }
  return openLibrary(path);
}

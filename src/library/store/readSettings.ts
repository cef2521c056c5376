// Reads the library-wide settings (name, grid, default recipe) and validates them.
import type Database from 'better-sqlite3';
import { BandshelfError } from '../../error.js';
import { type Grid, gridSchema, type Recipe, recipeSchema } from '../../schema/recipe.js';

export interface LibrarySettings {
  name: string;
  grid: Grid;
  recipe: Recipe;
  createdAt: string;
}

export interface ReadSettingsOptions {
  /** The library file, named in errors.
   * @default undefined */
  file?: string;
}

export function readSettings(db: Database.Database, options: ReadSettingsOptions = {}): LibrarySettings {
  const rows = db.prepare('SELECT key, value FROM settings').all() as { key: string; value: string }[];
  const map = new Map(rows.map((r) => [r.key, r.value]));
  const need = (key: string): string => {
    const value = map.get(key);
    if (value === undefined)
      throw new BandshelfError('NO_LIBRARY', `the library has no '${key}' setting`, { file: options.file });
    return value;
  };
  try {
    return {
      name: need('name'),
      grid: gridSchema.parse(JSON.parse(need('grid'))),
      recipe: recipeSchema.parse(JSON.parse(need('recipe'))),
      createdAt: need('created_at'),
    };
  } catch (error) {
    if (error instanceof BandshelfError) throw error;
    throw new BandshelfError(
      'NO_LIBRARY',
      `the library settings are unreadable: ${(error as Error).message}`,
      {
        file: options.file,
        cause: error,
      },
    );
  }
}

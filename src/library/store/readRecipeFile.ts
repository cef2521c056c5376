// Reads and validates a recipe JSON file (`init --recipe`, `add --recipe`), naming the file and field on error.
import { BandshelfError } from '../../error.js';
import { metaErrorFromIssues } from '../../schema/metaErrorFromIssues.js';
import { type Recipe, recipeSchema } from '../../schema/recipe.js';
import { readTextFile } from './readTextFile.js';

export interface ReadRecipeFileOptions {
  /** The file as the user named it, for errors.
   * @default the path */
  label?: string;
}

export function readRecipeFile(path: string, options: ReadRecipeFileOptions = {}): Recipe {
  const file = options.label ?? path;
  const text = readTextFile(path, { label: file });
  let parsed: unknown;
  try {
    parsed = JSON.parse(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
  } catch (error) {
    throw new BandshelfError('BAD_RECIPE', `not valid JSON (${(error as Error).message})`, { file });
  }
  const checked = recipeSchema.safeParse(parsed);
  if (!checked.success) {
    throw metaErrorFromIssues(checked.error.issues, {
      file,
      code: 'BAD_RECIPE',
      knownFields: Object.keys(recipeSchema.shape),
    });
  }
  return checked.data;
}

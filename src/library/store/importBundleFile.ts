// Imports a bundle file into a library file: an existing library, or a new one made with the bundle's name, grid
// and default recipe (removed again if the import fails, so no half-made library is left).
import { existsSync, rmSync } from 'node:fs';
import type { RecipeInput } from '../../schema/recipe.js';
import { closeLibrary } from './closeLibrary.js';
import { type ImportBundleOutcome, importBundle } from './importBundle.js';
import { initLibrary } from './initLibrary.js';
import { openLibrary } from './openLibrary.js';
import { readBundleFile } from './readBundleFile.js';

export interface ImportBundleFileInput {
  /** The bundle file. */
  bundle: string;
  /** The library file; created from the bundle's settings when there is none. */
  library: string;
}

export interface ImportBundleFileOptions {
  /** The bundle as the user named it, for errors.
   * @default the path */
  label?: string;
}

export interface ImportBundleFileOutcome extends ImportBundleOutcome {
  /** True when the library file was made by this import. */
  created: boolean;
}

export function importBundleFile(
  input: ImportBundleFileInput,
  options: ImportBundleFileOptions = {},
): ImportBundleFileOutcome {
  const file = options.label ?? input.bundle;
  const bundle = readBundleFile(input.bundle, { label: file });
  const created = !existsSync(input.library);
  const library = created
    ? initLibrary(input.library, {
        name: bundle.library.name,
        grid: bundle.library.grid,
        recipe: bundle.library.recipe as RecipeInput,
      })
    : openLibrary(input.library);
  let ok = false;
  try {
    const outcome = importBundle(library, bundle, { file });
    ok = true;
    return { ...outcome, created };
  } finally {
    closeLibrary(library);
    if (created && !ok) {
      for (const suffix of ['', '-wal', '-shm']) rmSync(`${input.library}${suffix}`, { force: true });
    }
  }
}

// Closes a library handle; in WAL mode the last writer's close also folds the log back into the main file.
import type { Library } from '../types.js';

export function closeLibrary(library: Library): void {
  if (library.db.open) library.db.close();
}

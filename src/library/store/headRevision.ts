// The newest stored revision of an entry (retired or not), or undefined when the id was never added: the one
// "newest revision" query of the store, for reads and for the checks made under the write lock.

import type { Library } from '../types.js';
import type { RevisionRow } from './rowTypes.js';

export function headRevision(library: Library, id: string): RevisionRow | undefined {
  return library.db
    .prepare('SELECT * FROM revisions WHERE entry_id = ? ORDER BY revision DESC LIMIT 1')
    .get(id) as RevisionRow | undefined;
}

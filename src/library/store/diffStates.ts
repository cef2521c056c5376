// Compares two library states (release tags or 'current'): which entries were added, removed or changed, and what.

import type { ChangeKind, Library, StateDiff } from '../types.js';
import { stateSelect } from './stateSelect.js';

interface StateRow {
  id: string;
  revision: number;
  content_hash: string;
  data_hash: string;
  recipe: string;
  meta: string;
}

function readState(library: Library, at: string): Map<string, StateRow> {
  const select = stateSelect(
    library,
    'r.entry_id AS id, r.revision, r.content_hash, r.data_hash, r.recipe, r.meta',
    { at },
  );
  const rows = library.db.prepare(select.sql).all(...select.params) as StateRow[];
  return new Map(rows.map((r) => [r.id, r]));
}

export function diffStates(library: Library, from: string, to: string): StateDiff {
  const a = readState(library, from);
  const b = readState(library, to);
  const diff: StateDiff = { from, to, added: [], changed: [], removed: [] };
  for (const [id, rb] of b) {
    const ra = a.get(id);
    if (ra === undefined) {
      diff.added.push({ id, revision: rb.revision });
      continue;
    }
    if (ra.content_hash === rb.content_hash) continue;
    const what: ChangeKind[] = [];
    if (ra.data_hash !== rb.data_hash) what.push('data');
    if (ra.recipe !== rb.recipe) what.push('recipe');
    if (ra.meta !== rb.meta) what.push('metadata');
    diff.changed.push({ id, from: ra.revision, to: rb.revision, what });
  }
  for (const [id, ra] of a) if (!b.has(id)) diff.removed.push({ id, revision: ra.revision });
  // Maps iterate in the states' id order already; sort anyway so the contract does not rest on that.
  const byId = (x: { id: string }, y: { id: string }) => (x.id < y.id ? -1 : x.id > y.id ? 1 : 0);
  diff.added.sort(byId);
  diff.changed.sort(byId);
  diff.removed.sort(byId);
  return diff;
}

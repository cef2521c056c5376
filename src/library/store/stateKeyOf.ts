// The key of a library state: SHA-256 over the grid and the `id@revision:hash` list of its entries, in row order.
import { createHash } from 'node:crypto';
import type { Grid } from '../../schema/recipe.js';
import { canonicalJson } from './canonicalJson.js';

/** Equal keys mean equal search sets (same rows in the same order); readStateRows and the search cache share it. */
export function stateKeyOf(input: {
  grid: Grid;
  entries: readonly { id: string; revision: number; hash: string }[];
}): string {
  const digest = createHash('sha256').update(`${canonicalJson(input.grid)}\n`);
  for (const e of input.entries) digest.update(`${e.id}@${e.revision}:${e.hash}\n`);
  return digest.digest('hex');
}

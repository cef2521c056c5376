// How an entry's history in a bundle stands to its history in a library, compared revision by revision by
// record hash (which covers content, author, time and message): the one rule import merges by.

export type HistoryRelation =
  /** The library has no such entry. */
  | { kind: 'absent' }
  /** Both hold the same revisions. */
  | { kind: 'same' }
  /** The library holds the bundle's revisions and later ones of its own: nothing to add. */
  | { kind: 'ahead' }
  /** The bundle continues the library's history: its revisions after `from` are appended. */
  | { kind: 'behind'; from: number }
  /** Both changed the entry after their first `common` revisions. */
  | { kind: 'diverged'; common: number };

export interface HistoryRelationInput {
  /** Record hashes of the library's revisions 1 … n. */
  library: readonly string[];
  /** Record hashes of the bundle's revisions 1 … m. */
  bundle: readonly string[];
}

export function historyRelation(input: HistoryRelationInput): HistoryRelation {
  const { library, bundle } = input;
  if (library.length === 0) return { kind: 'absent' };
  let common = 0;
  while (common < library.length && common < bundle.length && library[common] === bundle[common]) common++;
  if (common === bundle.length) return common === library.length ? { kind: 'same' } : { kind: 'ahead' };
  if (common === library.length) return { kind: 'behind', from: common };
  return { kind: 'diverged', common };
}

// Turns what the user typed into lunr query clauses: each word exactly (stemmed) and as a prefix, as they type.
import type lunr from 'lunr';

export interface SearchQueryOptions {
  /** Boost of the exact (stemmed) match over the prefix match.
   * @default 10 */
  exactBoost?: number;
}

/**
 * Words are split at white space only, so `7732-18-5` and InChIKeys stay whole (the index keeps them whole too);
 * leading and trailing punctuation is trimmed as lunr's own trimmer does. Each word adds an exact clause through
 * the search pipeline (so `amides` meets `amide`) and a trailing-wildcard clause without it (so `amid`, `165` or
 * `7732-1` already find something while typing). Clauses are optional: more matching words rank higher.
 */
export function searchQuery(text: string, options: SearchQueryOptions = {}): (q: lunr.Query) => void {
  const words = text
    .toLowerCase()
    .split(/\s+/)
    .map((w) => w.replace(/^[^\p{L}\p{N}]+|[^\p{L}\p{N}]+$/gu, ''))
    .filter((w) => w !== '');
  const boost = options.exactBoost ?? 10;
  return (q) => {
    for (const word of words) {
      q.term(word, { boost, usePipeline: true });
      // lunr.Query.wildcard.TRAILING is 2; the constant is not reachable from a type-only import.
      q.term(word, { boost: 1, usePipeline: false, wildcard: 2 });
    }
  };
}

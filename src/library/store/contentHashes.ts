// The identity of a revision's content: a data hash over its files and read options, and a content hash over
// data, recipe and metadata. Both are SHA-256 of canonical JSON, so key order and whitespace never matter.

import type { FileRole, ReadOptions } from '../types.js';
import { canonicalJson } from './canonicalJson.js';
import { sha256Hex } from './sha256Hex.js';

export interface ContentHashesInput {
  /** In stored order; only role and the SHA-256 of the bytes count (a renamed file is the same data). */
  files: readonly { role: FileRole; sha256: string }[];
  read: ReadOptions;
  /** The stored recipe (defaults filled, reference revisions pinned). */
  recipe: unknown;
  /** The stored metadata (validated output of the metadata schema). */
  meta: unknown;
}

export interface ContentHashes {
  data: string;
  content: string;
}

export function contentHashes(input: ContentHashesInput): ContentHashes {
  const data = sha256Hex(
    canonicalJson({
      v: 1,
      files: input.files.map((f) => ({ role: f.role, sha256: f.sha256 })),
      read: input.read,
    }),
  );
  const content = sha256Hex(canonicalJson({ v: 1, data, recipe: input.recipe, meta: input.meta }));
  return { data, content };
}

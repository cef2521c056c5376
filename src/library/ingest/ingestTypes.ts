// Shapes of the write side: what an ingest hands the library before and after processing.
import type { Recipe } from '../../schema/recipe.js';
import type { Peak, QcFlag, Spectrum } from '../../spectrum/types.js';
import type { ContentHashes } from '../store/contentHashes.js';
import type { FileRole, ReadOptions, RevisionExtras, RevisionKind } from '../types.js';

/** A file with its bytes, as it will be stored verbatim. */
export interface SourceFile {
  role: FileRole;
  /** Base name only (folders are not part of the stored record). */
  name: string;
  bytes: Uint8Array;
}

/** One future revision before processing: the parsed original, validated metadata and an unpinned recipe. */
export interface RevisionInput {
  /** The file (as the user named it) that errors and outcomes are reported against. */
  label: string;
  files: SourceFile[];
  read: ReadOptions;
  original: Spectrum;
  /** 1 per point of `original` the reader clipped at the absorbance ceiling (kept out of the processed vector). */
  saturated?: Uint8Array;
  /** Validated by entryMetaSchema. */
  meta: Record<string, unknown> & { id: string; name: string };
  /** Validated; a reference or EMSC spectrum may still lack its revision (prepareRevision pins it). */
  recipe: Recipe;
  extras: RevisionExtras;
}

/** A revision ready to insert: everything the row holds, computed. */
export interface PreparedRevision extends Omit<RevisionInput, 'recipe'> {
  id: string;
  kind: RevisionKind;
  /** Reference and EMSC revisions pinned. */
  recipe: Recipe;
  processed: Float64Array;
  peaks: Peak[];
  qc: QcFlag[];
  hashes: ContentHashes;
  /** Set when the entry's newest revision already holds exactly this content: nothing will be written. */
  unchangedRevision?: number;
  /** The QC failure that stops this revision unless the entry turns out unchanged at commit. */
  blocked?: Error;
}

/** What happened to one prepared revision at commit. */
export interface CommitOutcome {
  id: string;
  revision: number;
  hash: string;
  status: 'added' | 'unchanged';
  label: string;
  kind: RevisionKind;
  /** QC warnings stored with the revision (errors block unless forced; forced errors are listed too). */
  qc: QcFlag[];
}

/** A revision an add stored, as a near-duplicate index keeps it. */
export interface CommittedVector {
  id: string;
  revision: number;
  /** The revision's content hash. */
  hash: string;
  processed: Float64Array;
}

/**
 * Shortlists the current entries a block of new processed vectors may near-duplicate, so an add does not hold or
 * scan every vector of the library in plain JS; the match layer supplies one on its kernels and search cache
 * (libraryNearDuplicateIndex). The ingest then scores the shortlist exactly, as it scores the whole pool without one.
 */
export interface NearDuplicateIndex {
  /** Per vector, the entries of the library as the add found it that may correlate above `floor`, best first. */
  shortlist(vectors: readonly Float64Array[], floor: number): { id: string; revision: number }[][];
  /** The revisions the add stored, in order (so the search cache can follow the library). */
  committed(revisions: readonly CommittedVector[]): void;
  /** The add is over: write what the index keeps (the next state's search cache). */
  close(): void;
}

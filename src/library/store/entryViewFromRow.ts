// Turns a stored revision row (plus its files, reviews and releases) into the EntryView callers see.
import { recipeSchema } from '../../schema/recipe.js';
import type { QcFlag } from '../../spectrum/types.js';
import { blobFloat32 } from '../codecs/blobFloat32.js';
import { blobFloat64 } from '../codecs/blobFloat64.js';
import { blobPeaks } from '../codecs/blobPeaks.js';
import type { EntryView, Library, ReadOptions, ReviewRecord, RevisionExtras } from '../types.js';
import type { RevisionFileRow, RevisionRow } from './rowTypes.js';

export interface EntryViewFromRowOptions {
  /** Whether the entry's newest revision retires it.
   * @default row.kind === 'retire' */
  retired?: boolean;
}

export function entryViewFromRow(
  library: Library,
  row: RevisionRow,
  options: EntryViewFromRowOptions = {},
): EntryView {
  const db = library.db;
  const files = db
    .prepare(
      `SELECT f.position, f.role, f.name, f.sha256, length(b.bytes) AS size
       FROM revision_files f JOIN files b ON b.sha256 = f.sha256 WHERE f.revision_key = ? ORDER BY f.position`,
    )
    .all(row.key) as (RevisionFileRow & { size: number })[];
  const reviews = db
    .prepare('SELECT state, reviewer, note, created_at FROM reviews WHERE revision_key = ? ORDER BY key')
    .all(row.key) as { state: ReviewRecord['state']; reviewer: string; note: string; created_at: string }[];
  const releases = db
    .prepare('SELECT tag FROM release_members WHERE revision_key = ? ORDER BY tag')
    .pluck()
    .all(row.key) as string[];
  const last = reviews.at(-1);
  return {
    id: row.entry_id,
    revision: row.revision,
    kind: row.kind,
    retired: options.retired ?? row.kind === 'retire',
    hash: row.content_hash,
    dataHash: row.data_hash,
    meta: JSON.parse(row.meta) as Record<string, unknown>,
    // Stored recipes were validated at ingest; parsing again only restores the typed shape.
    recipe: recipeSchema.parse(JSON.parse(row.recipe)),
    read: JSON.parse(row.read_options) as ReadOptions,
    files: files.map((f) => ({ role: f.role, name: f.name, sha256: f.sha256, size: f.size })),
    original: {
      wavenumber: blobFloat64(row.original_x, { what: 'the original wavenumbers' }),
      absorbance: blobFloat64(row.original_y, { what: 'the original absorbances' }),
    },
    grid: library.grid,
    processed: blobFloat32(row.processed, { what: 'the processed vector' }),
    coverage:
      row.covered_points > 0 && row.coverage_min !== null && row.coverage_max !== null
        ? { min: row.coverage_min, max: row.coverage_max, points: row.covered_points }
        : null,
    peaks: blobPeaks(row.peaks),
    qc: JSON.parse(row.qc) as QcFlag[],
    extras: JSON.parse(row.extras) as RevisionExtras,
    author: row.author,
    message: row.message,
    createdAt: row.created_at,
    reviewState: last?.state ?? 'draft',
    reviews: reviews.map((r) => ({
      state: r.state,
      reviewer: r.reviewer,
      note: r.note,
      createdAt: r.created_at,
    })),
    releases,
  };
}

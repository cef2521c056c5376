// Rebuilds a stored revision as a PreparedRevision, so a metadata edit or a retirement can reuse its data as is.
import { recipeSchema } from '../../schema/recipe.js';
import type { QcFlag } from '../../spectrum/types.js';
import { blobFloat32 } from '../codecs/blobFloat32.js';
import { blobFloat64 } from '../codecs/blobFloat64.js';
import { blobPeaks } from '../codecs/blobPeaks.js';
import type { PreparedRevision, SourceFile } from '../ingest/ingestTypes.js';
import type { Library, ReadOptions, RevisionExtras } from '../types.js';
import type { RevisionFileRow, RevisionRow } from './rowTypes.js';

export function revisionFromRow(library: Library, row: RevisionRow): PreparedRevision {
  const files = library.db
    .prepare(
      `SELECT f.role, f.name, b.bytes FROM revision_files f JOIN files b ON b.sha256 = f.sha256
       WHERE f.revision_key = ? ORDER BY f.position`,
    )
    .all(row.key) as (Pick<RevisionFileRow, 'role' | 'name'> & { bytes: Buffer })[];
  const meta = JSON.parse(row.meta) as PreparedRevision['meta'];
  return {
    label: row.entry_id,
    id: row.entry_id,
    kind: row.kind,
    files: files.map((f): SourceFile => ({ role: f.role, name: f.name, bytes: new Uint8Array(f.bytes) })),
    read: JSON.parse(row.read_options) as ReadOptions,
    original: { wavenumber: blobFloat64(row.original_x), absorbance: blobFloat64(row.original_y) },
    meta,
    recipe: recipeSchema.parse(JSON.parse(row.recipe)),
    extras: JSON.parse(row.extras) as RevisionExtras,
    processed: blobFloat32(row.processed),
    peaks: blobPeaks(row.peaks),
    qc: JSON.parse(row.qc) as QcFlag[],
    hashes: { data: row.data_hash, content: row.content_hash },
  };
}

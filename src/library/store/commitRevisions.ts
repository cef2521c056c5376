// Writes prepared revisions in one BEGIN IMMEDIATE transaction: all of them land or none does.

import { BandshelfError } from '../../error.js';
import { float32Blob } from '../codecs/float32Blob.js';
import { float64Blob } from '../codecs/float64Blob.js';
import { peaksBlob } from '../codecs/peaksBlob.js';
import type { CommitOutcome, PreparedRevision } from '../ingest/ingestTypes.js';
import type { Library } from '../types.js';
import { canonicalJson } from './canonicalJson.js';
import { gridAxisMemo } from './gridAxisMemo.js';
import { headRevision } from './headRevision.js';
import { recordHash } from './recordHash.js';
import { revisionStatements } from './revisionStatements.js';
import type { RevisionRow } from './rowTypes.js';
import { sha256Hex } from './sha256Hex.js';
import { writeTransaction } from './writeTransaction.js';

export interface CommitRevisionsOptions {
  /** Who made the revisions. */
  author?: string;
  /** Why (shown in history).
   * @default '' */
  message?: string;
  /** Revision time (tests pin it).
   * @default new Date() */
  now?: Date;
}

export function commitRevisions(
  library: Library,
  prepared: readonly PreparedRevision[],
  options: CommitRevisionsOptions = {},
): CommitOutcome[] {
  const {
    entry: insertEntry,
    file: insertFile,
    revision: insertRevision,
    revisionFile: insertRevisionFile,
  } = revisionStatements(library);
  const createdAt = (options.now ?? new Date()).toISOString();
  const axis = gridAxisMemo(library.grid);
  return writeTransaction(
    library,
    (): CommitOutcome[] => {
      const outcomes: CommitOutcome[] = [];
      for (const p of prepared) {
        // Re-read the head under the write lock: another process may have added this entry meanwhile.
        const current = headRevision(library, p.id);
        const outcome = { id: p.id, hash: p.hashes.content, label: p.label, kind: p.kind };
        if (
          p.kind !== 'retire' &&
          current !== undefined &&
          current.kind !== 'retire' &&
          current.content_hash === p.hashes.content
        ) {
          outcomes.push({ ...outcome, revision: current.revision, status: 'unchanged', qc: [] });
          continue;
        }
        if (p.kind === 'retire' && current?.kind === 'retire') {
          throw new BandshelfError('ALREADY_EXISTS', `entry '${p.id}' is already retired`, { field: 'id' });
        }
        // Prepared as unchanged (QC not enforced) but another process moved the head: QC applies again.
        if (p.blocked) throw p.blocked;
        const revision = (current?.revision ?? 0) + 1;
        let covered = 0;
        let lo = Number.POSITIVE_INFINITY;
        let hi = Number.NEGATIVE_INFINITY;
        for (let i = 0; i < p.processed.length; i++) {
          if (Number.isNaN(p.processed[i]!)) continue;
          covered++;
          const x = axis[i]!;
          if (x < lo) lo = x;
          if (x > hi) hi = x;
        }
        const files = p.files.map((f, position) => ({
          position,
          role: f.role,
          name: f.name,
          sha256: sha256Hex(f.bytes),
          bytes: f.bytes,
        }));
        const row: Omit<RevisionRow, 'key' | 'record_hash'> = {
          entry_id: p.id,
          revision,
          kind: p.kind,
          content_hash: p.hashes.content,
          data_hash: p.hashes.data,
          read_options: canonicalJson(p.read),
          recipe: canonicalJson(p.recipe),
          meta: canonicalJson(p.meta),
          original_x: float64Blob(p.original.wavenumber),
          original_y: float64Blob(p.original.absorbance),
          processed: float32Blob(p.processed),
          covered_points: covered,
          coverage_min: covered > 0 ? lo : null,
          coverage_max: covered > 0 ? hi : null,
          peaks: peaksBlob(p.peaks),
          qc: JSON.stringify(p.qc),
          extras: canonicalJson(p.extras),
          author: options.author ?? 'unknown',
          message: options.message ?? '',
          created_at: createdAt,
        };
        insertEntry.run(p.id, createdAt, p.id);
        for (const f of files)
          insertFile.run(
            f.sha256,
            Buffer.from(f.bytes.buffer, f.bytes.byteOffset, f.bytes.byteLength),
            f.sha256,
          );
        const { lastInsertRowid } = insertRevision.run({ ...row, record_hash: recordHash(row, files) });
        for (const f of files) insertRevisionFile.run(lastInsertRowid, f.position, f.role, f.name, f.sha256);
        outcomes.push({ ...outcome, revision, status: 'added', qc: p.qc });
      }
      return outcomes;
    },
    { what: prepared.length === 1 ? `entry '${prepared[0]!.id}'` : `${prepared.length} entries` },
  );
}

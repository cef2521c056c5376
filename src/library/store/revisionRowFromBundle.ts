// A bundle revision as the row the store writes (blobs decoded), with its file list: the inverse of exportBundle.
import type { BundleRevision } from '../../schema/bundle.js';
import type { RevisionFileRow, RevisionRow } from './rowTypes.js';

export interface RevisionRowFromBundleInput {
  revision: BundleRevision;
  /** The entry id the row is written under (the bundle revision does not name its entry). */
  entryId: string;
}

export interface RevisionRowFromBundle {
  row: Omit<RevisionRow, 'key'>;
  files: Omit<RevisionFileRow, 'revision_key'>[];
}

export function revisionRowFromBundle(input: RevisionRowFromBundleInput): RevisionRowFromBundle {
  const { revision } = input;
  const blob = (text: string) => Buffer.from(text, 'base64');
  return {
    row: {
      entry_id: input.entryId,
      revision: revision.revision,
      kind: revision.kind,
      content_hash: revision.contentHash,
      data_hash: revision.dataHash,
      read_options: revision.readOptions,
      recipe: revision.recipe,
      meta: revision.meta,
      original_x: blob(revision.originalX),
      original_y: blob(revision.originalY),
      processed: blob(revision.processed),
      covered_points: revision.coveredPoints,
      coverage_min: revision.coverageMin,
      coverage_max: revision.coverageMax,
      peaks: blob(revision.peaks),
      qc: revision.qc,
      extras: revision.extras,
      author: revision.author,
      message: revision.message,
      created_at: revision.createdAt,
      record_hash: revision.recordHash,
    },
    files: revision.files.map((f) => ({
      position: f.position,
      role: f.role,
      name: f.name,
      sha256: f.sha256,
    })),
  };
}

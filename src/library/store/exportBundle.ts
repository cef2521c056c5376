// Gathers a library's whole history — every revision with its files, reviews, releases and the lab's assignment
// rows — into one self-describing bundle another library can import (`importBundle`).
import { BandshelfError } from '../../error.js';
import { BUNDLE_FORMAT, BUNDLE_VERSION, type Bundle, type BundleRevision } from '../../schema/bundle.js';
import type { Library } from '../types.js';
import { bundleDigest } from './bundleDigest.js';
import type { RevisionFileRow, RevisionRow } from './rowTypes.js';

export interface ExportBundleOptions {
  /** A release tag: only its members, each with its history up to the frozen revision, and that release alone.
   * Undefined, null or 'current': every entry (retired ones too) with every revision, and every release.
   * @default undefined */
  at?: string | null;
  /** Export time (tests pin it).
   * @default new Date() */
  now?: Date;
}

function base64(blob: Buffer): string {
  return blob.toString('base64');
}

/** Adds to `limit` every entry (up to the pinned revision) a kept revision's recipe subtracts or models by EMSC,
 * so the importing library can re-derive each processed vector (`check`). */
function withReferences(library: Library, limit: Map<string, number>): void {
  const recipes = library.db
    .prepare('SELECT recipe FROM revisions WHERE entry_id = ? AND revision <= ?')
    .pluck();
  const pending = [...limit.keys()];
  while (pending.length > 0) {
    const id = pending.pop()!;
    for (const text of recipes.all(id, limit.get(id)) as string[]) {
      const recipe = JSON.parse(text) as {
        reference?: { id: string; revision?: number } | null;
        emsc?: { id: string; revision?: number } | null;
        subtract?: { references: { id: string; revision?: number }[] };
      };
      for (const ref of [recipe.reference, recipe.emsc, ...(recipe.subtract?.references ?? [])]) {
        if (ref === null || ref === undefined) continue;
        const revision = ref.revision ?? Number.MAX_SAFE_INTEGER;
        if ((limit.get(ref.id) ?? 0) < revision) {
          limit.set(ref.id, revision);
          pending.push(ref.id);
        }
      }
    }
  }
}

export function exportBundle(library: Library, options: ExportBundleOptions = {}): Bundle {
  const db = library.db;
  const at = options.at === undefined || options.at === null || options.at === 'current' ? null : options.at;
  let releases = db
    .prepare('SELECT tag, created_at, message, reviewed_only FROM releases ORDER BY created_at, tag')
    .all() as { tag: string; created_at: string; message: string; reviewed_only: number }[];
  /** entry id → the last revision to export. */
  let limit: Map<string, number> | undefined;
  if (at !== null) {
    releases = releases.filter((r) => r.tag === at);
    if (releases.length === 0)
      throw new BandshelfError('UNKNOWN_RELEASE', `no release is tagged '${at}'`, { field: 'at' });
    limit = new Map(
      (
        db
          .prepare(
            `SELECT m.entry_id AS id, r.revision FROM release_members m JOIN revisions r ON r.key = m.revision_key
             WHERE m.tag = ?`,
          )
          .all(at) as { id: string; revision: number }[]
      ).map((m) => [m.id, m.revision]),
    );
  }
  if (limit !== undefined) withReferences(library, limit);
  const membersOf = db.prepare(
    `SELECT m.entry_id AS id, r.revision FROM release_members m JOIN revisions r ON r.key = m.revision_key
     WHERE m.tag = ? ORDER BY m.entry_id`,
  );
  const filesOf = db.prepare(
    'SELECT position, role, name, sha256 FROM revision_files WHERE revision_key = ? ORDER BY position',
  );
  const reviewsOf = db.prepare(
    'SELECT state, reviewer, note, created_at FROM reviews WHERE revision_key = ? ORDER BY key',
  );
  const bytesOf = db.prepare('SELECT bytes FROM files WHERE sha256 = ?').pluck();
  const files: Record<string, string> = {};
  const entries: Bundle['entries'] = [];
  const entryRows = db.prepare('SELECT id, created_at FROM entries ORDER BY id').all() as {
    id: string;
    created_at: string;
  }[];
  const revisionsOf = db.prepare('SELECT * FROM revisions WHERE entry_id = ? ORDER BY revision');
  for (const e of entryRows) {
    const last = limit === undefined ? Number.POSITIVE_INFINITY : limit.get(e.id);
    if (last === undefined) continue;
    const revisions: BundleRevision[] = [];
    for (const row of revisionsOf.iterate(e.id) as Iterable<RevisionRow>) {
      if (row.revision > last) break;
      const fileRows = filesOf.all(row.key) as Omit<RevisionFileRow, 'revision_key'>[];
      for (const f of fileRows) files[f.sha256] ??= base64(bytesOf.get(f.sha256) as Buffer);
      revisions.push({
        revision: row.revision,
        kind: row.kind,
        contentHash: row.content_hash,
        dataHash: row.data_hash,
        readOptions: row.read_options,
        recipe: row.recipe,
        meta: row.meta,
        qc: row.qc,
        extras: row.extras,
        originalX: base64(row.original_x),
        originalY: base64(row.original_y),
        processed: base64(row.processed),
        coveredPoints: row.covered_points,
        coverageMin: row.coverage_min,
        coverageMax: row.coverage_max,
        peaks: base64(row.peaks),
        author: row.author,
        message: row.message,
        createdAt: row.created_at,
        recordHash: row.record_hash,
        files: fileRows.map((f) => ({ position: f.position, role: f.role, name: f.name, sha256: f.sha256 })),
        reviews: (
          reviewsOf.all(row.key) as {
            state: 'reviewed' | 'rejected';
            reviewer: string;
            note: string;
            created_at: string;
          }[]
        ).map((v) => ({ state: v.state, reviewer: v.reviewer, note: v.note, createdAt: v.created_at })),
      });
    }
    entries.push({ id: e.id, createdAt: e.created_at, revisions });
  }
  const body: Omit<Bundle, 'digest'> = {
    format: BUNDLE_FORMAT,
    version: BUNDLE_VERSION,
    library: {
      name: library.name,
      grid: library.grid,
      recipe: library.recipe as unknown as Record<string, unknown>,
      createdAt: library.createdAt,
    },
    exportedAt: (options.now ?? new Date()).toISOString(),
    at,
    files,
    entries,
    releases: releases.map((r) => ({
      tag: r.tag,
      createdAt: r.created_at,
      message: r.message,
      reviewedOnly: r.reviewed_only === 1,
      members: membersOf.all(r.tag) as { id: string; revision: number }[],
    })),
    assignments: (
      db.prepare('SELECT row, author, created_at FROM band_assignments ORDER BY key').all() as {
        row: string;
        author: string;
        created_at: string;
      }[]
    ).map((a) => ({ row: a.row, author: a.author, createdAt: a.created_at })),
  };
  return { ...body, digest: bundleDigest(body) };
}

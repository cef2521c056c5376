// Brings a bundle's history into a library: identical revisions are recognised by their record hash and kept as
// they are, a history the bundle continues is appended, and one both sides changed is imported whole under a
// suffixed id — nothing already stored is ever changed. Re-importing the same bundle writes nothing.

import { BandshelfError } from '../../error.js';
import type { Bundle } from '../../schema/bundle.js';
import type { Library } from '../types.js';
import { canonicalJson } from './canonicalJson.js';
import {
  type BundleEntryOutcome,
  type BundleImportPlan,
  type BundleReleaseOutcome,
  planBundleImport,
} from './planBundleImport.js';
import { revisionRowFromBundle } from './revisionRowFromBundle.js';
import { revisionStatements } from './revisionStatements.js';
import { verifyBundle } from './verifyBundle.js';
import { writeTransaction } from './writeTransaction.js';

export interface ImportBundleOptions {
  /** The bundle file, named in errors.
   * @default undefined */
  file?: string;
}

export interface ImportBundleOutcome {
  /** The source library's name. */
  source: string;
  /** False when the library already held everything in the bundle (nothing was written). */
  changed: boolean;
  entries: BundleEntryOutcome[];
  revisionsAdded: number;
  reviewsAdded: number;
  releases: BundleReleaseOutcome[];
  assignmentsAdded: number;
}

function outcomeOf(bundle: Bundle, plan: BundleImportPlan): ImportBundleOutcome {
  const releasesAdded = plan.releases.filter((r) => r.status === 'added').length;
  return {
    source: bundle.library.name,
    changed: plan.revisions.length + plan.reviews.length + releasesAdded + plan.assignments.length > 0,
    entries: plan.entries,
    revisionsAdded: plan.revisions.length,
    reviewsAdded: plan.reviews.length,
    releases: plan.releases.map(({ tag, importedAs, status }) => ({ tag, importedAs, status })),
    assignmentsAdded: plan.assignments.length,
  };
}

function writePlan(library: Library, bundle: Bundle, plan: BundleImportPlan): void {
  const db = library.db;
  const {
    entry: insertEntry,
    file: insertFile,
    revision: insertRevision,
    revisionFile: insertRevisionFile,
  } = revisionStatements(library);
  const keyOf = db.prepare('SELECT key FROM revisions WHERE entry_id = ? AND revision = ?').pluck();
  for (const { entryId, createdAt, revision } of plan.revisions) {
    insertEntry.run(entryId, createdAt, entryId);
    const { row, files } = revisionRowFromBundle({ revision, entryId });
    for (const f of files) {
      insertFile.run(f.sha256, Buffer.from(bundle.files[f.sha256]!, 'base64'), f.sha256);
    }
    const { lastInsertRowid } = insertRevision.run(row);
    for (const f of files) insertRevisionFile.run(lastInsertRowid, f.position, f.role, f.name, f.sha256);
  }
  const insertReview = db.prepare(
    'INSERT INTO reviews (revision_key, state, reviewer, note, created_at) VALUES (?, ?, ?, ?, ?)',
  );
  for (const { entryId, revision, review } of plan.reviews) {
    insertReview.run(
      keyOf.get(entryId, revision),
      review.state,
      review.reviewer,
      review.note,
      review.createdAt,
    );
  }
  const insertRelease = db.prepare(
    'INSERT INTO releases (tag, created_at, message, reviewed_only) VALUES (?, ?, ?, ?)',
  );
  const insertMember = db.prepare(
    'INSERT INTO release_members (tag, entry_id, revision_key) VALUES (?, ?, ?)',
  );
  for (const release of plan.releases) {
    if (release.status !== 'added') continue;
    const { source } = release;
    insertRelease.run(release.importedAs, source.createdAt, source.message, source.reviewedOnly ? 1 : 0);
    for (const m of release.members) insertMember.run(release.importedAs, m.id, keyOf.get(m.id, m.revision));
  }
  const insertAssignment = db.prepare(
    'INSERT INTO band_assignments (row, author, created_at) VALUES (?, ?, ?)',
  );
  for (const a of plan.assignments) insertAssignment.run(a.row, a.author, a.createdAt);
}

export function importBundle(
  library: Library,
  bundle: Bundle,
  options: ImportBundleOptions = {},
): ImportBundleOutcome {
  if (canonicalJson(bundle.library.grid) !== canonicalJson(library.grid)) {
    throw new BandshelfError(
      'BAD_OPTION',
      `the bundle's grid (${bundle.library.grid.start}:${bundle.library.grid.stop}:${bundle.library.grid.step}) ` +
        `differs from the library's (${library.grid.start}:${library.grid.stop}:${library.grid.step}); ` +
        'import it into a new library',
      { file: options.file, field: 'library' },
    );
  }
  verifyBundle(bundle, options);
  // Planned once to learn whether anything is new (a repeated import then takes no write lock), and again under
  // the write lock, where another process cannot change the state between plan and write.
  const first = outcomeOf(bundle, planBundleImport(library, bundle));
  if (!first.changed) return first;
  return writeTransaction(
    library,
    () => {
      const plan = planBundleImport(library, bundle);
      writePlan(library, bundle, plan);
      return outcomeOf(bundle, plan);
    },
    { what: 'the import' },
  );
}

// Decides, against a library's present state, what importing a bundle adds: which revisions (under which id),
// reviews, releases (under which tag) and assignment rows. Nothing is written here; `importBundle` writes the plan.
import type { Bundle, BundleRevision } from '../../schema/bundle.js';
import type { Library } from '../types.js';
import { historyRelation } from './historyRelation.js';
import { type RenamedEntry, rewriteBundleRevision } from './rewriteBundleRevision.js';

/** What became of one entry of the bundle. */
export interface BundleEntryOutcome {
  id: string;
  /** The id it is imported under: its own, or `id--<source>` when both sides changed it. */
  importedAs: string;
  /** added: new here; same: already here; ahead: the library holds later revisions of its own; appended: the
   * bundle's later revisions were added; conflict: both histories changed, the bundle's kept under `importedAs`. */
  status: 'added' | 'same' | 'ahead' | 'appended' | 'conflict';
  /** Revisions written by this import. */
  revisionsAdded: number;
}

export interface BundleReleaseOutcome {
  tag: string;
  importedAs: string;
  /** added; present (the same release is here); conflict (the tag holds other members here: not imported). */
  status: 'added' | 'present' | 'conflict';
}

export interface BundleImportPlan {
  entries: BundleEntryOutcome[];
  /** Revisions to insert, under their target id (hashes remade where the id or a reference moved). */
  revisions: { entryId: string; createdAt: string; revision: BundleRevision }[];
  reviews: { entryId: string; revision: number; review: BundleRevision['reviews'][number] }[];
  releases: (BundleReleaseOutcome & {
    source: Bundle['releases'][number];
    members: { id: string; revision: number }[];
  })[];
  assignments: Bundle['assignments'];
}

/** The source library's name as a tag and id suffix: lowercase letters, digits, '.', '_', '-'. */
function slugOf(name: string): string {
  const slug = name
    .toLowerCase()
    .replace(/[^a-z0-9._-]+/g, '-')
    .replace(/^[-._]+|[-._]+$/g, '')
    .replace(/\.\.+/g, '.');
  return slug === '' ? 'bundle' : slug.slice(0, 40);
}

function suffixedId(id: string, slug: string, n: number): string {
  const suffix = `--${slug}${n > 1 ? `-${n}` : ''}`;
  return `${id.slice(0, 80 - suffix.length)}${suffix}`;
}

export function planBundleImport(library: Library, bundle: Bundle): BundleImportPlan {
  const db = library.db;
  const hashesOf = db
    .prepare('SELECT record_hash FROM revisions WHERE entry_id = ? ORDER BY revision')
    .pluck();
  const libraryHashes = (id: string) => hashesOf.all(id) as string[];
  const slug = slugOf(bundle.library.name);
  const bundleIds = new Set(bundle.entries.map((e) => e.id));
  const raw = new Map(
    bundle.entries.map((e) => [
      e.id,
      historyRelation({ library: libraryHashes(e.id), bundle: e.revisions.map((r) => r.recordHash) }),
    ]),
  );
  const renamed = new Map<string, RenamedEntry & { n: number }>();
  for (const [id, relation] of raw) {
    if (relation.kind === 'diverged')
      renamed.set(id, { to: suffixedId(id, slug, 1), after: relation.common, n: 1 });
  }
  for (;;) {
    const plan: BundleImportPlan = { entries: [], revisions: [], reviews: [], releases: [], assignments: [] };
    let retry = false;
    for (const entry of bundle.entries) {
      const rename = renamed.get(entry.id);
      const to = rename?.to ?? entry.id;
      let from = 0;
      let status: BundleEntryOutcome['status'];
      const rewritten = (r: BundleRevision) =>
        rewriteBundleRevision({ revision: r, from: entry.id, to, renamed });
      let revisions: BundleRevision[];
      if (rename === undefined) {
        const relation = raw.get(entry.id)!;
        revisions = entry.revisions;
        if (relation.kind === 'behind') from = relation.from;
        else if (relation.kind !== 'absent') from = entry.revisions.length;
        status = { absent: 'added', same: 'same', ahead: 'ahead', behind: 'appended', diverged: 'conflict' }[
          relation.kind
        ] as BundleEntryOutcome['status'];
      } else {
        revisions = entry.revisions.map(rewritten);
        const relation = historyRelation({
          library: libraryHashes(to),
          bundle: revisions.map((r) => r.recordHash),
        });
        if (relation.kind === 'diverged' || bundleIds.has(to)) {
          rename.n++;
          rename.to = suffixedId(entry.id, slug, rename.n);
          retry = true;
          break;
        }
        from =
          relation.kind === 'absent'
            ? 0
            : relation.kind === 'behind'
              ? relation.from
              : entry.revisions.length;
        status = 'conflict';
      }
      const added = revisions.slice(from).map((r) => (rename === undefined ? rewritten(r) : r));
      for (const revision of added)
        plan.revisions.push({ entryId: to, createdAt: entry.createdAt, revision });
      plan.entries.push({ id: entry.id, importedAs: to, status, revisionsAdded: added.length });
      plan.reviews.push(...newReviews(library, to, from, revisions));
      // The revisions both histories share are the same here: reviews made of them in the bundle join them too.
      if (rename !== undefined)
        plan.reviews.push(
          ...newReviews(library, entry.id, rename.after, entry.revisions.slice(0, rename.after)),
        );
    }
    if (retry) continue;
    plan.releases = planReleases(library, bundle, plan, { slug, renamed });
    const known = new Set(db.prepare('SELECT row FROM band_assignments').pluck().all() as string[]);
    plan.assignments = bundle.assignments.filter((a) => !known.has(a.row) && known.add(a.row));
    return plan;
  }
}

/** Reviews of the revisions written now, and those of revisions already here that the library lacks. */
function newReviews(library: Library, entryId: string, from: number, revisions: readonly BundleRevision[]) {
  const existing = library.db.prepare(
    `SELECT v.state, v.reviewer, v.note, v.created_at AS createdAt FROM reviews v
     JOIN revisions r ON r.key = v.revision_key WHERE r.entry_id = ? AND r.revision = ?`,
  );
  const out: BundleImportPlan['reviews'] = [];
  for (const r of revisions) {
    const here =
      r.revision > from
        ? new Set<string>()
        : new Set((existing.all(entryId, r.revision) as object[]).map((v) => JSON.stringify(v)));
    for (const review of r.reviews) {
      const key = JSON.stringify({
        state: review.state,
        reviewer: review.reviewer,
        note: review.note,
        createdAt: review.createdAt,
      });
      if (!here.has(key)) out.push({ entryId, revision: r.revision, review });
    }
  }
  return out;
}

/** Each release under its own tag where the library bears the source's name, else `tag+<source>`. */
function planReleases(
  library: Library,
  bundle: Bundle,
  plan: BundleImportPlan,
  names: { slug: string; renamed: ReadonlyMap<string, RenamedEntry> },
) {
  const db = library.db;
  const { slug, renamed } = names;
  /** A shared revision of a diverged entry is released as the library's own; a later one as the suffixed copy. */
  const targetOf = (m: { id: string; revision: number }) => {
    const r = renamed.get(m.id);
    return r !== undefined && m.revision > r.after ? r.to : m.id;
  };
  const inserted = new Map(
    plan.revisions.map((r) => [`${r.entryId}@${r.revision.revision}`, r.revision.contentHash]),
  );
  const hashHere = db
    .prepare('SELECT content_hash FROM revisions WHERE entry_id = ? AND revision = ?')
    .pluck();
  const membersHere = db.prepare(
    `SELECT m.entry_id AS id, r.content_hash AS hash FROM release_members m JOIN revisions r ON r.key = m.revision_key
     WHERE m.tag = ? ORDER BY m.entry_id`,
  );
  return bundle.releases.map((source) => {
    const tag = library.name === bundle.library.name ? source.tag : `${source.tag}+${slug}`.slice(0, 64);
    const members = source.members.map((m) => ({ id: targetOf(m), revision: m.revision }));
    const wanted = members
      .map((m) => ({
        id: m.id,
        hash: inserted.get(`${m.id}@${m.revision}`) ?? (hashHere.get(m.id, m.revision) as string),
      }))
      .sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
    const exists = db.prepare('SELECT 1 FROM releases WHERE tag = ?').get(tag) !== undefined;
    const status: BundleReleaseOutcome['status'] = !exists
      ? 'added'
      : JSON.stringify(membersHere.all(tag)) === JSON.stringify(wanted)
        ? 'present'
        : 'conflict';
    return { tag: source.tag, importedAs: tag, status, source, members };
  });
}

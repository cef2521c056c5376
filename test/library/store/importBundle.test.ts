// Bundle round trips: export → import into an empty library gives every content hash, review and release back
// (a property over random histories), a repeated import writes nothing, and diverged histories never overwrite.
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { addAssignments } from '../../../src/library/store/addAssignments.js';
import { bundleDigest } from '../../../src/library/store/bundleDigest.js';
import { checkLibrary } from '../../../src/library/store/checkLibrary.js';
import { createRelease } from '../../../src/library/store/createRelease.js';
import { editEntry } from '../../../src/library/store/editEntry.js';
import { exportBundle } from '../../../src/library/store/exportBundle.js';
import { importBundle } from '../../../src/library/store/importBundle.js';
import { initLibrary } from '../../../src/library/store/initLibrary.js';
import { retireEntry } from '../../../src/library/store/retireEntry.js';
import { reviewRevision } from '../../../src/library/store/reviewRevision.js';
import type { Library } from '../../../src/library/types.js';
import { bandshelfErrorOf } from '../../bandshelfErrorOf.js';
import { tempDir } from '../../cli/bandshelfCli.js';
import { addEntry, newLibrary } from '../libraryFixture.js';

const NOW = new Date('2026-02-01T00:00:00Z');

/** Every revision's (entry, revision, kind, content hash, record hash), in id and revision order. */
function revisions(library: Library) {
  return library.db
    .prepare(
      'SELECT entry_id, revision, kind, content_hash, record_hash FROM revisions ORDER BY entry_id, revision',
    )
    .all();
}

function reviews(library: Library) {
  return library.db
    .prepare(
      `SELECT r.entry_id, r.revision, v.state, v.reviewer, v.note, v.created_at FROM reviews v
       JOIN revisions r ON r.key = v.revision_key ORDER BY r.entry_id, r.revision, v.key`,
    )
    .all();
}

function releases(library: Library) {
  return library.db
    .prepare(
      `SELECT s.tag, s.created_at, s.message, s.reviewed_only, m.entry_id, r.revision, r.content_hash
       FROM releases s JOIN release_members m ON m.tag = s.tag JOIN revisions r ON r.key = m.revision_key
       ORDER BY s.tag, m.entry_id`,
    )
    .all();
}

function emptyLibrary(name = 'fixture'): Library {
  return initLibrary(join(tempDir('bandshelf-bundle-'), 'b.sqlite'), { name, now: NOW });
}

// Three small synthetic entries: band positions from common practice (amide I/II, C–O, CH stretches).
const BANDS = [
  [
    { position: 1652, height: 0.8, fwhm: 30 },
    { position: 1545, height: 0.5, fwhm: 28 },
  ],
  [{ position: 1035, height: 0.9, fwhm: 25 }],
  [
    { position: 2922, height: 0.7, fwhm: 18 },
    { position: 1740, height: 0.4, fwhm: 20 },
  ],
];

type Step =
  | { op: 'add'; entry: number; seed: number }
  | { op: 'edit'; entry: number; tag: string }
  | { op: 'review'; entry: number; reject: boolean }
  | { op: 'release' }
  | { op: 'retire'; entry: number };

/** Applies a step where it makes sense (editing an entry never added is skipped), as a lab's history would go. */
function apply(library: Library, step: Step, k: number): void {
  const id = `e${'entry' in step ? step.entry : 0}`;
  const exists = library.db
    .prepare('SELECT kind FROM revisions WHERE entry_id = ? ORDER BY revision DESC')
    .pluck()
    .get(id);
  const at = new Date(NOW.getTime() + k * 60_000);
  if (step.op === 'add') addEntry(library, id, BANDS[step.entry]!, step.seed);
  else if (exists === undefined || exists === 'retire') return;
  else if (step.op === 'edit') editEntry(library, id, { set: { tags: [step.tag] }, author: 'ann', now: at });
  else if (step.op === 'review')
    reviewRevision(library, id, {
      reviewer: 'bob',
      state: step.reject ? 'rejected' : 'reviewed',
      note: `n${k}`,
      now: at,
    });
  else if (step.op === 'retire') retireEntry(library, id, { author: 'ann', reason: 'test', now: at });
  if (step.op === 'release') createRelease(library, `v${k}`, { message: `release ${k}`, now: at });
}

const stepArb: fc.Arbitrary<Step> = fc.oneof(
  fc.record({
    op: fc.constant('add' as const),
    entry: fc.integer({ min: 0, max: 2 }),
    seed: fc.integer({ min: 1, max: 3 }),
  }),
  fc.record({
    op: fc.constant('edit' as const),
    entry: fc.integer({ min: 0, max: 2 }),
    tag: fc.constantFrom('a', 'b', 'c'),
  }),
  fc.record({
    op: fc.constant('review' as const),
    entry: fc.integer({ min: 0, max: 2 }),
    reject: fc.boolean(),
  }),
  fc.record({ op: fc.constant('release' as const) }),
  fc.record({ op: fc.constant('retire' as const), entry: fc.integer({ min: 0, max: 2 }) }),
);

describe('importBundle', () => {
  it('round trip over random histories: every content hash, review and release equal, check passes, a repeat is a no-op', () => {
    fc.assert(
      fc.property(fc.array(stepArb, { minLength: 1, maxLength: 10 }), (steps) => {
        const { library: a } = newLibrary();
        for (const [k, s] of steps.entries()) apply(a, s, k);
        const b = emptyLibrary();
        const outcome = importBundle(b, exportBundle(a, { now: NOW }));
        expect(revisions(b)).toEqual(revisions(a));
        expect(reviews(b)).toEqual(reviews(a));
        expect(releases(b)).toEqual(releases(a));
        expect(checkLibrary(b)).toEqual([]);
        expect(outcome.entries.every((e) => e.status === 'added' && e.importedAs === e.id)).toBe(true);
        const again = importBundle(b, exportBundle(a, { now: NOW }));
        expect(again.changed).toBe(false);
        expect(again.revisionsAdded + again.reviewsAdded).toBe(0);
      }),
      // Seeded, so every run sees the same histories.
      { numRuns: 12, seed: 20261204 },
    );
  });

  it('appends the later revisions of a history the library holds the start of, and keeps its own later ones', () => {
    const { library: a } = newLibrary();
    addEntry(a, 'e0', BANDS[0]!);
    const b = emptyLibrary();
    importBundle(b, exportBundle(a));
    editEntry(a, 'e0', { set: { tags: ['later'] }, author: 'ann', now: NOW });
    reviewRevision(a, 'e0', { reviewer: 'bob', now: NOW });
    const outcome = importBundle(b, exportBundle(a));
    expect(outcome.entries).toEqual([{ id: 'e0', importedAs: 'e0', status: 'appended', revisionsAdded: 1 }]);
    expect(outcome.reviewsAdded).toBe(1);
    expect(revisions(b)).toEqual(revisions(a));
    // The other way round: b now holds everything a has, and a has nothing b lacks.
    editEntry(b, 'e0', { set: { tags: ['b only'] }, author: 'cy', now: NOW });
    const ahead = importBundle(b, exportBundle(a));
    expect(ahead.changed).toBe(false);
    expect(ahead.entries[0]!.status).toBe('ahead');
  });

  it('a history both sides changed is imported under ID--SOURCE, the library keeps its own, check passes', () => {
    const { library: a } = newLibrary();
    addEntry(a, 'e0', BANDS[0]!);
    reviewRevision(a, 'e0', { reviewer: 'bob', now: NOW });
    createRelease(a, 'v1', { now: NOW });
    const b = emptyLibrary('Other lab');
    importBundle(b, exportBundle(a));
    const before = revisions(b);
    editEntry(a, 'e0', { set: { tags: ['from a'] }, author: 'ann', now: NOW });
    editEntry(b, 'e0', { set: { tags: ['from b'] }, author: 'cy', now: NOW });
    const mine = revisions(b);
    const outcome = importBundle(b, exportBundle(a));
    expect(outcome.entries).toEqual([
      { id: 'e0', importedAs: 'e0--fixture', status: 'conflict', revisionsAdded: 2 },
    ]);
    // Nothing of b's own history changed; the copy holds a's whole history under its new id.
    expect(revisions(b).filter((r) => (r as { entry_id: string }).entry_id === 'e0')).toEqual(mine);
    expect(mine.slice(0, before.length)).toEqual(before);
    const copy = b.db
      .prepare("SELECT meta FROM revisions WHERE entry_id = 'e0--fixture'")
      .pluck()
      .all() as string[];
    expect(copy.map((m) => JSON.parse(m).id)).toEqual(['e0--fixture', 'e0--fixture']);
    // b does not bear the source's name: the release came in as v1+fixture, and the shared revision 1 stays e0's.
    expect(outcome.releases).toEqual([{ tag: 'v1', importedAs: 'v1+fixture', status: 'present' }]);
    expect(checkLibrary(b)).toEqual([]);
    expect(importBundle(b, exportBundle(a)).changed).toBe(false);
  });

  it('carries the lab assignment rows once', () => {
    const { library: a } = newLibrary();
    addEntry(a, 'e0', BANDS[2]!);
    // Ester carbonyl stretch near 1740 cm⁻¹ (common practice).
    addAssignments(a, [
      {
        min: 1735,
        max: 1745,
        label: 'ester C=O',
        vibration: 'C=O stretch',
        group: 'ester',
        class: ['lipid'],
        source: 'synthetic test row',
      },
    ]);
    const b = emptyLibrary();
    expect(importBundle(b, exportBundle(a)).assignmentsAdded).toBe(1);
    expect(importBundle(b, exportBundle(a)).assignmentsAdded).toBe(0);
    expect(checkLibrary(b)).toEqual([]);
  });

  it('refuses a bundle whose content was edited, and one on another grid, writing nothing', () => {
    const { library: a } = newLibrary();
    addEntry(a, 'e0', BANDS[1]!);
    const bundle = exportBundle(a);
    const edited = structuredClone(bundle);
    edited.entries[0]!.revisions[0]!.author = 'mallory';
    const b = emptyLibrary();
    expect(bandshelfErrorOf(() => importBundle(b, edited)).code).toBe('BAD_FORMAT');
    // Stored JSON that is not JSON, under a digest made to match: refused as BAD_FORMAT, not a raw SyntaxError.
    const garbled = structuredClone(bundle);
    garbled.entries[0]!.revisions[0]!.meta = '{not json';
    garbled.digest = bundleDigest(garbled);
    expect(bandshelfErrorOf(() => importBundle(b, garbled)).message).toMatch(/stored JSON .* is unreadable/);
    const c = initLibrary(join(tempDir('bandshelf-bundle-'), 'c.sqlite'), {
      grid: { start: 4000, stop: 400, step: 4 },
    });
    expect(bandshelfErrorOf(() => importBundle(c, bundle)).code).toBe('BAD_OPTION');
    expect(revisions(b)).toEqual([]);
    expect(revisions(c)).toEqual([]);
  });
});

// Property tests of the store (fast-check, seeded): any sequence of add/edit/retire/review/release/assignment
// operations leaves a library that `check` passes, with every earlier revision, review and release unchanged; an
// operation the model says must be refused is refused with its stable code and stores nothing. Any single-row
// change of a table of record, made outside bandshelf, is refused by its triggers or named by `check`.
import { copyFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../../src/error.js';
import { prepareRevision } from '../../../src/library/ingest/prepareRevision.js';
import { addAssignments } from '../../../src/library/store/addAssignments.js';
import { checkLibrary } from '../../../src/library/store/checkLibrary.js';
import { closeLibrary } from '../../../src/library/store/closeLibrary.js';
import { commitRevisions } from '../../../src/library/store/commitRevisions.js';
import { createRelease } from '../../../src/library/store/createRelease.js';
import { editEntry } from '../../../src/library/store/editEntry.js';
import { entryHistory } from '../../../src/library/store/entryHistory.js';
import { initLibrary } from '../../../src/library/store/initLibrary.js';
import { listAssignments } from '../../../src/library/store/listAssignments.js';
import { openLibrary } from '../../../src/library/store/openLibrary.js';
import { readRelease } from '../../../src/library/store/readRelease.js';
import { retireEntry } from '../../../src/library/store/retireEntry.js';
import { reviewRevision } from '../../../src/library/store/reviewRevision.js';
import { TABLES_OF_RECORD } from '../../../src/library/store/tableDigests.js';
import type { Library, RevisionKind } from '../../../src/library/types.js';
import { bandsFor, tempDir } from '../../cli/bandshelfCli.js';
import { inputFor } from '../libraryFixture.js';

const SEED = 20_261_204;
// STORE_RUNS lowers the count for a quick local run; `npm test` runs 1,000 of each.
const RUNS = Number(process.env.STORE_RUNS ?? 1000);
const IDS = ['a', 'b', 'c'] as const;
const NOW = new Date('2026-01-02T03:04:05Z');

type Op =
  | { op: 'add'; id: number; variant: number }
  | { op: 'edit'; id: number; note: string }
  | { op: 'retire'; id: number }
  | { op: 'review'; id: number; state: 'reviewed' | 'rejected'; self: boolean }
  | { op: 'release'; tag: number; reviewedOnly: boolean }
  | { op: 'assign'; position: number };

const opArb: fc.Arbitrary<Op> = fc.oneof(
  fc.record({ op: fc.constant('add' as const), id: fc.nat(2), variant: fc.nat(3) }),
  fc.record({ op: fc.constant('edit' as const), id: fc.nat(2), note: fc.string({ maxLength: 12 }) }),
  fc.record({ op: fc.constant('retire' as const), id: fc.nat(2) }),
  fc.record({
    op: fc.constant('review' as const),
    id: fc.nat(2),
    state: fc.constantFrom('reviewed' as const, 'rejected' as const),
    self: fc.boolean(),
  }),
  fc.record({ op: fc.constant('release' as const), tag: fc.nat(2), reviewedOnly: fc.boolean() }),
  fc.record({ op: fc.constant('assign' as const), position: fc.integer({ min: 700, max: 3900 }) }),
);

/** What the library must hold: per entry its revisions (kind, hash, data variant), per release its members. */
interface Model {
  revisions: Map<string, { kind: RevisionKind; hash: string; variant: number; note: string }[]>;
  reviews: Map<string, ('reviewed' | 'rejected')[]>;
  releases: Map<string, { id: string; revision: number; hash: string }[]>;
  assignments: number;
}

const dir = tempDir('bandshelf-store-props-');
const template = join(dir, 'template.sqlite');
// A coarse grid and 10 cm⁻¹ spectra keep each case to a few milliseconds; the store's rules do not depend on them.
closeLibrary(initLibrary(template, { name: 'props', grid: { start: 4000, stop: 600, step: 10 }, now: NOW }));
let cases = 0;

function freshLibrary(): Library {
  const path = join(dir, `case-${cases++}.sqlite`);
  copyFileSync(template, path);
  const library = openLibrary(path);
  // Durability against power cuts is not what is tested here; without the fsyncs a case is ten times faster.
  library.db.pragma('synchronous = OFF');
  return library;
}

/** Removes a case's library file and its WAL companions (a full run would otherwise leave ~150 MB behind). */
function removeLibrary(path: string): void {
  for (const suffix of ['', '-wal', '-shm']) rmSync(`${path}${suffix}`, { force: true });
}

/** The head of an entry in the model, or undefined when it was never added. */
function headOf(model: Model, id: string) {
  const list = model.revisions.get(id);
  return list?.[list.length - 1];
}

/** Expects `run` to be refused with `code` (and so to store nothing, which the final check and history verify). */
function refused(run: () => unknown, code: string): void {
  let error: unknown;
  try {
    run();
  } catch (e) {
    error = e;
  }
  expect(error, `expected a ${code} refusal`).toBeInstanceOf(BandshelfError);
  expect((error as BandshelfError).code).toBe(code);
}

function apply(library: Library, model: Model, o: Op): void {
  const author = 'ann';
  if (o.op === 'assign') {
    // Band positions are generated, not physical: the store keeps whatever a valid row says.
    addAssignments(
      library,
      [
        {
          min: o.position,
          max: o.position + 5,
          label: 'generated',
          vibration: 'generated',
          group: 'generated',
          class: ['other'],
          source: 'generated',
        },
      ],
      { author, now: NOW },
    );
    model.assignments++;
    return;
  }
  if (o.op === 'release') {
    const tag = `r${o.tag}`;
    if (model.releases.has(tag)) {
      refused(() => createRelease(library, tag, { now: NOW }), 'ALREADY_EXISTS');
      return;
    }
    const members: { id: string; revision: number; hash: string }[] = [];
    for (const id of IDS) {
      const list = model.revisions.get(id) ?? [];
      const head = list[list.length - 1];
      if (head === undefined || head.kind === 'retire') continue;
      if (!o.reviewedOnly) {
        members.push({ id, revision: list.length, hash: head.hash });
        continue;
      }
      // reviewedOnly: the newest revision whose latest review is 'reviewed'.
      const reviews = model.reviews;
      for (let r = list.length; r >= 1; r--) {
        const states = reviews.get(`${id}/${r}`) ?? [];
        if (list[r - 1]!.kind !== 'retire' && states[states.length - 1] === 'reviewed') {
          members.push({ id, revision: r, hash: list[r - 1]!.hash });
          break;
        }
      }
    }
    const release = createRelease(library, tag, { now: NOW, reviewedOnly: o.reviewedOnly });
    expect(release.members).toEqual(members);
    model.releases.set(tag, members);
    return;
  }
  const id = IDS[o.id]!;
  const head = headOf(model, id);
  const alive = head !== undefined && head.kind !== 'retire';
  const revisions = model.revisions.get(id) ?? [];
  if (o.op === 'add') {
    const prepared = prepareRevision(library, inputFor(library, id, bandsFor(o.id * 10 + o.variant), 1, 10), {
      force: true,
    });
    const [outcome] = commitRevisions(library, [prepared], { author, now: NOW });
    if (alive && head.variant === o.variant && head.note === '') {
      // The same data and metadata again: nothing new is stored.
      expect(outcome!.status).toBe('unchanged');
      return;
    }
    expect(outcome!.status).toBe('added');
    expect(outcome!.revision).toBe(revisions.length + 1);
    model.revisions.set(id, [
      ...revisions,
      { kind: 'data', hash: outcome!.hash, variant: o.variant, note: '' },
    ]);
    return;
  }
  if (o.op === 'edit') {
    if (!alive) {
      refused(() => editEntry(library, id, { set: { notes: o.note || 'x' }, now: NOW }), 'NOT_FOUND');
      return;
    }
    const note = o.note.trim() === '' ? 'edited' : o.note.trim();
    const outcome = editEntry(library, id, { set: { notes: note }, author, now: NOW });
    if (note === head.note) {
      expect(outcome.status).toBe('unchanged');
      return;
    }
    expect(outcome.status).toBe('added');
    model.revisions.set(id, [
      ...revisions,
      { kind: 'metadata', hash: outcome.hash, variant: head.variant, note },
    ]);
    return;
  }
  if (o.op === 'retire') {
    if (head === undefined) {
      refused(() => retireEntry(library, id, { now: NOW }), 'NOT_FOUND');
      return;
    }
    if (!alive) {
      refused(() => retireEntry(library, id, { now: NOW }), 'ALREADY_EXISTS');
      return;
    }
    const outcome = retireEntry(library, id, { author, reason: 'generated', now: NOW });
    expect(outcome.kind).toBe('retire');
    model.revisions.set(id, [...revisions, { ...head, kind: 'retire', hash: outcome.hash }]);
    return;
  }
  // review
  const reviewer = o.self ? author : 'bea';
  if (!alive) {
    refused(() => reviewRevision(library, id, { state: o.state, reviewer, now: NOW }), 'NOT_FOUND');
    return;
  }
  if (o.self) {
    // A revision's own author may not review it.
    refused(() => reviewRevision(library, id, { state: o.state, reviewer, now: NOW }), 'BAD_OPTION');
    return;
  }
  reviewRevision(library, id, { state: o.state, reviewer, now: NOW });
  const key = `${id}/${revisions.length}`;
  model.reviews.set(key, [...(model.reviews.get(key) ?? []), o.state]);
}

/** The library agrees with the model: every revision in order with its hash and review state, every release. */
function expectHistory(library: Library, model: Model): void {
  for (const id of IDS) {
    const expected = model.revisions.get(id) ?? [];
    if (expected.length === 0) continue;
    const history = entryHistory(library, id);
    expect(history.map((h) => [h.revision, h.kind, h.hash])).toEqual(
      expected.map((r, i) => [i + 1, r.kind, r.hash]),
    );
    for (const h of history) {
      const states = model.reviews.get(`${id}/${h.revision}`) ?? [];
      expect(h.reviewState).toBe(states[states.length - 1] ?? 'draft');
    }
  }
  for (const [tag, members] of model.releases) expect(readRelease(library, tag).members).toEqual(members);
  expect(listAssignments(library).filter((a) => a.origin === 'lab')).toHaveLength(model.assignments);
}

describe('store properties (fast-check, seeded)', () => {
  it(`random operation sequences keep check passing and history intact (${RUNS} cases, seed ${SEED})`, () => {
    fc.assert(
      fc.property(fc.array(opArb, { minLength: 1, maxLength: 8 }), (ops) => {
        const library = freshLibrary();
        try {
          const model: Model = {
            revisions: new Map(),
            reviews: new Map(),
            releases: new Map(),
            assignments: 0,
          };
          for (const o of ops) apply(library, model, o);
          expect(checkLibrary(library)).toEqual([]);
          expectHistory(library, model);
        } finally {
          closeLibrary(library);
          removeLibrary(library.path);
        }
      }),
      { seed: SEED, numRuns: RUNS },
    );
    // Guards against a property that silently ran nothing.
    expect(cases).toBeGreaterThanOrEqual(RUNS);
  }, 600_000);

  it(`any single-row change to a table of record is refused or named by check (${RUNS} cases, seed ${SEED})`, () => {
    const pristine = pristineLibrary();
    let found = 0;
    fc.assert(
      fc.property(tamperArb, (t) => {
        const path = join(dir, `tamper-${cases++}.sqlite`);
        copyFileSync(pristine, path);
        const changed = applyTamper(path, t);
        if (!changed) {
          removeLibrary(path);
          return;
        }
        found++;
        let library: Library;
        try {
          library = openLibrary(path);
        } catch (error) {
          // A setting the store cannot read refuses the library at open, with its own code.
          expect(error).toBeInstanceOf(BandshelfError);
          expect(t.table).toBe('settings');
          removeLibrary(path);
          return;
        }
        try {
          const problems = checkLibrary(library);
          expect(problems.length, `${JSON.stringify(t)} was not found`).toBeGreaterThan(0);
          // The seal names the table (a blob is named by its revision or file instead).
          const named = problems.some(
            (p) => p.where === `table ${t.table}` || /revision \d+$|^file /.test(p.where),
          );
          expect(named, JSON.stringify(problems)).toBe(true);
        } finally {
          closeLibrary(library);
          removeLibrary(path);
        }
      }),
      { seed: SEED, numRuns: RUNS },
    );
    // Many generated tampers change a row (the rest meet a trigger or a constraint): the property is not vacuous.
    expect(found).toBeGreaterThan(RUNS / 3);
  }, 600_000);
});

/** A library with rows in every table of record: entries with data, metadata and retire revisions, reviews,
 * releases (one of reviewed revisions only) and lab band assignments. Returns its file, closed. */
function pristineLibrary(): string {
  const library = freshLibrary();
  const model: Model = { revisions: new Map(), reviews: new Map(), releases: new Map(), assignments: 0 };
  const ops: Op[] = [
    { op: 'add', id: 0, variant: 0 },
    { op: 'add', id: 1, variant: 1 },
    { op: 'add', id: 2, variant: 2 },
    { op: 'review', id: 0, state: 'reviewed', self: false },
    { op: 'release', tag: 0, reviewedOnly: false },
    { op: 'edit', id: 1, note: 'second' },
    { op: 'review', id: 1, state: 'rejected', self: false },
    { op: 'retire', id: 2 },
    { op: 'assign', position: 1740 },
    { op: 'assign', position: 1650 },
    { op: 'release', tag: 1, reviewedOnly: true },
  ];
  for (const o of ops) apply(library, model, o);
  expect(checkLibrary(library)).toEqual([]);
  const path = library.path;
  closeLibrary(library);
  return path;
}

type How = 'update' | 'delete' | 'replace' | 'insert';

interface Tamper {
  table: (typeof TABLES_OF_RECORD)[number];
  how: How;
  row: number;
  column: number;
  /** Drop the table's triggers for the change and put them back, as a tool that knows them could. */
  lift: boolean;
  nudge: number;
}

const tamperArb: fc.Arbitrary<Tamper> = fc.record({
  table: fc.constantFrom(...TABLES_OF_RECORD),
  how: fc.constantFrom<How>('update', 'delete', 'replace', 'insert'),
  row: fc.nat(),
  column: fc.nat(),
  // Three in four lift the triggers: those changes get past the triggers and must be found by check.
  lift: fc.constantFrom(true, true, true, false),
  nudge: fc.integer({ min: 1, max: 255 }),
});

/** Another value of the same type: text gains a character, a number moves, a blob has one byte flipped. */
function nudged(value: unknown, nudge: number): unknown {
  if (typeof value === 'string') return `${value}${String.fromCharCode(32 + (nudge % 90))}`;
  if (typeof value === 'number') return Number.isInteger(value) ? value + nudge : value * (1 + nudge * 1e-12);
  if (typeof value === 'bigint') return value + BigInt(nudge);
  if (value instanceof Uint8Array) {
    const copy = Buffer.from(value);
    if (copy.length === 0) return Buffer.from([nudge]);
    copy[nudge % copy.length] = copy[nudge % copy.length]! ^ (1 + (nudge % 255));
    return copy;
  }
  return nudge;
}

/** Applies one tamper through a plain connection (the sqlite3 tool's defaults: no foreign keys, no recursive
 * triggers). Returns whether a row changed; a refusal (trigger or constraint) changes nothing. */
function applyTamper(path: string, t: Tamper): boolean {
  const db = new Database(path);
  try {
    const rows = db.prepare(`SELECT rowid AS __rowid, * FROM ${t.table} ORDER BY rowid`).all() as Record<
      string,
      unknown
    >[];
    expect(rows.length, `${t.table} has rows`).toBeGreaterThan(0);
    const { __rowid, ...cols } = rows[t.row % rows.length]!;
    const names = Object.keys(cols);
    const target = names[t.column % names.length]!;
    const value = nudged(cols[target], t.nudge);
    const triggers = t.lift
      ? (db
          .prepare("SELECT name, sql FROM sqlite_schema WHERE type = 'trigger' AND tbl_name = ?")
          .all(t.table) as { name: string; sql: string }[])
      : [];
    for (const trigger of triggers) db.exec(`DROP TRIGGER ${trigger.name}`);
    let changes = 0;
    try {
      if (t.how === 'update') {
        changes = db
          .prepare(`UPDATE ${t.table} SET ${target} = ? WHERE rowid = ?`)
          .run(value, __rowid).changes;
      } else if (t.how === 'delete') {
        changes = db.prepare(`DELETE FROM ${t.table} WHERE rowid = ?`).run(__rowid).changes;
      } else {
        const verb = t.how === 'replace' ? 'INSERT OR REPLACE' : 'INSERT';
        const values = names.map((n) => (n === target ? value : cols[n]));
        changes = db
          .prepare(
            `${verb} INTO ${t.table} (${names.join(', ')}) VALUES (${names.map(() => '?').join(', ')})`,
          )
          .run(...values).changes;
      }
    } catch (error) {
      const message = (error as Error).message;
      // Refused: by an immutability trigger or by a constraint of the table. Nothing was written.
      expect(message).toMatch(/immutable|constraint|UNIQUE|NOT NULL|CHECK|datatype|cannot store/i);
    } finally {
      for (const trigger of triggers) db.exec(trigger.sql);
    }
    return changes > 0;
  } finally {
    db.close();
  }
}

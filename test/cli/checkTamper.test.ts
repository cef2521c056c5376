// `bandshelf check` finds what was changed behind bandshelf's back: a processed blob, file bytes, metadata, a
// missing immutability trigger; each run names the entry and revision (or the file) and exits non-zero.
import { copyFileSync, mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { beforeAll, describe, expect, it } from 'vitest';
import { TABLES_OF_RECORD } from '../../src/library/store/tableDigests.js';
import { bandsFor, bandshelf, parseJson, tempDir, writeSpectrumCsv } from './bandshelfCli.js';

interface CheckJson {
  ok: boolean;
  revisions: number;
  problems: { where: string; problem: string }[];
}

describe('bandshelf check on a tampered library', () => {
  const dir = tempDir();
  const pristine = join(dir, 'pristine.sqlite');

  beforeAll(() => {
    expect(bandshelf(['init', '--library', pristine]).code).toBe(0);
    const data = join(dir, 'data');
    mkdirSync(data);
    for (let k = 0; k < 3; k++) writeSpectrumCsv(join(data, `s${k}.csv`), bandsFor(k + 10));
    expect(bandshelf(['add', data, '--library', pristine]).code).toBe(0);
    expect(bandshelf(['edit', 's1', '--set', 'notes=second revision', '--library', pristine]).code).toBe(0);
    const ok = bandshelf(['check', '--library', pristine]);
    expect(ok.code, ok.stderr).toBe(0);
    expect(ok.stdout).toContain('ok: 4 revisions verified');
  });

  /** Copies the pristine library, applies `tamper` with better-sqlite3 and returns check's result. */
  function tampered(name: string, tamper: (db: Database.Database) => void) {
    const path = join(dir, `${name}.sqlite`);
    copyFileSync(pristine, path);
    const db = new Database(path);
    tamper(db);
    db.close();
    const text = bandshelf(['check', '--library', path]);
    const json = bandshelf(['check', '--library', path, '--json']);
    return { text, json: parseJson<CheckJson>(json.stdout), jsonCode: json.code };
  }

  /** Runs an UPDATE on an immutable table by lifting its trigger for the moment, as an outside tool could. */
  function unguarded(db: Database.Database, table: string, sql: string, ...params: unknown[]) {
    const trigger = db
      .prepare('SELECT sql FROM sqlite_schema WHERE name = ?')
      .pluck()
      .get(`${table}_no_update`) as string;
    db.exec(`DROP TRIGGER ${table}_no_update`);
    db.prepare(sql).run(...params);
    db.exec(trigger);
  }

  it('bandshelf itself refuses to update a revision row (immutability triggers)', () => {
    const db = new Database(pristine, { readonly: false });
    expect(() => db.prepare("UPDATE revisions SET message = 'x'").run()).toThrow(/immutable/);
    expect(() => db.prepare('DELETE FROM revisions').run()).toThrow(/immutable/);
    db.close();
  });

  it('a changed value in a processed-vector blob is named by entry, revision and wavenumber', () => {
    const r = tampered('blob', (db) => {
      const blob = db
        .prepare("SELECT processed FROM revisions WHERE entry_id = 's0'")
        .pluck()
        .get() as Buffer;
      const copy = Buffer.from(blob);
      // Grid point 500 is 1600 cm⁻¹ on the 4000:600:2 grid.
      copy.writeFloatLE(copy.readFloatLE(500 * 4) + 0.05, 500 * 4);
      unguarded(db, 'revisions', "UPDATE revisions SET processed = ? WHERE entry_id = 's0'", copy);
    });
    expect(r.text.code).toBe(1);
    expect(r.text.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.text.stderr).toMatch(/^bandshelf: .*s0 revision 1.*\[CHECK_FAILED\]/);
    expect(r.jsonCode).toBe(1);
    expect(r.json.ok).toBe(false);
    const wheres = r.json.problems.map((p) => `${p.where}: ${p.problem}`);
    expect(wheres.some((w) => w.startsWith('s0 revision 1: processed value at 1600 cm⁻¹'))).toBe(true);
    expect(wheres.some((w) => w.startsWith('s0 revision 1: the stored record does not match'))).toBe(true);
    expect(r.json.problems.every((p) => p.where.startsWith('s0 revision 1'))).toBe(true);
  });

  it('a flipped byte in a stored file is found by its SHA-256', () => {
    const r = tampered('file', (db) => {
      const row = db.prepare('SELECT sha256, bytes FROM files LIMIT 1').get() as {
        sha256: string;
        bytes: Buffer;
      };
      const copy = Buffer.from(row.bytes);
      copy[100] = copy[100]! ^ 0x01;
      unguarded(db, 'files', 'UPDATE files SET bytes = ? WHERE sha256 = ?', copy, row.sha256);
    });
    expect(r.jsonCode).toBe(1);
    expect(r.json.problems.some((p) => p.where.startsWith('file ') && p.problem.includes('hash'))).toBe(true);
  });

  it('edited metadata JSON breaks the content and record hashes of that revision only', () => {
    const r = tampered('meta', (db) => {
      const meta = db
        .prepare("SELECT meta FROM revisions WHERE entry_id = 's1' AND revision = 2")
        .pluck()
        .get() as string;
      unguarded(
        db,
        'revisions',
        "UPDATE revisions SET meta = ? WHERE entry_id = 's1' AND revision = 2",
        meta.replace('second revision', 'rewritten'),
      );
    });
    expect(r.jsonCode).toBe(1);
    // The seal names the table; the revision's own hashes name the revision.
    expect(new Set(r.json.problems.map((p) => p.where))).toEqual(
      new Set(['s1 revision 2', 'table revisions']),
    );
    expect(r.json.problems.map((p) => p.problem)).toContain(
      'the content hash does not match data, recipe and metadata',
    );
  });

  it('a dropped immutability trigger is reported', () => {
    const r = tampered('trigger', (db) => db.exec('DROP TRIGGER reviews_no_delete'));
    expect(r.jsonCode).toBe(1);
    expect(r.json.problems).toEqual([
      { where: 'database', problem: 'the immutability trigger reviews_no_delete is missing' },
    ]);
  });
});

describe('every table of record refuses or check finds each row-level tamper', () => {
  const dir = tempDir();
  const pristine = join(dir, 'pristine.sqlite');
  const lib = ['--library', pristine];
  const tables = [...TABLES_OF_RECORD];

  beforeAll(() => {
    expect(bandshelf(['init', ...lib]).code).toBe(0);
    const data = join(dir, 'data');
    mkdirSync(data);
    for (let k = 0; k < 2; k++) writeSpectrumCsv(join(data, `s${k}.csv`), bandsFor(k + 10));
    expect(bandshelf(['add', data, ...lib]).code).toBe(0);
    expect(bandshelf(['review', 's0', ...lib, '--approve', '--reviewer', 'ann']).code).toBe(0);
    expect(bandshelf(['release', 'v1', ...lib, '--message', 'first']).code).toBe(0);
    const rows = join(dir, 'rows.json');
    // Band position of the ester carbonyl stretch, ~1740 cm⁻¹ (common practice).
    writeFileSync(
      rows,
      JSON.stringify([
        {
          min: 1740,
          max: 1745,
          label: 'ester C=O',
          vibration: 'C=O stretch',
          group: 'ester',
          class: ['lipid'],
          source: 'synthetic test row',
        },
      ]),
    );
    const a = bandshelf(['assignments', '--add', rows, ...lib]);
    expect(a.code, a.stderr).toBe(0);
    expect(bandshelf(['check', ...lib]).code).toBe(0);
  });

  /** Each tamper on one row, as the sqlite3 tool would run it: a plain connection, recursive_triggers off. */
  function tamper(db: Database.Database, table: string, how: 'update' | 'delete' | 'replace'): void {
    const row = db.prepare(`SELECT rowid AS __rowid, * FROM ${table} ORDER BY rowid LIMIT 1`).get() as Record<
      string,
      unknown
    >;
    expect(row, `${table} has a row`).toBeDefined();
    const { __rowid, ...cols } = row;
    const names = Object.keys(cols);
    // A column outside the key gets a changed value (a text one when there is one), so REPLACE collides.
    const info = db.prepare(`PRAGMA table_info(${table})`).all() as { name: string; pk: number }[];
    const free = names.filter((n) => info.find((c) => c.name === n)?.pk === 0);
    const target = free.find((n) => typeof cols[n] === 'string') ?? free[0]!;
    const changed = typeof cols[target] === 'string' ? `${cols[target]}x` : Number(cols[target]) + 1;
    if (how === 'update')
      db.prepare(`UPDATE ${table} SET ${target} = ? WHERE rowid = ?`).run(changed, __rowid);
    else if (how === 'delete') db.prepare(`DELETE FROM ${table} WHERE rowid = ?`).run(__rowid);
    else {
      const values = names.map((n) => (n === target ? changed : cols[n]));
      db.prepare(
        `INSERT OR REPLACE INTO ${table} (${names.join(', ')}) VALUES (${names.map(() => '?').join(', ')})`,
      ).run(...values);
    }
  }

  for (const table of tables) {
    for (const how of ['update', 'delete', 'replace'] as const) {
      it(`${how} on ${table}`, () => {
        const path = join(dir, `${table}-${how}.sqlite`);
        copyFileSync(pristine, path);
        const db = new Database(path);
        db.pragma('foreign_keys = OFF');
        let refused = false;
        try {
          tamper(db, table, how);
        } catch (error) {
          refused = /immutable/.test((error as Error).message);
        }
        db.close();
        if (refused) return;
        const r = bandshelf(['check', '--library', path, '--json']);
        expect(r.code, `${table} ${how} was neither refused nor found`).toBe(1);
        expect(parseJson<CheckJson>(r.stdout).ok).toBe(false);
      });
    }
  }

  it('with recursive triggers on, INSERT OR REPLACE is refused by the delete trigger even without the insert guard', () => {
    const path = join(dir, 'recursive.sqlite');
    copyFileSync(pristine, path);
    const db = new Database(path);
    db.exec('DROP TRIGGER entries_no_replace_id');
    db.pragma('recursive_triggers = ON');
    const row = db.prepare('SELECT id, created_at FROM entries LIMIT 1').get() as {
      id: string;
      created_at: string;
    };
    expect(() =>
      db.prepare('INSERT OR REPLACE INTO entries (id, created_at) VALUES (?, ?)').run(row.id, 'x'),
    ).toThrow(/immutable/);
    db.pragma('recursive_triggers = OFF');
    // Without it (the sqlite3 tool's default) the same statement deletes the old row silently: the insert guard is needed.
    db.prepare('INSERT OR REPLACE INTO entries (id, created_at) VALUES (?, ?)').run(row.id, 'x');
    db.close();
  });
});

// Brings a library file's tables up to the current layout, one step per PRAGMA user_version.
import type Database from 'better-sqlite3';
import { BandshelfError } from '../../error.js';
import { appendSeal } from './appendSeal.js';
import { TABLES_OF_RECORD } from './tableDigests.js';

/** Immutable tables: rows are only ever inserted; triggers refuse UPDATE and DELETE so history stays honest. */
const IMMUTABLE = TABLES_OF_RECORD.filter((t) => t !== 'settings' && t !== 'band_assignments');

const V1 = `
CREATE TABLE settings (
  key TEXT PRIMARY KEY,
  value TEXT NOT NULL
) STRICT;

CREATE TABLE entries (
  id TEXT PRIMARY KEY,
  created_at TEXT NOT NULL
) STRICT;

-- One immutable row per revision. Blobs are little-endian: original_x/original_y Float64, processed Float32
-- (NaN = not covered), peaks Float64 quadruples (position, height, prominence, fwhm) ascending in position.
CREATE TABLE revisions (
  key INTEGER PRIMARY KEY,
  entry_id TEXT NOT NULL REFERENCES entries(id),
  revision INTEGER NOT NULL CHECK (revision > 0),
  kind TEXT NOT NULL CHECK (kind IN ('data', 'metadata', 'retire')),
  content_hash TEXT NOT NULL,
  data_hash TEXT NOT NULL,
  read_options TEXT NOT NULL,
  recipe TEXT NOT NULL,
  meta TEXT NOT NULL,
  original_x BLOB NOT NULL,
  original_y BLOB NOT NULL,
  processed BLOB NOT NULL,
  covered_points INTEGER NOT NULL,
  coverage_min REAL,
  coverage_max REAL,
  peaks BLOB NOT NULL,
  qc TEXT NOT NULL,
  extras TEXT NOT NULL,
  author TEXT NOT NULL,
  message TEXT NOT NULL,
  created_at TEXT NOT NULL,
  record_hash TEXT NOT NULL,
  UNIQUE (entry_id, revision)
) STRICT;

-- File bytes, stored once however many revisions use them.
CREATE TABLE files (
  sha256 TEXT PRIMARY KEY,
  bytes BLOB NOT NULL
) STRICT;

CREATE TABLE revision_files (
  revision_key INTEGER NOT NULL REFERENCES revisions(key),
  position INTEGER NOT NULL,
  role TEXT NOT NULL CHECK (role IN ('data', 'sample-trace', 'reference-trace')),
  name TEXT NOT NULL,
  sha256 TEXT NOT NULL REFERENCES files(sha256),
  PRIMARY KEY (revision_key, position)
) STRICT;

-- Review decisions are rows of their own: the newest one for a revision is its state; none means draft.
CREATE TABLE reviews (
  key INTEGER PRIMARY KEY,
  revision_key INTEGER NOT NULL REFERENCES revisions(key),
  state TEXT NOT NULL CHECK (state IN ('reviewed', 'rejected')),
  reviewer TEXT NOT NULL,
  note TEXT NOT NULL,
  created_at TEXT NOT NULL
) STRICT;
CREATE INDEX reviews_by_revision ON reviews (revision_key, key);

CREATE TABLE releases (
  tag TEXT PRIMARY KEY,
  created_at TEXT NOT NULL,
  message TEXT NOT NULL,
  reviewed_only INTEGER NOT NULL CHECK (reviewed_only IN (0, 1))
) STRICT;

CREATE TABLE release_members (
  tag TEXT NOT NULL REFERENCES releases(tag),
  entry_id TEXT NOT NULL REFERENCES entries(id),
  revision_key INTEGER NOT NULL REFERENCES revisions(key),
  PRIMARY KEY (tag, entry_id)
) STRICT;
CREATE INDEX release_members_by_revision ON release_members (revision_key);

-- The lab's own band-assignment rows (JSON validated at insert), beside the table bandshelf ships.
CREATE TABLE band_assignments (
  key INTEGER PRIMARY KEY,
  row TEXT NOT NULL,
  author TEXT NOT NULL,
  created_at TEXT NOT NULL
) STRICT;
`;

function immutabilityTriggers(tables: string[]): string {
  return tables
    .map(
      (table) => `
CREATE TRIGGER ${table}_no_update BEFORE UPDATE ON ${table}
BEGIN SELECT RAISE(ABORT, '${table} rows are immutable'); END;
CREATE TRIGGER ${table}_no_delete BEFORE DELETE ON ${table}
BEGIN SELECT RAISE(ABORT, '${table} rows are immutable'); END;`,
    )
    .join('\n');
}

/** Tables made immutable in layout 2 (settings never change after init; lab assignment rows are appended). */
const IMMUTABLE_V2 = ['settings', 'band_assignments', 'seals'];

/** Every unique key of every table of record: INSERT OR REPLACE deletes the row holding it without firing the
 * delete triggers (unless recursive_triggers is on, which the sqlite3 tool leaves off), so a BEFORE INSERT
 * trigger refuses any insert that collides. */
const UNIQUE_KEYS: [string, string[]][] = [
  ['settings', ['key']],
  ['entries', ['id']],
  ['revisions', ['key']],
  ['revisions', ['entry_id', 'revision']],
  ['files', ['sha256']],
  ['revision_files', ['revision_key', 'position']],
  ['reviews', ['key']],
  ['releases', ['tag']],
  ['release_members', ['tag', 'entry_id']],
  ['band_assignments', ['key']],
  ['seals', ['key']],
];

function noReplaceTriggers(): string {
  return UNIQUE_KEYS.map(
    ([table, cols]) => `
CREATE TRIGGER ${table}_no_replace_${cols.join('_')} BEFORE INSERT ON ${table}
WHEN EXISTS (SELECT 1 FROM ${table} WHERE ${cols.map((c) => `${c} = NEW.${c}`).join(' AND ')})
BEGIN SELECT RAISE(ABORT, '${table} rows are immutable (a row with this key exists)'); END;`,
  ).join('\n');
}

// Layout 2: seals (a digest of every table of record after each write), and no update, delete or replace anywhere.
const V2 = `
CREATE TABLE seals (
  key INTEGER PRIMARY KEY,
  digests TEXT NOT NULL,
  created_at TEXT NOT NULL
) STRICT;
`;

/** Migrations in order: index i takes user_version i to i + 1. */
const STEPS: string[] = [
  V1 + immutabilityTriggers(IMMUTABLE),
  V2 + immutabilityTriggers(IMMUTABLE_V2) + noReplaceTriggers(),
];

/** The user_version a library written by this code has. */
export const LIBRARY_VERSION = STEPS.length;

/** Names of the triggers that keep history immutable (checked by `check`). */
export const IMMUTABILITY_TRIGGERS = [
  ...[...IMMUTABLE, ...IMMUTABLE_V2].flatMap((t) => [`${t}_no_update`, `${t}_no_delete`]),
  ...UNIQUE_KEYS.map(([t, cols]) => `${t}_no_replace_${cols.join('_')}`),
];

export interface MigrateLibraryOptions {
  /** The library file, named in errors.
   * @default undefined */
  file?: string;
}

export function migrateLibrary(db: Database.Database, options: MigrateLibraryOptions = {}): void {
  const version = db.pragma('user_version', { simple: true }) as number;
  if (version > LIBRARY_VERSION) {
    throw new BandshelfError(
      'NO_LIBRARY',
      `the library has layout version ${version}; this bandshelf understands up to ${LIBRARY_VERSION} (upgrade bandshelf)`,
      { file: options.file },
    );
  }
  for (let v = version; v < LIBRARY_VERSION; v++) {
    const step = STEPS[v]!;
    db.transaction(() => {
      db.exec(step);
      // A library from before seals gets its first one: later changes behind its back are then named.
      if (v + 1 === 2) appendSeal(db);
      db.pragma(`user_version = ${v + 1}`);
    }).immediate();
  }
}

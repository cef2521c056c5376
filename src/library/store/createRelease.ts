// Freezes the current revision of every entry (or the newest reviewed one) under a tag.
import { BandshelfError } from '../../error.js';
import type { Library, Release } from '../types.js';
import { damagedLibraryAdvice } from './damagedLibraryAdvice.js';
import { readRelease } from './readRelease.js';
import { stateSelect } from './stateSelect.js';
import { writeTransaction } from './writeTransaction.js';

export interface CreateReleaseOptions {
  /** @default '' */
  message?: string;
  /**
   * Publish reviewed revisions only: each entry contributes its newest revision whose review state is `reviewed`
   * (a later draft edit does not hold an entry back; it is released at its last reviewed revision), and entries
   * with no reviewed revision are left out. Retired entries are never released.
   * @default false
   */
  reviewedOnly?: boolean;
  now?: Date;
}

/** Tags become folder names and URL segments: keep them to a safe alphabet. */
const TAG = /^[A-Za-z0-9][A-Za-z0-9._+-]{0,63}$/;

export function createRelease(library: Library, tag: string, options: CreateReleaseOptions = {}): Release {
  if (!TAG.test(tag) || tag.includes('..') || tag === 'current') {
    throw new BandshelfError(
      'BAD_OPTION',
      `bad release tag '${tag}': use letters, digits, '.', '_', '+', '-' (up to 64, not 'current')`,
      { field: 'tag' },
    );
  }
  const db = library.db;
  const quick = db.prepare('PRAGMA quick_check').pluck().all() as string[];
  if (!(quick.length === 1 && quick[0] === 'ok')) {
    throw new BandshelfError('DAMAGED_LIBRARY', damagedLibraryAdvice(quick[0] ?? 'quick_check failed'), {
      file: library.path,
    });
  }
  writeTransaction(
    library,
    () => {
      if (db.prepare('SELECT 1 FROM releases WHERE tag = ?').get(tag) !== undefined) {
        throw new BandshelfError('ALREADY_EXISTS', `release '${tag}' already exists; releases never change`, {
          field: 'tag',
        });
      }
      const current = stateSelect(library, 'r.entry_id, r.key', {});
      let members = db.prepare(current.sql).all() as { entry_id: string; key: number }[];
      if (options.reviewedOnly) {
        const newestReviewed = db.prepare(
          `SELECT r.key FROM revisions r WHERE r.entry_id = ? AND r.kind != 'retire' AND
          (SELECT v.state FROM reviews v WHERE v.revision_key = r.key ORDER BY v.key DESC LIMIT 1) = 'reviewed'
         ORDER BY r.revision DESC LIMIT 1`,
        );
        members = members.flatMap((m) => {
          const key = newestReviewed.pluck().get(m.entry_id) as number | undefined;
          return key === undefined ? [] : [{ entry_id: m.entry_id, key }];
        });
      }
      db.prepare('INSERT INTO releases (tag, created_at, message, reviewed_only) VALUES (?, ?, ?, ?)').run(
        tag,
        (options.now ?? new Date()).toISOString(),
        options.message ?? '',
        options.reviewedOnly ? 1 : 0,
      );
      const insert = db.prepare('INSERT INTO release_members (tag, entry_id, revision_key) VALUES (?, ?, ?)');
      for (const m of members) insert.run(tag, m.entry_id, m.key);
    },
    { what: `release '${tag}'` },
  );
  return readRelease(library, tag);
}

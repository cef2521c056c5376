// Checks a bundle before anything of it is written: its digest, every file's SHA-256, and every revision's
// content and record hash recomputed from its own fields, so an import never stores what `check` would refuse.
import { BandshelfError } from '../../error.js';
import type { Bundle } from '../../schema/bundle.js';
import type { FileRole, ReadOptions } from '../types.js';
import { bundleDigest } from './bundleDigest.js';
import { contentHashes } from './contentHashes.js';
import { recordHash } from './recordHash.js';
import { revisionRowFromBundle } from './revisionRowFromBundle.js';
import { sha256Hex } from './sha256Hex.js';

export interface VerifyBundleOptions {
  /** The bundle file, named in errors.
   * @default undefined */
  file?: string;
}

/** The revision's data and content hash recomputed from its stored JSON; `unreadable` when that JSON is not JSON. */
function storedHashes(
  revision: Bundle['entries'][number]['revisions'][number],
  unreadable: () => never,
): ReturnType<typeof contentHashes> {
  try {
    return contentHashes({
      files: revision.files.map((f) => ({ role: f.role as FileRole, sha256: f.sha256 })),
      read: JSON.parse(revision.readOptions) as ReadOptions,
      recipe: JSON.parse(revision.recipe),
      meta: JSON.parse(revision.meta),
    });
  } catch {
    return unreadable();
  }
}

export function verifyBundle(bundle: Bundle, options: VerifyBundleOptions = {}): void {
  const fail = (message: string, field?: string): never => {
    throw new BandshelfError('BAD_FORMAT', message, { file: options.file, ...(field ? { field } : {}) });
  };
  if (bundleDigest(bundle) !== bundle.digest)
    fail('the bundle does not match its digest (damaged or edited after export)', 'digest');
  for (const [sha, text] of Object.entries(bundle.files)) {
    if (sha256Hex(Buffer.from(text, 'base64')) !== sha)
      fail(`file ${sha.slice(0, 12)}… does not match its SHA-256`);
  }
  for (const entry of bundle.entries) {
    for (const [i, revision] of entry.revisions.entries()) {
      const where = `${entry.id} revision ${revision.revision}`;
      if (revision.revision !== i + 1) fail(`${where}: revisions must run 1, 2, … without gaps`, 'entries');
      for (const f of revision.files) {
        if (bundle.files[f.sha256] === undefined) fail(`${where}: file ${f.name} is missing from the bundle`);
      }
      const hashes = storedHashes(revision, () =>
        fail(`${where}: its stored JSON (reading options, recipe or metadata) is unreadable`),
      );
      if (hashes.content !== revision.contentHash || hashes.data !== revision.dataHash)
        fail(`${where}: the content hash does not match its files, recipe and metadata`);
      const { row, files } = revisionRowFromBundle({ revision, entryId: entry.id });
      if (recordHash(row, files) !== revision.recordHash) fail(`${where}: the record hash does not match`);
    }
  }
  const ids = new Set(bundle.entries.map((e) => e.id));
  for (const release of bundle.releases) {
    for (const m of release.members) {
      const entry = bundle.entries.find((e) => e.id === m.id);
      if (!ids.has(m.id) || entry === undefined || m.revision > entry.revisions.length)
        fail(
          `release ${release.tag}: member ${m.id} revision ${m.revision} is not in the bundle`,
          'releases',
        );
    }
  }
}

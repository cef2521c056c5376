// The running seal: folding each write's new rows onto the last seal gives the chain a pass over every row gives,
// and a row changed behind bandshelf's back stays found by check even after later writes.
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkLibrary } from '../../../src/library/store/checkLibrary.js';
import { closeLibrary } from '../../../src/library/store/closeLibrary.js';
import { editEntry } from '../../../src/library/store/editEntry.js';
import { type SealChains, sealChains } from '../../../src/library/store/sealChains.js';
import { TABLES_OF_RECORD } from '../../../src/library/store/tableDigests.js';
import type { Library } from '../../../src/library/types.js';
import { addEntry, threeEntryLibrary } from '../libraryFixture.js';

function lastSeal(library: Library): SealChains {
  const digests = library.db
    .prepare('SELECT digests FROM seals ORDER BY key DESC LIMIT 1')
    .pluck()
    .get() as string;
  return (JSON.parse(digests) as { chains: SealChains }).chains;
}

describe('sealChains', () => {
  let library: Library;
  beforeAll(() => {
    library = threeEntryLibrary();
    editEntry(library, 'amide', { set: { notes: 'second revision' } });
    addEntry(library, 'late', [{ position: 1450, height: 0.4, fwhm: 18 }]);
  });
  afterAll(() => closeLibrary(library));

  it('the seal each write left equals the chains recomputed over every row', () => {
    const sealed = lastSeal(library);
    const full = sealChains(library.db);
    expect(Object.keys(full)).toEqual([...TABLES_OF_RECORD]);
    expect(sealed).toEqual(full);
    expect(full.revisions!.rows).toBe(5);
    expect(full.entries!.rows).toBe(4);
  });

  it('a chain is SHA-256 over the previous digest and the row, in rowid order (worked by hand here)', () => {
    // The definition written out for the settings table: origin digest, then each row's quoted columns.
    let digest = createHash('sha256').update('bandshelf seal chain v1 settings\n').digest('hex');
    const rows = library.db
      .prepare("SELECT rowid || ',' || quote(key) || ',' || quote(value) FROM settings ORDER BY rowid")
      .pluck()
      .all() as string[];
    for (const row of rows) digest = createHash('sha256').update(`${digest}\n${row}`).digest('hex');
    expect(sealChains(library.db).settings!.digest).toBe(digest);
  });

  it('folding from an earlier seal reads only the newer rows and lands on the same chains', () => {
    const before = sealChains(library.db);
    addEntry(library, 'later', [{ position: 1240, height: 0.5, fwhm: 22 }]);
    expect(sealChains(library.db, { from: before })).toEqual(sealChains(library.db));
    expect(lastSeal(library)).toEqual(sealChains(library.db));
  });

  it('a row changed behind bandshelf’s back is still named after a later write sealed the library', () => {
    library.db.exec('DROP TRIGGER entries_no_update');
    library.db.prepare("UPDATE entries SET created_at = 'tampered' WHERE id = 'carbo'").run();
    addEntry(library, 'after-tamper', [{ position: 1080, height: 0.6, fwhm: 20 }]);
    expect(checkLibrary(library).map((p) => p.where)).toContain('table entries');
  });
});

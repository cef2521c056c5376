// The band search's view of a library state: the same entries, state key and peak index as the search set, no vectors.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { closeLibrary } from '../../../src/library/store/closeLibrary.js';
import { editEntry } from '../../../src/library/store/editEntry.js';
import { readEntry } from '../../../src/library/store/readEntry.js';
import { readPeakSet } from '../../../src/library/store/readPeakSet.js';
import { readSearchSet } from '../../../src/library/store/readSearchSet.js';
import { retireEntry } from '../../../src/library/store/retireEntry.js';
import type { Library } from '../../../src/library/types.js';
import { threeEntryLibrary } from '../libraryFixture.js';

function samePeaks(a: ReturnType<typeof readPeakSet>, b: ReturnType<typeof readSearchSet>): void {
  expect(a.entries).toEqual(b.entries);
  expect(a.stateKey).toBe(b.stateKey);
  expect(a.at).toBe(b.at);
  expect(a.grid).toEqual(b.grid);
  expect(Array.from(a.peaks.entry)).toEqual(Array.from(b.peaks.entry));
  expect(Array.from(a.peaks.position)).toEqual(Array.from(b.peaks.position));
  expect(Array.from(a.peaks.height)).toEqual(Array.from(b.peaks.height));
  expect(Array.from(a.peaks.prominence)).toEqual(Array.from(b.peaks.prominence));
}

describe('readPeakSet', () => {
  let library: Library;
  beforeAll(() => {
    library = threeEntryLibrary();
  });
  afterAll(() => closeLibrary(library));

  it('holds the search set’s entries, state key and position-sorted peaks, each pointing at its row', () => {
    const set = readPeakSet(library);
    samePeaks(set, readSearchSet(library));
    expect(set.entries.map((e) => e.id)).toEqual(['amide', 'carbo', 'lipid']);
    const total = set.entries.reduce((n, e) => n + readEntry(library, e.id).peaks.length, 0);
    expect(set.peaks.position.length).toBe(total);
    for (let k = 1; k < total; k++)
      expect(set.peaks.position[k]!).toBeGreaterThanOrEqual(set.peaks.position[k - 1]!);
    // Every peak of row r is one of entry r's stored peaks.
    for (let k = 0; k < total; k++) {
      const stored = readEntry(library, set.entries[set.peaks.entry[k]!]!.id).peaks;
      expect(stored.some((p) => p.position === set.peaks.position[k])).toBe(true);
    }
  });

  it('never reads the processed vectors or the originals', () => {
    const prepare = vi.spyOn(library.db, 'prepare');
    try {
      readPeakSet(library);
      const sql = prepare.mock.calls.map((call) => String(call[0]));
      expect(sql.length).toBeGreaterThan(0);
      for (const text of sql) expect(text).not.toMatch(/processed|original|\*/);
    } finally {
      prepare.mockRestore();
    }
  });

  it('follows the working state and keeps a release frozen, like readSearchSet', () => {
    const before = readPeakSet(library);
    editEntry(library, 'carbo', { set: { notes: 'edited' }, author: 'fixture' });
    retireEntry(library, 'lipid', { reason: 'test', author: 'fixture' });
    const after = readPeakSet(library);
    samePeaks(after, readSearchSet(library));
    expect(after.stateKey).not.toBe(before.stateKey);
    expect(after.entries.map((e) => [e.id, e.revision])).toEqual([
      ['amide', 1],
      ['carbo', 2],
    ]);
    const frozen = readPeakSet(library, { at: 'r1' });
    samePeaks(frozen, readSearchSet(library, { at: 'r1' }));
    expect(frozen.at).toBe('r1');
    expect(frozen.stateKey).toBe(before.stateKey);
    expect(() => readPeakSet(library, { at: 'nope' })).toThrow(/no release is tagged 'nope'/);
  });
});

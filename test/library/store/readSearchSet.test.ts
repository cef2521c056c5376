// The matcher's view of a library state: one Float32 matrix in id order and a position-sorted peak index.
import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeLibrary } from '../../../src/library/store/closeLibrary.js';
import { editEntry } from '../../../src/library/store/editEntry.js';
import { listEntries } from '../../../src/library/store/listEntries.js';
import { readEntry } from '../../../src/library/store/readEntry.js';
import { readSearchSet } from '../../../src/library/store/readSearchSet.js';
import { retireEntry } from '../../../src/library/store/retireEntry.js';
import type { Library } from '../../../src/library/types.js';
import { threeEntryLibrary } from '../libraryFixture.js';

describe('readSearchSet', () => {
  let library: Library;
  beforeAll(() => {
    library = threeEntryLibrary();
  });
  afterAll(() => closeLibrary(library));

  it('holds one row per current entry, in id order, equal to each entry’s stored processed vector', () => {
    const set = readSearchSet(library);
    expect(set.entries.map((e) => e.id)).toEqual(['amide', 'carbo', 'lipid']);
    expect(set.entries[0]).toMatchObject({ revision: 1, name: 'AMIDE', class: 'other' });
    expect(set.rows).toBe(3);
    expect(set.cols).toBe(1701);
    expect(set.processed).toBeInstanceOf(Float32Array);
    expect(set.processed.length).toBe(3 * 1701);
    set.entries.forEach((e, row) => {
      const view = readEntry(library, e.id);
      expect(e.hash).toBe(view.hash);
      for (let i = 0; i < set.cols; i += 37) {
        const a = set.processed[row * set.cols + i]!;
        const b = view.processed[i]!;
        if (Number.isNaN(b)) expect(Number.isNaN(a)).toBe(true);
        else expect(a).toBe(Math.fround(b));
      }
    });
  });

  it('indexes every stored peak sorted by position, each pointing at its row', () => {
    const set = readSearchSet(library);
    const total = set.entries.reduce((n, e) => n + readEntry(library, e.id).peaks.length, 0);
    expect(set.peaks.position.length).toBe(total);
    for (let k = 1; k < total; k++)
      expect(set.peaks.position[k]!).toBeGreaterThanOrEqual(set.peaks.position[k - 1]!);
    // The strongest band of each entry sits at its built-in position (±1 cm⁻¹ on the 2 cm⁻¹ grid).
    const strongest = new Map<number, { position: number; height: number }>();
    for (let k = 0; k < total; k++) {
      const row = set.peaks.entry[k]!;
      const h = set.peaks.height[k]!;
      if ((strongest.get(row)?.height ?? -1) < h)
        strongest.set(row, { position: set.peaks.position[k]!, height: h });
    }
    expect(Math.abs(strongest.get(0)!.position - 1652)).toBeLessThan(1);
    expect(Math.abs(strongest.get(1)!.position - 1035)).toBeLessThan(1);
    expect(Math.abs(strongest.get(2)!.position - 2922)).toBeLessThan(1);
  });

  it('has a state key that is stable across reads and changes with the state; a release stays frozen', () => {
    const before = readSearchSet(library);
    expect(readSearchSet(library).stateKey).toBe(before.stateKey);
    editEntry(library, 'carbo', { set: { notes: 'edited' }, author: 'fixture' });
    retireEntry(library, 'lipid', { reason: 'test', author: 'fixture' });
    const after = readSearchSet(library);
    expect(after.stateKey).not.toBe(before.stateKey);
    expect(after.entries.map((e) => [e.id, e.revision])).toEqual([
      ['amide', 1],
      ['carbo', 2],
    ]);
    const frozen = readSearchSet(library, { at: 'r1' });
    expect(frozen.at).toBe('r1');
    expect(frozen.stateKey).toBe(before.stateKey);
    expect(Array.from(frozen.processed)).toEqual(Array.from(before.processed));
    expect(listEntries(library, { at: 'r1' }).map((e) => e.id)).toEqual(['amide', 'carbo', 'lipid']);
    expect(() => readSearchSet(library, { at: 'nope' })).toThrow(/no release is tagged 'nope'/);
  });

  it('reads the same set through a second, read-only connection while nothing is locked', () => {
    const db = new Database(library.path, { readonly: true });
    expect(db.prepare('SELECT count(*) FROM revisions').pluck().get()).toBe(5);
    db.close();
  });
});

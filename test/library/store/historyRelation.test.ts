// How two histories of one entry relate, revision by revision: the rule import merges by.
import { describe, expect, it } from 'vitest';
import { historyRelation } from '../../../src/library/store/historyRelation.js';

// Hand-made record-hash lists (letters stand for hashes); the expected relations follow from the definitions.
describe('historyRelation', () => {
  it('absent, same, ahead, behind and diverged', () => {
    expect(historyRelation({ library: [], bundle: ['a'] })).toEqual({ kind: 'absent' });
    expect(historyRelation({ library: ['a', 'b'], bundle: ['a', 'b'] })).toEqual({ kind: 'same' });
    expect(historyRelation({ library: ['a', 'b', 'c'], bundle: ['a', 'b'] })).toEqual({ kind: 'ahead' });
    expect(historyRelation({ library: ['a'], bundle: ['a', 'b', 'c'] })).toEqual({ kind: 'behind', from: 1 });
    expect(historyRelation({ library: ['a', 'x'], bundle: ['a', 'b'] })).toEqual({
      kind: 'diverged',
      common: 1,
    });
    expect(historyRelation({ library: ['x'], bundle: ['a', 'b'] })).toEqual({ kind: 'diverged', common: 0 });
  });
});

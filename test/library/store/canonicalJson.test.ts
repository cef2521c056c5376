// Canonical JSON: the same value always gives the same text, whatever the key order.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { canonicalJson } from '../../../src/library/store/canonicalJson.js';

describe('canonicalJson', () => {
  it('sorts keys at every level, keeps array order and drops undefined members', () => {
    expect(canonicalJson({ b: 1, a: { d: [3, 1, { z: 0, y: null }], c: 'x' }, u: undefined })).toBe(
      '{"a":{"c":"x","d":[3,1,{"y":null,"z":0}]},"b":1}',
    );
    expect(canonicalJson([undefined, 1])).toBe('[null,1]');
    expect(canonicalJson('a"b')).toBe('"a\\"b"');
  });

  it('reads back to an equal value and does not depend on key order (seeded property test)', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (value) => {
        const text = canonicalJson(value);
        expect(JSON.parse(text)).toEqual(JSON.parse(JSON.stringify(value)));
        const shuffled = JSON.parse(JSON.stringify(value), (_k, v) =>
          v && typeof v === 'object' && !Array.isArray(v)
            ? Object.fromEntries(Object.entries(v).reverse())
            : v,
        );
        expect(canonicalJson(shuffled)).toBe(text);
      }),
      { seed: 42, numRuns: 300 },
    );
  });
});

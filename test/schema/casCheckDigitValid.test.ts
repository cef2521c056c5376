// The CAS Registry Number check digit on published numbers, wrong digits, transpositions, malformed text.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { casCheckDigitValid } from '../../src/schema/casCheckDigitValid.js';

// Published CAS Registry Numbers (from memory; each check digit recomputed by hand below with the check digit
// algorithm as published by the CAS registry: digits weighted 1, 2, 3 … from the right, sum modulo 10).
const published: [string, string][] = [
  ['water', '7732-18-5'], // 8·1 + 1·2 + 2·3 + 3·4 + 7·5 + 7·6 = 105 → 5
  ['ethanol', '64-17-5'], // 7·1 + 1·2 + 4·3 + 6·4 = 45 → 5
  ['D-glucose', '50-99-7'], // 9·1 + 9·2 + 0·3 + 5·4 = 47 → 7
  ['urea', '57-13-6'], // 3·1 + 1·2 + 7·3 + 5·4 = 46 → 6
  ['dimethyl sulfoxide', '67-68-5'], // 8·1 + 6·2 + 7·3 + 6·4 = 65 → 5
];

describe('casCheckDigitValid', () => {
  it.each(published)('accepts the published number of %s (%s)', (_name, cas) => {
    expect(casCheckDigitValid(cas)).toBe(true);
  });

  it.each(published)('rejects %s with every other check digit', (_name, cas) => {
    const body = cas.slice(0, -1);
    const right = Number(cas.slice(-1));
    for (let d = 0; d <= 9; d++) {
      if (d !== right) expect(casCheckDigitValid(`${body}${d}`)).toBe(false);
    }
  });

  it('rejects a transposition of two adjacent digits', () => {
    // 7732-81-5: 1·1 + 8·2 + 2·3 + 3·4 + 7·5 + 7·6 = 112 → 2, not 5.
    expect(casCheckDigitValid('7732-81-5')).toBe(false);
    // 46-17-5: 7 + 2 + 6·3 + 4·4 = 43 → 3, not 5.
    expect(casCheckDigitValid('46-17-5')).toBe(false);
  });

  it.each([
    ['no hyphens', '7732185'],
    ['a leading zero', '07732-18-5'],
    ['a one-digit first part', '7-18-5'],
    ['an eight-digit first part', '12345678-18-5'],
    ['a three-digit middle part', '7732-181-5'],
    ['letters', '77a2-18-5'],
    ['trailing space', '7732-18-5 '],
    ['empty', ''],
  ])('rejects %s', (_what, cas) => {
    expect(casCheckDigitValid(cas)).toBe(false);
  });

  it('trims surrounding whitespace only when asked', () => {
    expect(casCheckDigitValid(' 7732-18-5\n', { trim: true })).toBe(true);
    expect(casCheckDigitValid(' 7732-18-5\n')).toBe(false);
  });

  it('finds exactly one valid check digit for any well-formed body', () => {
    fc.assert(
      fc.property(fc.integer({ min: 10, max: 9_999_999 }), fc.integer({ min: 0, max: 99 }), (head, mid) => {
        const body = `${head}-${String(mid).padStart(2, '0')}-`;
        let valid = 0;
        for (let d = 0; d <= 9; d++) if (casCheckDigitValid(`${body}${d}`)) valid++;
        return valid === 1;
      }),
      { seed: 20240207, numRuns: 300 },
    );
  });
});

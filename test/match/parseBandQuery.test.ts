// Band positions as spectroscopists write them in a query: plain wavenumbers, with any cm⁻¹ spelling, and strengths.
import { describe, expect, it } from 'vitest';
import { parseBandQuery } from '../../src/match/parseBandQuery.js';
import { bandshelfErrorOf } from '../bandshelfErrorOf.js';

describe('parseBandQuery', () => {
  // cm⁻¹ spellings: the SI symbol and its plain-text forms (common practice).
  it.each([
    '1652',
    '1652cm-1',
    '1652 cm-1',
    '1652cm^-1',
    '1652 cm⁻¹',
    '1652cm−1',
    '1652 1/cm',
    '1652/cm',
    '1652CM-1',
  ])('%s is a band at 1652 cm⁻¹', (text) => expect(parseBandQuery(text)).toEqual({ position: 1652 }));
  it('takes a decimal position and a strength after the unit', () => {
    expect(parseBandQuery('1652.5cm-1:s')).toEqual({ position: 1652.5, strength: 's' });
    expect(parseBandQuery('1545 cm-1 : M')).toEqual({ position: 1545, strength: 'm' });
  });
  it('refuses what is not a band in cm⁻¹, naming the field', () => {
    for (const text of ['1652nm', 'amide I', '1652:x', '-1652']) {
      const error = bandshelfErrorOf(() => parseBandQuery(text, { field: 'bands' }));
      expect(error.code).toBe('BAD_OPTION');
      expect(error.field).toBe('bands');
    }
  });
});

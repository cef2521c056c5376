// A stated unit outside the readers' declared units is refused before reading.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { checkReadingUnits } from '../../src/formats/checkReadingUnits.js';

describe('checkReadingUnits', () => {
  it('accepts the declared units and no units', () => {
    expect(() => checkReadingUnits({ xUnit: 'um', yUnit: 'percent-transmittance' })).not.toThrow();
    expect(() => checkReadingUnits({})).not.toThrow();
  });
  it('refuses another unit with BAD_OPTION naming the field and file', () => {
    try {
      checkReadingUnits({ yUnit: 'reflectance' }, { file: 'a.jdx' });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(BandshelfError);
      expect((error as BandshelfError).code).toBe('BAD_OPTION');
      expect((error as BandshelfError).field).toBe('yUnit');
      expect((error as BandshelfError).file).toBe('a.jdx');
      expect((error as BandshelfError).message).toContain('absorbance, transmittance, percent-transmittance');
    }
  });
});

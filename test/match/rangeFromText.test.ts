// rangeFromText: `HIGH:LOW` in cm⁻¹, either order, as `match --range` and the matcher page take it.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { rangeFromText } from '../../src/match/rangeFromText.js';

describe('rangeFromText', () => {
  it('reads HIGH:LOW and LOW:HIGH as the same window', () => {
    // Wavenumbers written high → low as the trade writes spectra (common practice); the window is min/max either way.
    expect(rangeFromText('1800:900')).toEqual({ min: 900, max: 1800 });
    expect(rangeFromText(' 900 : 1800.5 ')).toEqual({ min: 900, max: 1800.5 });
  });

  it('refuses one number, equal ends and words with BAD_OPTION naming the field and the label', () => {
    for (const text of ['1800', '1000:1000', 'amide:900']) {
      let caught: unknown;
      try {
        rangeFromText(text, { label: 'a scoring range', field: 'ranges' });
      } catch (error) {
        caught = error;
      }
      expect(caught).toBeInstanceOf(BandshelfError);
      expect((caught as BandshelfError).oneLine()).toBe(
        `ranges: a scoring range takes two different wavenumbers as HIGH:LOW (e.g. 1800:900), not '${text}' [BAD_OPTION]`,
      );
    }
  });
});

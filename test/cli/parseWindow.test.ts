// parseWindow: HIGH:LOW in either order, refused with the flag's name otherwise.
import { describe, expect, it } from 'vitest';
import { parseWindow } from '../../src/cli/parseWindow.js';
import { bandshelfErrorOf } from '../bandshelfErrorOf.js';

describe('parseWindow', () => {
  it('reads HIGH:LOW and LOW:HIGH alike', () => {
    expect(parseWindow('2300:1900')).toEqual({ min: 1900, max: 2300 });
    expect(parseWindow(' 1700.5 : 1800 ')).toEqual({ min: 1700.5, max: 1800 });
  });

  it('refuses one number, equal ends and words, naming the flag', () => {
    for (const text of ['2300', '1800:1800', 'a:b']) {
      const error = bandshelfErrorOf(() => parseWindow(text, { flag: 'window' }));
      expect(error.code).toBe('BAD_OPTION');
      expect(error.field).toBe('window');
      expect(error.message).toMatch(/^--window takes two different wavenumbers/);
    }
  });
});

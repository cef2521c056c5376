// Tests of cropping a spectrum to one wavenumber window.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { cropToWindow } from '../../src/spectrum/cropToWindow.js';

const spectrum = (x: number[], y: number[]) => ({
  wavenumber: Float64Array.from(x),
  absorbance: Float64Array.from(y),
});

describe('cropToWindow', () => {
  const s = spectrum([900, 1000, 1100, 1200, 1300], [1, 2, 3, 4, 5]);

  it('keeps the points inside the window, both ends included', () => {
    const out = cropToWindow(s, { min: 1000, max: 1200 });
    expect(Array.from(out.wavenumber)).toEqual([1000, 1100, 1200]);
    expect(Array.from(out.absorbance)).toEqual([2, 3, 4]);
  });

  it('accepts a window written high → low', () => {
    const out = cropToWindow(s, { min: 1250, max: 950 });
    expect(Array.from(out.wavenumber)).toEqual([1000, 1100, 1200]);
  });

  it('returns a copy for a null window', () => {
    const out = cropToWindow(s, null);
    expect(Array.from(out.absorbance)).toEqual([1, 2, 3, 4, 5]);
    expect(out.absorbance).not.toBe(s.absorbance);
  });

  it('refuses a window that leaves fewer than two points, naming the file and the recipe field', () => {
    let caught: unknown;
    try {
      cropToWindow(s, { min: 1290, max: 1400 }, { file: 'x.csv' });
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(BandshelfError);
    expect((caught as BandshelfError).code).toBe('TOO_FEW_POINTS');
    expect((caught as BandshelfError).file).toBe('x.csv');
    expect((caught as BandshelfError).field).toBe('crop');
  });
});

// Tests of the normalisation step on small processed vectors checked by hand.
import { describe, expect, it } from 'vitest';
import { BandshelfError } from '../../src/error.js';
import { normaliseVector } from '../../src/spectrum/normaliseVector.js';

/** Five points 1000 … 1008 cm⁻¹. */
const grid = { start: 1008, stop: 1000, step: 2 };
const v = (...a: number[]) => Float64Array.from(a);
const rounded = (a: Float64Array) =>
  Array.from(a, (x) => (Number.isNaN(x) ? null : Math.round(x * 1e12) / 1e12));

describe('normaliseVector', () => {
  it('none returns an equal copy', () => {
    const input = v(1, 2, Number.NaN, 4, 5);
    const out = normaliseVector(input, { method: 'none' }, grid);
    expect(rounded(out)).toEqual([1, 2, null, 4, 5]);
    expect(out).not.toBe(input);
  });

  it('vector divides by the L2 norm of the finite values (3-4-12-13 triple: norm 13)', () => {
    const out = normaliseVector(v(3, Number.NaN, 4, 12, Number.NaN), { method: 'vector' }, grid);
    expect(rounded(out)).toEqual(
      [3 / 13, null, 4 / 13, 12 / 13, null].map((x) => (x === null ? null : Math.round(x * 1e12) / 1e12)),
    );
  });

  it('minmax maps the finite values onto 0 … 1', () => {
    const out = normaliseVector(v(2, 4, Number.NaN, 6, 10), { method: 'minmax' }, grid);
    expect(rounded(out)).toEqual([0, 0.25, null, 0.5, 1]);
  });

  it('area divides by the trapezoid area over neighbouring finite points', () => {
    // Neighbouring finite pairs are (1,1) and (1,3); the NaN splits 3 from 2. Area 2·1 + 2·2 = 6 (step 2).
    const out = normaliseVector(v(1, 1, 3, Number.NaN, 2), { method: 'area' }, grid);
    expect(rounded(out)).toEqual(
      [1 / 6, 1 / 6, 3 / 6, null, 2 / 6].map((x) => (x === null ? null : Math.round(x * 1e12) / 1e12)),
    );
  });

  it('area uses |area| so an inverted spectrum keeps its sign', () => {
    const out = normaliseVector(v(-1, -1, -1, -1, -1), { method: 'area' }, grid);
    // Area −8 over 1000 … 1008 cm⁻¹; divided by 8.
    expect(rounded(out)).toEqual([-0.125, -0.125, -0.125, -0.125, -0.125]);
  });

  it('band divides by the largest value inside the window (grid points 1002 … 1006)', () => {
    const out = normaliseVector(v(9, 1, 4, 2, 8), { method: 'band', window: { min: 1002, max: 1006 } }, grid);
    expect(rounded(out)).toEqual([2.25, 0.25, 1, 0.5, 2]);
  });

  it('returns an unchanged copy when the norm is zero instead of dividing by zero', () => {
    const zeros = v(0, 0, Number.NaN, 0, 0);
    for (const step of [{ method: 'vector' }, { method: 'area' }, { method: 'minmax' }] as const) {
      expect(rounded(normaliseVector(zeros, step, grid))).toEqual([0, 0, null, 0, 0]);
    }
    const flat = v(5, 5, 5, 5, 5);
    expect(rounded(normaliseVector(flat, { method: 'minmax' }, grid))).toEqual([5, 5, 5, 5, 5]);
    const uncovered = v(1, Number.NaN, Number.NaN, Number.NaN, 1);
    expect(
      rounded(normaliseVector(uncovered, { method: 'band', window: { min: 1002, max: 1006 } }, grid)),
    ).toEqual([1, null, null, null, 1]);
  });

  it('refuses a vector that is not on the grid', () => {
    expect(() => normaliseVector(v(1, 2, 3), { method: 'vector' }, grid)).toThrow(BandshelfError);
  });

  it('does not modify its input', () => {
    const input = v(3, 4, 0, 0, 0);
    normaliseVector(input, { method: 'vector' }, grid);
    expect(Array.from(input)).toEqual([3, 4, 0, 0, 0]);
  });
});

// Tests of Savitzky–Golay filtering of whole signals: published weights inside, least-squares fits at the ends.
import { describe, expect, it } from 'vitest';
import { savitzkyGolay } from '../../src/spectrum/savitzkyGolay.js';
import { mulberry32 } from '../mulberry32.js';

describe('savitzkyGolay', () => {
  it('applies the published 5-point weights −3 12 17 12 −3 / 35 inside the signal', () => {
    // Savitzky & Golay, Anal. Chem. 36:1627 (1964), corrected by Steinier, Termonia & Deltour (1972).
    const y = new Float64Array(11);
    y[5] = 35;
    const out = savitzkyGolay(y, { window: 5, order: 2 });
    // An impulse of 35 returns the integer weights around it, mirrored (they are symmetric), away from the ends.
    expect(Array.from(out.subarray(3, 8)).map((v) => Math.round(v * 1e9) / 1e9)).toEqual([
      -3, 12, 17, 12, -3,
    ]);
    for (const i of [2, 8]) expect(out[i]).toBeCloseTo(0, 12);
  });

  it('leaves a straight line unchanged, ends included (no zero padding)', () => {
    const y = Float64Array.from({ length: 20 }, (_, i) => 0.25 + 0.1 * i);
    const out = savitzkyGolay(y, { window: 9, order: 2 });
    for (let i = 0; i < y.length; i++) expect(out[i]).toBeCloseTo(y[i]!, 12);
  });

  it('keeps a quadratic exactly with a quadratic fit, ends included', () => {
    const y = Float64Array.from({ length: 15 }, (_, i) => 1 - 0.2 * i + 0.03 * i * i);
    const out = savitzkyGolay(y, { window: 7, order: 2 });
    for (let i = 0; i < y.length; i++) expect(out[i]).toBeCloseTo(y[i]!, 12);
  });

  it('gives d/dx of x = 1 and d²/dx² of x² = 2 on a real axis via delta', () => {
    const delta = 2;
    const x = Float64Array.from({ length: 30 }, (_, i) => 1000 + delta * i);
    const first = savitzkyGolay(x, { window: 9, order: 2, derivative: 1, delta });
    const squared = x.map((v) => (v - 1000) ** 2);
    const second = savitzkyGolay(squared, { window: 9, order: 3, derivative: 2, delta });
    for (let i = 0; i < x.length; i++) {
      expect(first[i]).toBeCloseTo(1, 10);
      expect(second[i]).toBeCloseTo(2, 8);
    }
  });

  it('filters each finite run separately, NaN stays NaN and a run shorter than the window is NaN', () => {
    const y = Float64Array.from([1, 2, 3, 4, 5, Number.NaN, 7, 8, 9, Number.NaN, 11, 12, 13, 14, 15, 16]);
    const out = savitzkyGolay(y, { window: 5, order: 1 });
    // Each run is a line, so a linear fit returns it exactly; nothing leaks across the gaps.
    for (const i of [0, 1, 2, 3, 4, 10, 11, 12, 13, 14, 15]) expect(out[i]).toBeCloseTo(y[i]!, 12);
    for (const i of [5, 6, 7, 8, 9]) expect(out[i]).toBeNaN();
  });

  it('lowers white noise by the expected factor (√ Σ c² of the weights)', () => {
    const rand = mulberry32(12345);
    const n = 20000;
    const y = new Float64Array(n);
    for (let i = 0; i < n; i += 1)
      y[i] = Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
    const out = savitzkyGolay(y, { window: 5, order: 2 });
    let ss = 0;
    for (let i = 2; i < n - 2; i++) ss += out[i]! ** 2;
    // (9 + 144 + 289 + 144 + 9) / 35² = 595 / 1225 = 17/35 of the variance survives (weights from the 1964 table).
    expect(ss / (n - 4)).toBeCloseTo(17 / 35, 1);
  });

  it('does not modify its input', () => {
    const y = Float64Array.from([3, 1, 4, 1, 5, 9, 2, 6, 5]);
    const copy = y.slice();
    savitzkyGolay(y, { window: 5, order: 2 });
    expect(Array.from(y)).toEqual(Array.from(copy));
  });
});

// Zero-filling lengths and the continued delay axis; the mean removal that precedes it.
import { describe, expect, it } from 'vitest';
import { removeMean } from '../../../src/spectrum/trace/removeMean.js';
import type { Trace } from '../../../src/spectrum/trace/types.js';
import { zeroFill } from '../../../src/spectrum/trace/zeroFill.js';

const trace: Trace = {
  time: Float64Array.from([10, 12, 14, 16, 18]),
  field: Float64Array.from([1, 2, 3, 4, 5]),
};

describe('zeroFill', () => {
  it('pads to the next power of two at or above factor × length and continues the delay axis', () => {
    const filled = zeroFill(trace, { factor: 2 });
    expect(filled.time.length).toBe(16); // 5 × 2 = 10 → 16
    expect(Array.from(filled.field.subarray(0, 7))).toEqual([1, 2, 3, 4, 5, 0, 0]);
    expect(filled.time[15]).toBe(10 + 15 * 2);
    expect(zeroFill(trace, { factor: 1 }).time.length).toBe(8);
    expect(zeroFill(trace, { factor: 3 }).time.length).toBe(16);
    expect(zeroFill(trace, { length: 64 }).time.length).toBe(64);
  });

  it('refuses a length that is not a power of two or is shorter than the trace', () => {
    expect(() => zeroFill(trace, { length: 12 })).toThrow(/power of two/);
    expect(() => zeroFill(trace, { length: 4 })).toThrow(/power of two/);
    expect(() => zeroFill(trace, { factor: 0 })).toThrow(/factor/);
  });
});

describe('removeMean', () => {
  it('subtracts the mean of the whole trace or of a window', () => {
    expect(Array.from(removeMean(trace).field)).toEqual([-2, -1, 0, 1, 2]);
    expect(Array.from(removeMean(trace, { window: { start: 10, end: 12 } }).field)).toEqual([
      -0.5, 0.5, 1.5, 2.5, 3.5,
    ]);
    expect(Array.from(trace.field)).toEqual([1, 2, 3, 4, 5]);
  });
});

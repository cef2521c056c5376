// The time gate on hand-checkable delays: zero outside, raised-cosine edges inside, one in the middle.
import { describe, expect, it } from 'vitest';
import { timeGate } from '../../../src/spectrum/trace/timeGate.js';
import type { Trace } from '../../../src/spectrum/trace/types.js';

const ones: Trace = {
  time: Float64Array.from({ length: 21 }, (_, i) => i),
  field: new Float64Array(21).fill(2),
};

describe('timeGate', () => {
  it('keeps [start, end] with raised-cosine edges of the given width inside it', () => {
    const gated = timeGate(ones, { start: 4, end: 16, edge: 4 }).field;
    // ½(1 − cos(π·u)) at u = 0, ¼, ½, ¾, 1 is 0, 0.1464, 0.5, 0.8536, 1 (by hand), times the field 2.
    expect(gated[3]).toBe(0);
    expect(gated[4]).toBeCloseTo(0, 12);
    expect(gated[5]).toBeCloseTo(2 * 0.1464466, 6);
    expect(gated[6]).toBeCloseTo(1, 12);
    expect(gated[7]).toBeCloseTo(2 * 0.8535534, 6);
    expect(gated[8]).toBe(2);
    expect(gated[10]).toBe(2);
    expect(gated[14]).toBeCloseTo(1, 12);
    expect(gated[16]).toBeCloseTo(0, 12);
    expect(gated[17]).toBe(0);
  });

  it('is a hard cut with no edge and leaves the input alone', () => {
    const before = ones.field.slice();
    const gated = timeGate(ones, { start: 2.5, end: 5 }).field;
    expect(Array.from(gated.subarray(0, 7))).toEqual([0, 0, 0, 2, 2, 2, 0]);
    expect(Array.from(ones.field)).toEqual(Array.from(before));
  });

  it('refuses a gate that misses the trace, runs backwards or has edges wider than half of it', () => {
    expect(() => timeGate(ones, { start: 30, end: 40 })).toThrow(/does not overlap/);
    expect(() => timeGate(ones, { start: 10, end: 5 })).toThrow(/end > start/);
    expect(() => timeGate(ones, { start: 0, end: 10, edge: 6 })).toThrow(/edge/);
  });
});

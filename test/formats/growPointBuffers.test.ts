// The point buffers the text readers grow: old points kept in place, capacity doubled, inputs untouched.
import { describe, expect, it } from 'vitest';
import { growPointBuffers } from '../../src/formats/growPointBuffers.js';

describe('growPointBuffers', () => {
  it('doubles the capacity and keeps the points already read at the front', () => {
    const before = {
      x: Float64Array.from([4000, 3998]),
      y: Float64Array.from([0.5, 0.25]),
      pointLine: Uint32Array.from([2, 3]),
    };
    const after = growPointBuffers(before);
    expect(after.x.length).toBe(4);
    expect(Array.from(after.x)).toEqual([4000, 3998, 0, 0]);
    expect(Array.from(after.y)).toEqual([0.5, 0.25, 0, 0]);
    expect(Array.from(after.pointLine)).toEqual([2, 3, 0, 0]);
    after.x[0] = 1;
    expect(before.x[0]).toBe(4000);
  });

  it('takes a larger capacity when asked and never shrinks', () => {
    const three = { x: new Float64Array(3), y: new Float64Array(3), pointLine: new Uint32Array(3) };
    expect(growPointBuffers(three, { capacity: 10 }).pointLine.length).toBe(10);
    expect(growPointBuffers(three, { capacity: 1 }).y.length).toBe(3);
    const empty = { x: new Float64Array(0), y: new Float64Array(0), pointLine: new Uint32Array(0) };
    expect(growPointBuffers(empty).x.length).toBe(1);
  });
});

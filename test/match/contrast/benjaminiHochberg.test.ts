// Benjamini–Hochberg q-values against the worked example of the original paper.
import { describe, expect, it } from 'vitest';
import { benjaminiHochberg } from '../../../src/match/contrast/benjaminiHochberg.js';

// Benjamini & Hochberg, J. R. Stat. Soc. B 57:289 (1995), section 4: fifteen p-values; at q* = 0.05 the procedure
// rejects the four smallest. The q-values below are p·m/rank with the running minimum from the top, worked by hand.
const P = [
  0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.324, 0.4262, 0.5719, 0.6528,
  0.759, 1.0,
];

describe('benjaminiHochberg', () => {
  it('rejects the four hypotheses the paper rejects at 0.05', () => {
    const q = benjaminiHochberg(P);
    expect([...q].filter((v) => v <= 0.05)).toHaveLength(4);
    expect(q[0]).toBeCloseTo(0.0015, 10);
    expect(q[3]).toBeCloseTo(0.035625, 10);
    expect(q[4]).toBeCloseTo(0.0603, 10);
    expect(q[5]).toBeCloseTo((0.0298 * 15) / 7, 10); // running minimum from the 7th
    expect(q[14]).toBe(1);
  });

  it('keeps the input order and leaves NaN out of m', () => {
    const shuffled = [P[4]!, Number.NaN, P[0]!];
    const q = benjaminiHochberg(shuffled);
    expect(q[1]).toBeNaN();
    expect(q[2]).toBeCloseTo(P[0]! * 2, 12);
    expect(q[0]).toBeCloseTo(P[4]!, 12);
  });
});

// Apodisation windows at hand-checkable points: their centre, half-way and end values.
import { describe, expect, it } from 'vitest';
import { apodise } from '../../../src/spectrum/trace/apodise.js';
import type { Trace } from '../../../src/spectrum/trace/types.js';

const flat: Trace = {
  time: Float64Array.from({ length: 41 }, (_, i) => i - 10),
  field: new Float64Array(41).fill(1),
};

describe('apodise', () => {
  it('Hann is ½(1 + cos πx): 1 at the centre, ½ half-way, 0 at the end', () => {
    const w = apodise(flat, { window: 'hann', centre: 0, halfWidth: 20 }).field;
    expect(w[10]).toBeCloseTo(1, 12);
    expect(w[20]).toBeCloseTo(0.5, 12);
    expect(w[0]).toBeCloseTo(0.5 * (1 + Math.cos(Math.PI * 0.5)), 12);
    expect(w[30]).toBeCloseTo(0, 12);
  });

  it('Happ–Genzel is 0.54 + 0.46 cos πx, ending at 0.08', () => {
    // Happ–Genzel apodisation of FT-IR (common practice).
    const w = apodise(flat, { window: 'happ-genzel', centre: 0, halfWidth: 20 }).field;
    expect(w[10]).toBeCloseTo(1, 12);
    expect(w[20]).toBeCloseTo(0.54, 12);
    expect(w[30]).toBeCloseTo(0.08, 12);
  });

  it('4-term Blackman–Harris sums to 1 at the centre and 6·10⁻⁵ at the end', () => {
    // Harris, Proc. IEEE 66:51 (1978), minimum 4-term coefficients 0.35875, 0.48829, 0.14128, 0.01168 (from memory):
    // a₀ + a₁ + a₂ + a₃ = 1 and a₀ − a₁ + a₂ − a₃ = 0.00006.
    const w = apodise(flat, { window: 'blackman-harris', centre: 0, halfWidth: 20 }).field;
    expect(w[10]).toBeCloseTo(1, 12);
    expect(w[30]).toBeCloseTo(0.00006, 12);
    expect(w[20]).toBeCloseTo(0.35875 - 0.14128, 12);
  });

  it('centres on the main pulse and reaches the far end of the record by default; none changes nothing', () => {
    const pulse: Trace = { time: flat.time, field: flat.field.map((_, i) => (i === 5 ? 8 : 1)) };
    const w = apodise(pulse, { window: 'hann' }).field;
    // Centre at t = −5 (index 5), far end t = 30 → half-width 35.
    expect(w[5]).toBeCloseTo(8, 12);
    expect(w[40]).toBeCloseTo(0, 12);
    expect(w[0]).toBeCloseTo(0.5 * (1 + Math.cos((Math.PI * 5) / 35)), 12);
    expect(Array.from(apodise(pulse, { window: 'none' }).field)).toEqual(Array.from(pulse.field));
  });
});

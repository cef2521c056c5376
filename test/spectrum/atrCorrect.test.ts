// ATR to transmission-equivalent absorbance.
import { describe, expect, it } from 'vitest';
import { atrCorrect } from '../../src/spectrum/atrCorrect.js';
import { penetrationDepth } from '../../src/spectrum/penetrationDepth.js';

describe('atrCorrect', () => {
  it('undoes an ATR weighting made with Harrick’s penetration depth (Harrick 1967)', () => {
    // Two equal bands, weighted by d_p as an ATR crystal would see them, come back equal after correction.
    const wavenumber = Float64Array.from([1000, 1500, 2000, 3000]);
    const transmission = Float64Array.from([0.5, 0.5, 0.5, 0.5]);
    const depth = (x: number) => penetrationDepth(x, { crystalIndex: 4.0 });
    const atr = transmission.map((a, i) => (a * depth(wavenumber[i]!)) / depth(1000));
    const corrected = atrCorrect({ wavenumber, absorbance: atr }, { crystal: 'ge' });
    for (let i = 0; i < 4; i++) expect(corrected.absorbance[i]).toBeCloseTo(0.5, 12);
    // The input is not modified.
    expect(atr[3]).toBeCloseTo(0.5 / 3, 12);
  });

  it('is the factor ν̃/ν̃_ref for a constant sample index, whatever the crystal (d_p ∝ λ, Harrick 1967)', () => {
    const s = { wavenumber: Float64Array.from([800, 1600]), absorbance: Float64Array.from([1, 1]) };
    for (const crystal of ['diamond', 'znse', 'ge'] as const) {
      const c = atrCorrect(s, { crystal, referenceWavenumber: 1600 });
      expect(c.absorbance[0]).toBeCloseTo(0.5, 12);
      expect(c.absorbance[1]).toBeCloseTo(1, 12);
    }
  });
});

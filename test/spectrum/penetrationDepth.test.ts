// Harrick's evanescent-wave penetration depth.
import { describe, expect, it } from 'vitest';
import { penetrationDepth } from '../../src/spectrum/penetrationDepth.js';
import { ATR_CRYSTALS } from '../../src/spectrum/types.js';

describe('penetrationDepth', () => {
  it('matches the depths tabulated from Harrick, Internal Reflection Spectroscopy (1967), at 45° and n₂ = 1.5', () => {
    // At 1000 cm⁻¹ (λ = 10 µm), sample index 1.5, 45°: Ge (n₁ = 4.0) 0.66 µm, ZnSe and diamond (n₁ = 2.4) 2.0 µm
    // (the values as commonly reproduced from Harrick's tables; from memory). By hand for Ge:
    // 10 / (2π · 4 · √(0.5 − 0.140625)) = 0.6638 µm.
    expect(penetrationDepth(1000, { crystalIndex: ATR_CRYSTALS.ge })).toBeCloseTo(0.6638, 3);
    expect(penetrationDepth(1000, { crystalIndex: ATR_CRYSTALS.ge })).toBeCloseTo(0.66, 2);
    expect(penetrationDepth(1000, { crystalIndex: ATR_CRYSTALS.znse })).toBeCloseTo(2.0, 1);
    expect(penetrationDepth(1000, { crystalIndex: ATR_CRYSTALS.diamond })).toBeCloseTo(2.005, 3);
  });

  it('grows as the wavelength (Harrick 1967: d_p ∝ λ)', () => {
    const ratio = penetrationDepth(1000) / penetrationDepth(3000);
    expect(ratio).toBeCloseTo(3, 12);
  });

  it('is NaN at or below the critical angle (no total internal reflection)', () => {
    // Critical angle for n₂/n₁ = 1.5/2.4: asin(0.625) = 38.7°, by hand.
    expect(penetrationDepth(1000, { angle: 38 })).toBeNaN();
    expect(Number.isFinite(penetrationDepth(1000, { angle: 39 }))).toBe(true);
    expect(penetrationDepth(0)).toBeNaN();
  });
});

// The instrument resolution recorded with each revision: stated, or estimated from the point spacing.
import { describe, expect, it } from 'vitest';
import { resolutionOf } from '../../src/spectrum/resolutionOf.js';

const axis = (values: number[]) => ({
  wavenumber: Float64Array.from(values),
  absorbance: new Float64Array(values.length),
});

describe('resolutionOf', () => {
  it('takes a stated resolution as it is', () => {
    expect(resolutionOf(axis([1000, 1001]), { stated: 4 })).toEqual({ value: 4, estimated: false });
  });

  it('estimates two median spacings when nothing usable is stated (Nyquist; common practice)', () => {
    // 1.9285 cm⁻¹ is the spacing of a 4 cm⁻¹ FTIR spectrum zero-filled by 2 (common practice): about 3.86 cm⁻¹.
    const x = Array.from({ length: 11 }, (_, i) => 1000 + i * 1.9285);
    for (const stated of [undefined, '4 cm-1', 0, -2, Number.NaN]) {
      const r = resolutionOf(axis(x.reverse()), { stated });
      expect(r.estimated).toBe(true);
      expect(r.value).toBeCloseTo(3.857, 3);
    }
    // The median ignores a repeated point and one wide gap.
    expect(resolutionOf(axis([1000, 1001, 1001, 1002, 1003, 1050]), { factor: 1 }).value).toBe(1);
    expect(resolutionOf(axis([1000])).value).toBeNaN();
  });
});

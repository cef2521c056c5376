// The unit a file's x values more likely are in, when read in another they miss the grid (issue example: µm read as cm⁻¹).
import { describe, expect, it } from 'vitest';
import { likelyXUnit } from '../../src/formats/likelyXUnit.js';

const grid = { min: 600, max: 4000 };

describe('likelyXUnit', () => {
  it('takes 2.5–25 read as cm⁻¹ for µm (λ = 10⁴ / ν̃: 2.5 µm is 4000 cm⁻¹, common practice)', () => {
    const r = likelyXUnit({ min: 2.5, max: 25 }, { used: 'cm-1', span: grid });
    expect(r.values).toEqual({ min: 2.5, max: 25 });
    expect(r.unit).toBe('um');
    expect(r.wavenumbers!.min).toBeCloseTo(400, 9);
    expect(r.wavenumbers!.max).toBeCloseTo(4000, 9);
  });

  it('takes 2500–16000 read as µm for nm, and gives the values in the unit they were read in', () => {
    // Read as µm, 2500 µm is 4 cm⁻¹ and 16000 µm 0.625 cm⁻¹; in nm they are 4000 and 625 cm⁻¹ (common practice).
    const r = likelyXUnit({ min: 1e4 / 16000, max: 1e4 / 2500 }, { used: 'um', span: grid });
    expect(r.values.min).toBeCloseTo(2500, 9);
    expect(r.values.max).toBeCloseTo(16000, 9);
    expect(r.unit).toBe('nm');
  });

  it('takes 20–110 read as cm⁻¹ for THz (1 THz = 33.356 cm⁻¹, common practice)', () => {
    const r = likelyXUnit({ min: 20, max: 110 }, { used: 'cm-1', span: grid });
    expect(r.unit).toBe('thz');
    expect(r.wavenumbers!.max).toBeCloseTo(110 * 33.35641, 3);
  });

  it('suggests nothing when no unit puts most of the values on the grid', () => {
    expect(likelyXUnit({ min: 0, max: 0.001 }, { used: 'cm-1', span: grid }).unit).toBeNull();
    // A far-infrared file (100–500 cm⁻¹): as THz only 5 % of it would land on the grid.
    expect(likelyXUnit({ min: 100, max: 500 }, { used: 'cm-1', span: grid }).unit).toBeNull();
  });
});

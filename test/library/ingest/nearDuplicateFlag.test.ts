// The near-duplicate warning names the difference spectrum's largest band, so one added component stays visible.
import { describe, expect, it } from 'vitest';
import { nearDuplicateFlag } from '../../../src/library/ingest/nearDuplicateFlag.js';

/** Gaussian bands [position, height, FWHM] on a 2 cm⁻¹ grid from 1800 down to 900 cm⁻¹ (ascending here). */
const axis = Float64Array.from({ length: 451 }, (_, i) => 900 + 2 * i);
function bands(list: [number, number, number][]): Float64Array {
  return axis.map((x) =>
    list.reduce((sum, [p, h, w]) => sum + h * Math.exp(-0.5 * ((x - p) / (w / 2.3548)) ** 2), 0),
  );
}

// Invented (synthetic) film: broad protein-like bands; the "drug" a narrow band at 1516 cm⁻¹ of the same height.
const film = bands([
  [1655, 1, 50],
  [1545, 0.65, 45],
  [1400, 0.25, 40],
  [1240, 0.2, 50],
  [1080, 0.3, 60],
]);
const drug = bands([[1516, 1, 8]]);
const spiked = film.map((v, i) => v + 0.03 * drug[i]!);

describe('nearDuplicateFlag', () => {
  it('warns at r > 0.999 and names the added band of the difference spectrum, where and how large', () => {
    const flag = nearDuplicateFlag(spiked, { ids: ['film'], rows: [film] }, { wavenumber: axis });
    expect(flag).not.toBeNull();
    expect(flag!.level).toBe('warning');
    expect(flag!.value).toBeGreaterThan(0.999);
    // By construction the difference is 0.03 × a band as high as the largest film band, at 1516 cm⁻¹.
    expect(flag!.message).toMatch(
      /largest band is (2\.[5-9]|3\.[0-4]) % of the largest band, at 151[4-8] cm⁻¹/,
    );
  });

  it('takes its threshold from the caller', () => {
    expect(nearDuplicateFlag(spiked, { ids: ['film'], rows: [film] }, { threshold: 0.99999 })).toBeNull();
    expect(nearDuplicateFlag(spiked, { ids: ['film'], rows: [film] }, { exclude: 'film' })).toBeNull();
  });
});

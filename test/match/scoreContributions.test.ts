// Per-region contributions to a hit's Pearson r, checked against a general-purpose correlation.
import { sampleCorrelation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { scoreContributions } from '../../src/match/scoreContributions.js';
import { gridAxis } from '../../src/spectrum/gridAxis.js';
import { mulberry32 } from '../mulberry32.js';

describe('scoreContributions', () => {
  it('splits Pearson r exactly over the regions (simple-statistics sampleCorrelation)', () => {
    const wavenumber = gridAxis({ start: 3200, stop: 700, step: 10 });
    const random = mulberry32(11);
    const unknown = Array.from(wavenumber, () => random());
    const reference = unknown.map((v) => 0.7 * v + 0.3 * random());
    reference[3] = Number.NaN; // a point the reference does not cover takes no part
    const parts = scoreContributions({ wavenumber, unknown, reference });
    const keep = unknown.map((_, i) => i).filter((i) => Number.isFinite(reference[i]!));
    const r = sampleCorrelation(
      keep.map((i) => unknown[i]!),
      keep.map((i) => reference[i]!),
    );
    expect(parts.reduce((s, p) => s + p.share, 0)).toBeCloseTo(r, 12);
    // The six default regions plus "elsewhere" (3200–3050 and 2800–1800 lie in none).
    expect(parts.map((p) => p.label)).toEqual([
      'CH stretches',
      'C=O',
      'amide I/II',
      '1500–1200',
      'C–O/phosphate',
      'below 900',
      'elsewhere',
    ]);
    expect(parts.reduce((s, p) => s + p.points, 0)).toBe(keep.length);
  });

  it('puts the whole correlation where the two spectra share their only band', () => {
    // Hand-worked: x = y = one band in 1700–1500, flat elsewhere: r = 1; the band's points carry nearly all of it.
    const wavenumber = gridAxis({ start: 2000, stop: 1000, step: 10 });
    const band = Array.from(wavenumber, (w) => Math.exp(-0.5 * ((w - 1650) / 15) ** 2));
    const parts = scoreContributions({ wavenumber, unknown: band, reference: band });
    expect(parts.reduce((s, p) => s + p.share, 0)).toBeCloseTo(1, 12);
    expect(parts.find((p) => p.label === 'amide I/II')!.share).toBeGreaterThan(0.9);
  });
});

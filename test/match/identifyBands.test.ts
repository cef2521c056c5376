// Band identification of a synthetic serum-like spectrum against the shipped assignment table.
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../src/demo/seededRandom.js';
import { buildBandIndex } from '../../src/match/buildBandIndex.js';
import { identifyBands } from '../../src/match/identifyBands.js';
import { shippedAssignments } from '../../src/match/shippedAssignments.js';
import type { PeakTable } from '../../src/match/types.js';
import { bandAssignmentSchema } from '../../src/schema/bandAssignment.js';
import { gridAxis } from '../../src/spectrum/gridAxis.js';

const axis = gridAxis({ start: 4000, stop: 600, step: 2 });

function spectrumOf(bands: [number, number, number][]): {
  wavenumber: Float64Array;
  absorbance: Float64Array;
} {
  const y = new Float64Array(axis.length);
  for (const [p, h, w] of bands) {
    const s = w / 2.3548;
    for (let i = 0; i < axis.length; i++) y[i] = y[i]! + h * Math.exp(-0.5 * ((axis[i]! - p) / s) ** 2);
  }
  return { wavenumber: axis, absorbance: y };
}

// A dried-serum-like film (synthetic): protein-dominated, some lipid and phosphate.
const serum = spectrumOf([
  [3290, 0.35, 160],
  [2958, 0.12, 18],
  [2922, 0.1, 16],
  [2852, 0.06, 12],
  [1740, 0.05, 18],
  [1652, 1, 32],
  [1545, 0.55, 30],
  [1452, 0.12, 20],
  [1398, 0.1, 22],
  [1236, 0.12, 24],
  [1080, 0.1, 26],
]);

function bandNear(bands: ReturnType<typeof identifyBands>, position: number) {
  const band = bands.find((b) => Math.abs(b.position - position) <= 2);
  expect(band, `a band near ${position}`).toBeDefined();
  return band!;
}

describe('shippedAssignments', () => {
  it('parses, and every row carries a source and a basis', () => {
    const rows = shippedAssignments();
    expect(rows.length).toBeGreaterThan(40);
    for (const row of rows) {
      expect(bandAssignmentSchema.safeParse(row).success).toBe(true);
      expect(row.source.trim().length).toBeGreaterThan(3);
      expect(['seen', 'memory']).toContain(row.basis);
      expect(row.origin).toBe('shipped');
      // The documented rule: a single published value v becomes v ± 10 cm⁻¹.
      if (row.centre !== undefined) expect([row.centre - row.min, row.max - row.centre]).toEqual([10, 10]);
    }
    // Barth (2007): amide I near 1650 cm⁻¹ is a protein band; the α-helix range 1648–1657 is kept as published.
    expect(rows.some((r) => r.label === 'amide I' && r.centre === 1650 && r.class.includes('protein'))).toBe(
      true,
    );
    expect(rows.some((r) => r.min === 1648 && r.max === 1657 && r.source.startsWith('Barth'))).toBe(true);
  });
});

describe('identifyBands', () => {
  it('assigns amide I, amide II, lipid CH₂ stretch and phosphate to the right classes', () => {
    const bands = identifyBands(serum);
    // Barth, Biochim. Biophys. Acta 1767 (2007): amide I ~1650 and amide II ~1550 are protein bands.
    const amideI = bandNear(bands, 1652);
    expect(amideI.assignments[0]!.class).toContain('protein');
    expect(amideI.assignments.some((a) => a.label === 'amide I')).toBe(true);
    const amideII = bandNear(bands, 1545);
    expect(amideII.assignments.map((a) => a.label)).toEqual(['amide II']);
    expect(amideII.assignments[0]!.class).toEqual(['protein']);
    // Movasaghi, Rehman & Rehman, Appl. Spectrosc. Rev. 43 (2008): CH₂ stretches 2922 / 2852 are lipid.
    for (const p of [2922, 2852]) {
      const band = bandNear(bands, p);
      expect(band.assignments.length).toBeGreaterThan(0);
      expect(band.assignments.every((a) => a.class.includes('lipid'))).toBe(true);
    }
    // PO₂⁻ asymmetric stretch 1230–1240: nucleic acid or phospholipid.
    const phosphate = bandNear(bands, 1236);
    expect(phosphate.assignments[0]!.label).toBe('phosphate asymmetric stretch');
    expect(phosphate.assignments[0]!.class).toEqual(['nucleic-acid', 'phospholipid']);
    expect(bandNear(bands, 1080).assignments.some((a) => a.class.includes('nucleic-acid'))).toBe(true);
    // Every assignment names its source.
    for (const band of bands) for (const a of band.assignments) expect(a.source.length).toBeGreaterThan(3);
    // High to low wavenumber; no fit given, so explained is unknown.
    expect(bands.map((b) => b.position)).toEqual([...bands.map((b) => b.position)].sort((a, b) => b - a));
    expect(bands.every((b) => b.explained === null)).toBe(true);
  });

  it('finds a shoulder on the flank of amide I', () => {
    const shouldered = spectrumOf([
      [1652, 1, 30],
      [1625, 0.35, 20],
      [1545, 0.5, 30],
    ]);
    const bands = identifyBands(shouldered);
    const shoulder = bands.find((b) => b.kind === 'shoulder' && Math.abs(b.position - 1625) <= 4);
    expect(shoulder).toBeDefined();
    // Barth (2007): 1623–1641 is the β-sheet range of amide I.
    expect(shoulder!.assignments.some((a) => a.label === 'amide I, β-sheet')).toBe(true);
  });

  it('reports one band, not a row of noise shoulders, for a broad noisy envelope', () => {
    const broad = spectrumOf([
      [3300, 0.3, 160],
      [1652, 1, 30],
    ]);
    // Seeded white noise, 0.02 % of the amide I height.
    const random = seededRandom(5);
    const absorbance = broad.absorbance.map((v) => v + 0.0002 * random.normal());
    const bands = identifyBands({ wavenumber: axis, absorbance });
    // findShoulders drops the noise minima of the broad trough itself; no filter after it is needed.
    expect(bands.filter((b) => b.position > 3000).map((b) => b.kind)).toEqual(['peak']);
    expect(bands.some((b) => Math.abs(b.position - 3300) <= 10)).toBe(true);
  });

  it('lists library entries with a band within tolerance and the mixture verdict', () => {
    const table: PeakTable = {
      entries: [
        { id: 'albumin', revision: 2, name: 'Albumin', class: 'protein' },
        { id: 'tripalmitin', revision: 1, name: 'Tripalmitin', class: 'lipid' },
      ],
      peaks: {
        entry: Uint32Array.from([0, 0, 1, 1]),
        position: Float64Array.from([1545, 1653, 1739, 2920]),
        height: Float64Array.from([0.6, 1, 1, 0.8]),
        prominence: Float64Array.from([0.6, 1, 1, 0.8]),
      },
    };
    const bands = identifyBands(serum, {
      index: buildBandIndex(table),
      mixture: {
        residualBands: [
          {
            position: 1739,
            height: 0.01,
            prominence: 0.01,
            fwhm: 18,
            width: 18,
            share: 0.02,
            localNoise: 0.001,
          },
        ],
      },
    });
    expect(bandNear(bands, 1652).candidates.map((c) => [c.id, c.revision, c.position])).toEqual([
      ['albumin', 2, 1653],
    ]);
    expect(bandNear(bands, 2922).candidates.map((c) => c.id)).toEqual(['tripalmitin']);
    expect(bandNear(bands, 1452).candidates).toEqual([]);
    expect(bandNear(bands, 1740).explained).toBe(false);
    expect(bandNear(bands, 1652).explained).toBe(true);
  });
});

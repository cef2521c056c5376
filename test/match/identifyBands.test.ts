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
      // The documented rule: a single published value v becomes v ± 10 cm⁻¹ (CO₂ keeps its P/R branches, base C=O reaches RNA's ~1698, broad bands keep a published span).
      if (
        row.centre !== undefined &&
        row.tolerance < 30 &&
        !['co2-asymmetric-stretch', 'base-c-o-stretch'].includes(row.id!)
      )
        expect([row.centre - row.min, row.max - row.centre]).toEqual([10, 10]);
      expect(row.id).toMatch(/^[a-z0-9-]+$/);
    }
    // Barth (2007): amide I near 1650 cm⁻¹ is a protein band; the α-helix range 1648–1657 is kept as published.
    expect(rows.some((r) => r.label === 'amide I' && r.centre === 1650 && r.class.includes('protein'))).toBe(
      true,
    );
    expect(rows.some((r) => r.min === 1648 && r.max === 1657 && r.source.startsWith('Barth'))).toBe(true);
  });
});

describe('corrected and added table rows, each against its published source', () => {
  const rows = shippedAssignments();
  const row = (id: string) => {
    const r = rows.find((x) => x.id === id);
    expect(r, id).toBeDefined();
    return r!;
  };
  const holds = (id: string, v: number) => {
    const r = row(id);
    return v >= r.min - r.tolerance && v <= r.max + r.tolerance;
  };
  it('ids are unique', () => {
    expect(new Set(rows.map((r) => r.id)).size).toBe(rows.length);
  });
  it('PO₂⁻ asymmetric stretch covers B-DNA ~1225 and RNA/phospholipid 1240–1250', () => {
    // Movasaghi, Rehman & Rehman, Appl. Spectrosc. Rev. 43:134 (2008).
    for (const v of [1225, 1240, 1250]) expect(holds('phosphate-asymmetric-stretch', v)).toBe(true);
    expect(row('phosphate-asymmetric-stretch').source).toMatch(/^Movasaghi/);
  });
  it('PO₂⁻ symmetric stretch and CH₂ stretches carry every class they point to', () => {
    // Movasaghi et al. (2008): ~1080 is nucleic-acid and phospholipid phosphate; CH₂ stretches come from lipid
    // acyl chains and from protein side chains.
    expect(row('phosphate-symmetric-stretch').class).toEqual(['nucleic-acid', 'phospholipid']);
    for (const id of ['ch2-asymmetric-stretch', 'ch2-symmetric-stretch'])
      expect(row(id).class).toEqual(['lipid', 'protein']);
  });
  it('CO₂ holds its 2361 cm⁻¹ branch maximum; nucleobase C=O holds RNA at ~1698', () => {
    // Herzberg (1945), CO₂ ν3 at 2349 with its R-branch maximum near 2361 (from memory).
    expect(holds('co2-asymmetric-stretch', 2361)).toBe(true);
    expect(holds('co2-asymmetric-stretch', 2349)).toBe(true);
    // Movasaghi et al. (2008): base C=O ~1715 (DNA), ~1698 (RNA).
    expect(holds('base-c-o-stretch', 1698)).toBe(true);
  });
  it('water vapour is a region flag, never a single-band assignment', () => {
    // Common practice: water-vapour lines interfere over about 1300–2000 and 3500–3900 cm⁻¹.
    const vapour = rows.filter((r) => r.group.startsWith('water vapour'));
    expect(vapour.map((r) => [r.min, r.max, r.region])).toEqual([
      [3500, 3900, true],
      [1300, 2000, true],
    ]);
  });
  it('aqueous metabolites are credited to a condensed-phase source or "from memory", not to gas-phase practice', () => {
    for (const r of rows.filter((x) => ['urea', 'lactate', 'glucose', 'citrate (urine)'].includes(x.group))) {
      expect(r.source).not.toMatch(/gas-phase/);
      expect(r.source).toMatch(/^from memory/);
    }
  });
  it('broad bands carry wider tolerances than narrow ones', () => {
    // Bertie & Lan, Appl. Spectrosc. 50:1047 (1996): the liquid-water O–H stretch is hundreds of cm⁻¹ wide.
    expect(row('water-o-h-stretch').tolerance).toBeGreaterThanOrEqual(40);
    expect(holds('water-o-h-stretch', 3404)).toBe(true);
    expect(row('amide-ii').tolerance).toBeLessThan(10);
  });
  it('has the added rows at their published positions', () => {
    // Barth (2007): unordered amide I 1642–1657; Asp/Glu COO⁻ asym. 1560–1580; COOH C=O ~1710.
    expect([row('amide-i-unordered').min, row('amide-i-unordered').max]).toEqual([1642, 1657]);
    expect(holds('asp-glu-coo-asymmetric-stretch', 1570)).toBe(true);
    expect(row('carboxylic-acid-c-o-stretch').centre).toBe(1710);
    // Movasaghi et al. (2008): CH₃ symmetric bend ~1377, ester C–O–C 1160–1175, CH₂ rock 720.
    expect(row('ch3-symmetric-bend').centre).toBe(1377);
    expect([row('ester-c-o-c-stretch').min, row('ester-c-o-c-stretch').max]).toEqual([1160, 1175]);
    expect(row('ch2-rock').centre).toBe(720);
    // From memory: citrate COO⁻ ~1580, inorganic phosphate 989/1077/1155, sulfate ~1100, thiocyanate ~2060.
    expect(row('citrate-coo-asymmetric-stretch').centre).toBe(1580);
    for (const v of [989, 1077, 1155]) expect(row(`inorganic-phosphate-${v}`).centre).toBe(v);
    expect(row('sulfate-s-o-stretch').centre).toBe(1100);
    expect(row('thiocyanate-c-n-stretch').centre).toBe(2060);
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
      expect(band.assignments[0]!.class).toContain('lipid');
    }
    // Movasaghi et al. (2008): PO₂⁻ asymmetric stretch 1220–1250, nucleic acid or phospholipid.
    const phosphate = bandNear(bands, 1236);
    expect(phosphate.assignments.map((a) => a.label)).toContain('phosphate asymmetric stretch');
    expect(phosphate.assignments.find((a) => a.label === 'phosphate asymmetric stretch')!.class).toEqual([
      'nucleic-acid',
      'phospholipid',
    ]);
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

  it('assigns a band carried by a fitted component to it and offers table rows only for the rest', () => {
    // A synthetic "drug" with a band at 1700 and amide I at 1652 from protein; the fit holds the drug only.
    const drug = spectrumOf([[1700, 1, 20]]).absorbance;
    const unknown = spectrumOf([
      [1700, 1, 20],
      [1652, 0.8, 30],
    ]);
    const bands = identifyBands(unknown, {
      mixture: {
        residualBands: [],
        components: [
          {
            id: 'drug',
            revision: 1,
            weight: 1,
            share: 1,
            shareInterval95: [1, 1],
            forced: false,
            improvement: 0.9,
            pValue: 1e-6,
            standardError: 0.01,
            interval95: [0.98, 1.02],
            significant: true,
            detectionLimit: { weight: 0.033, share: 0.03 },
          },
        ],
        baseline: null,
      },
      componentVectors: [{ id: 'drug', revision: 1, vector: drug }],
    });
    const at1700 = bandNear(bands, 1700);
    expect(at1700.assignedTo?.id).toBe('drug');
    expect(at1700.assignedTo!.share).toBeCloseTo(1, 1);
    expect(at1700.assignments).toEqual([]);
    // Barth (2007): 1652 is amide I; the drug carries almost none of it, so the table is offered.
    const at1652 = bandNear(bands, 1652);
    expect(at1652.assignedTo).toBeNull();
    expect(at1652.assignments.some((a) => a.label.startsWith('amide I'))).toBe(true);
  });

  it('flags a band among water-vapour lines but never assigns it to water vapour', () => {
    // Common practice: water-vapour lines over 1300–2000 cm⁻¹; 1604.7 is a condensed-phase ring band here.
    const bands = identifyBands(spectrumOf([[1604.7, 1, 12]]));
    const b = bandNear(bands, 1604);
    expect(b.flags.map((f) => f.id)).toEqual(['water-vapour-region-2000-1300']);
    expect(b.assignments.some((a) => a.label.includes('vapour'))).toBe(false);
  });
});
